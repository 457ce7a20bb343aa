package rdstab.solver.error;

/**
 * Bad input: a case file, a formula, a parameter or an option. The message is one plain line that
 * names the source (file), the place (line:column or key path) and what was expected.
 */
public class InputException extends IllegalArgumentException {

    private static final long serialVersionUID = 1L;

    private final String source;
    private final String place;
    private final String problem;

    /**
     * @param source  file name or "command line" (may be null)
     * @param place   line:column or key path (may be null)
     * @param problem what is wrong and what was expected
     */
    public InputException(String source, String place, String problem) {
        super(format(source, place, problem));
        this.source = source;
        this.place = place;
        this.problem = problem;
    }

    private static String format(String source, String place, String problem) {
        StringBuilder sb = new StringBuilder();
        if (source != null && !source.isEmpty()) {
            sb.append(source);
            if (place != null && !place.isEmpty()) {
                sb.append(':').append(place);
            }
            sb.append(": ");
        } else if (place != null && !place.isEmpty()) {
            sb.append(place).append(": ");
        }
        return sb.append(problem).toString();
    }

    /** The file or other source, or null. */
    public String source() {
        return source;
    }

    /** The line:column or key path, or null. */
    public String place() {
        return place;
    }

    /** The bare problem text without source and place. */
    public String problem() {
        return problem;
    }
}
