package rdstab.solver.formula;

/**
 * A formula that cannot be read or compiled: what kind of problem, where in the formula text it
 * was found (0-based character offset, -1 when the problem has no single place) and, in plain
 * words, what was found and what was expected.
 */
public class FormulaException extends IllegalArgumentException {

    private static final long serialVersionUID = 1L;

    /** What went wrong. */
    public enum Kind {
        /** The text does not follow the grammar (bad character, missing operand or parenthesis, ...). */
        SYNTAX,
        /** A name is neither a variable nor a given constant (reported by {@link Formula#compile}). */
        UNKNOWN_NAME,
        /** A name followed by '(' that is not one of the known functions. */
        UNKNOWN_FUNCTION,
        /** A known function called with the wrong number of arguments. */
        WRONG_ARGUMENT_COUNT,
        /** The text is longer than {@link Formula#MAX_LENGTH} characters. */
        TOO_LONG,
        /** The expression nests deeper than {@link Formula#MAX_DEPTH} levels. */
        TOO_DEEP
    }

    private final Kind kind;
    private final int position;
    private final String problem;

    /**
     * @param kind     what went wrong
     * @param position 0-based character offset into the formula text, -1 if none
     * @param problem  plain words: what was found and what was expected
     */
    public FormulaException(Kind kind, int position, String problem) {
        super(position >= 0 ? problem + " (at character " + position + ")" : problem);
        this.kind = kind;
        this.position = position;
        this.problem = problem;
    }

    /** @return what went wrong */
    public Kind kind() {
        return kind;
    }

    /** @return 0-based character offset into the formula text, -1 if the problem has no single place */
    public int position() {
        return position;
    }

    /** @return plain words, what was found and what was expected (without the position) */
    public String problem() {
        return problem;
    }
}
