package rdstab.solver.formula;

import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.SortedSet;
import java.util.TreeMap;
import java.util.TreeSet;

import rdstab.solver.formula.FormulaException.Kind;

/**
 * A parsed formula such as {@code delta*exp(T/(1+eps*T))}: immutable, thread-safe.
 *
 * <p>Read it with {@link #parse}, ask which names it uses, differentiate it exactly
 * ({@link #derivative}), replace parameters by numbers ({@link #substitute}) and, for evaluation at
 * many points, {@link #compile} it. The language is described in the package documentation.
 *
 * <p>{@code pi} is a built-in constant (Math.PI), not a free name: it never appears in
 * {@link #names()}, and an entry "pi" in a constants map or variable list is ignored, so it cannot
 * be shadowed. Function names (exp, log, ...) are reserved and cannot be used as names either.
 */
public final class Formula {

    /** Longest accepted formula text, in characters; longer text fails with {@link Kind#TOO_LONG}. */
    public static final int MAX_LENGTH = 10_000;
    /** Deepest accepted nesting (parentheses, signs, calls, powers, operator chains): {@link Kind#TOO_DEEP}. */
    public static final int MAX_DEPTH = 200;
    /** The built-in constant name for Math.PI. */
    public static final String PI = "pi";

    private final String text;
    private final Node root;
    /** Each free name and the offset of its first occurrence in {@link #text}. */
    private final Map<String, Integer> firstPositions;
    private final SortedSet<String> names;

    private Formula(String text, Node root, Map<String, Integer> firstPositions) {
        this.text = text;
        this.root = root;
        this.firstPositions = firstPositions;
        this.names = Collections.unmodifiableSortedSet(new TreeSet<>(firstPositions.keySet()));
    }

    /** A formula built from a tree; its text is the printed tree. */
    private static Formula of(Node root) {
        Map<String, Integer> positions = new TreeMap<>();
        String printed = Printer.print(root, positions);
        return new Formula(printed, root, positions);
    }

    /**
     * Parses formula text.
     *
     * @param text the formula, at most {@link #MAX_LENGTH} characters
     * @return the formula, kept exactly as written (no simplification)
     * @throws FormulaException with the 0-based character position on syntax errors, unknown
     *                          functions, wrong argument counts, or when a limit is exceeded
     */
    public static Formula parse(String text) {
        Objects.requireNonNull(text, "formula text");
        Parser.Parsed p = Parser.parse(text);
        return new Formula(text, p.root, p.firstPositions);
    }

    /** @return the source text (for derived formulas: the printed form, same as {@link #toString()}) */
    public String text() {
        return text;
    }

    /** @return the free names (variables and parameters) referenced, sorted; never contains "pi" */
    public Set<String> names() {
        return names;
    }

    /**
     * @param name a free name
     * @return whether the formula references it ("pi" never counts)
     */
    public boolean references(String name) {
        return names.contains(name);
    }

    /**
     * @param name the name to differentiate by
     * @return the exact symbolic derivative, simplified (constants folded, 0*x, 1*x, x+0, ... removed);
     *         zero if the name does not occur. See the package documentation for abs, sign, min, max.
     */
    public Formula derivative(String name) {
        Objects.requireNonNull(name, "name");
        return of(Derivative.of(root, name));
    }

    /**
     * @param constants values for some or all free names (other entries are ignored)
     * @return the formula with those names replaced by numbers and every operation whose arguments
     *         are all numbers computed (constant folding only, no algebraic rewriting such as 0*x -> 0,
     *         so the values are bit for bit those of this formula)
     */
    public Formula substitute(Map<String, Double> constants) {
        Objects.requireNonNull(constants, "constants");
        return of(root.substitute(constants));
    }

    /** @return whether no free names are left */
    public boolean isConstant() {
        return names.isEmpty();
    }

    /**
     * @return the value of a constant formula
     * @throws IllegalStateException if the formula still has free names
     */
    public double constantValue() {
        if (!isConstant()) {
            throw new IllegalStateException("formula '" + text + "' is not constant; it uses " + names);
        }
        return Compiler.compile(root, Map.of()).evaluate(new double[0]);
    }

    /**
     * Compiles for fast repeated evaluation.
     *
     * @param variables names read at evaluation time: {@code variables.get(i)} is read from {@code vars[i]};
     *                  no duplicates
     * @param constants values for every other free name (extra entries are ignored; variables win)
     * @return the compiled formula, with constant parts folded (as in {@link #substitute}); its values
     *         are bit for bit those of the formula as written
     * @throws FormulaException of kind {@link Kind#UNKNOWN_NAME} at the first occurrence of a name
     *                          that is neither a variable nor a constant
     */
    public CompiledFormula compile(List<String> variables, Map<String, Double> constants) {
        Map<String, Integer> slots = new HashMap<>();
        for (int i = 0; i < variables.size(); i++) {
            if (slots.putIfAbsent(variables.get(i), i) != null) {
                throw new IllegalArgumentException("variable '" + variables.get(i) + "' listed twice in " + variables);
            }
        }
        Map<String, Double> fixed = new HashMap<>();
        for (String name : names) {
            if (slots.containsKey(name)) {
                continue;
            }
            Double v = constants.get(name);
            if (v == null) {
                throw unknownName(name, variables, constants);
            }
            fixed.put(name, v);
        }
        return Compiler.compile(root.substitute(fixed), slots);
    }

    private FormulaException unknownName(String name, List<String> variables, Map<String, Double> constants) {
        TreeSet<String> known = new TreeSet<>(variables);
        known.addAll(constants.keySet());
        known.add(PI);
        return new FormulaException(Kind.UNKNOWN_NAME, firstPositions.get(name),
                "unknown name '" + name + "'; expected one of the known names: " + String.join(", ", known));
    }

    /**
     * @return infix text that {@link #parse} reads back to a formula with identical values,
     *         parenthesised wherever grouping requires it
     */
    @Override
    public String toString() {
        return Printer.print(root, new TreeMap<>());
    }
}
