package rdstab.solver.sweep;

import java.util.Locale;
import rdstab.solver.error.InputException;
import rdstab.solver.model.Case;

/**
 * One varied parameter of a sweep: COUNT values from FROM to TO, evenly spaced, or evenly spaced in
 * the logarithm ({@code log}). Both ends are hit exactly: value i is {@code from} for i = 0 and
 * {@code to} for i = count − 1 (no accumulated rounding), so two runs of the same specification
 * produce bit-identical parameter values.
 *
 * @param name  the case parameter varied
 * @param from  first value
 * @param to    last value
 * @param count number of values (≥ 1; 1 means the single value FROM)
 * @param log   true for logarithmic spacing (both ends &gt; 0)
 */
public record Axis(String name, double from, double to, int count, boolean log) {

    /** Largest number of values along one axis (a guard against typing an extra digit). */
    public static final int MAX_COUNT = 1_000_000;

    public Axis {
        String where = "--vary " + name;
        if (name == null || name.isBlank()) {
            throw new InputException("command line", "--vary", "expected NAME=FROM:TO:COUNT[:log], the name is missing");
        }
        if (!Double.isFinite(from) || !Double.isFinite(to)) {
            throw new InputException("command line", where, "FROM and TO must be finite numbers");
        }
        if (count < 1 || count > MAX_COUNT) {
            throw new InputException("command line", where, "COUNT must be 1 to " + MAX_COUNT + ", found " + count);
        }
        if (count > 1 && from == to) {
            throw new InputException("command line", where, "FROM equals TO (" + fmt(from) + ") with COUNT " + count
                    + " > 1: give two different ends or COUNT 1");
        }
        if (log && !(from > 0 && to > 0)) {
            throw new InputException("command line", where, "a log range needs FROM and TO both > 0 (found "
                    + fmt(from) + " to " + fmt(to) + "); use a linear range to cross or touch zero");
        }
    }

    /**
     * Parses {@code NAME=FROM:TO:COUNT[:log]}.
     *
     * @throws InputException one plain line naming the option and what was expected
     */
    public static Axis parse(String spec) {
        return parse(spec, null);
    }

    /**
     * Parses {@code NAME=FROM:TO:COUNT[:log]} for a case: FROM and TO may carry units ("20degC", "0.3 m") and a
     * plain number is taken in the unit the case gave the parameter (see {@link Case#parseValue}); the axis holds
     * SI values. With a null case the numbers are taken as they are.
     */
    public static Axis parse(String spec, Case c) {
        int eq = spec.indexOf('=');
        if (eq <= 0) {
            throw new InputException("command line", "--vary " + spec, "expected NAME=FROM:TO:COUNT[:log], e.g. delta=0.5:0.9:41");
        }
        String name = spec.substring(0, eq).trim();
        String[] parts = spec.substring(eq + 1).split(":", -1);
        if (parts.length < 3 || parts.length > 4) {
            throw new InputException("command line", "--vary " + spec, "expected NAME=FROM:TO:COUNT[:log], e.g. delta=0.5:0.9:41");
        }
        boolean log = false;
        if (parts.length == 4) {
            if (!parts[3].trim().equalsIgnoreCase("log")) {
                throw new InputException("command line", "--vary " + spec, "the fourth part may only be 'log', found '" + parts[3] + "'");
            }
            log = true;
        }
        int count;
        try {
            count = Integer.parseInt(parts[2].trim());
        } catch (NumberFormatException e) {
            throw new InputException("command line", "--vary " + spec, "COUNT must be a whole number, found '" + parts[2] + "'");
        }
        return new Axis(name, number(parts[0], "FROM", spec, name, c), number(parts[1], "TO", spec, name, c), count, log);
    }

    /**
     * Parses {@code NAME=FROM:TO} (a range without a count, for the critical-value finder).
     *
     * @throws InputException one plain line naming the option and what was expected
     */
    public static Axis parseRange(String spec) {
        return parseRange(spec, null);
    }

    /** Parses {@code NAME=FROM:TO} for a case, with units as in {@link #parse(String, Case)}. */
    public static Axis parseRange(String spec, Case c) {
        int eq = spec.indexOf('=');
        String[] parts = eq <= 0 ? new String[0] : spec.substring(eq + 1).split(":", -1);
        if (parts.length != 2) {
            throw new InputException("command line", "--vary " + spec, "expected NAME=FROM:TO, e.g. delta=0.5:1.2");
        }
        String name = spec.substring(0, eq).trim();
        double a = number(parts[0], "FROM", spec, name, c);
        double b = number(parts[1], "TO", spec, name, c);
        if (a == b) {
            throw new InputException("command line", "--vary " + spec, "FROM equals TO: give a range to search");
        }
        return new Axis(spec.substring(0, eq).trim(), a, b, 2, false);
    }

    private static double number(String text, String what, String spec, String name, Case c) {
        if (c != null && c.parameters().containsKey(name)) {
            double v = c.parseValue(name, text.trim());
            if (!Double.isFinite(v)) {
                throw new InputException("command line", "--vary " + spec, what + " must be a finite number, found '" + text + "'");
            }
            return v;
        }
        try {
            double v = Double.parseDouble(text.trim());
            if (!Double.isFinite(v)) {
                throw new NumberFormatException();
            }
            return v;
        } catch (NumberFormatException e) {
            throw new InputException("command line", "--vary " + spec, what + " must be a finite number, found '" + text + "'");
        }
    }

    /** Value number i (0 ≤ i &lt; count); the ends are exactly FROM and TO. */
    public double value(int i) {
        if (i < 0 || i >= count) {
            throw new IndexOutOfBoundsException("value " + i + " of " + count);
        }
        if (i == 0) {
            return from;
        }
        if (i == count - 1) {
            return to;
        }
        double t = (double) i / (count - 1);
        if (log) {
            // StrictMath: the same bits on every JVM and machine, so shards on different nodes agree
            return StrictMath.exp(StrictMath.log(from) + t * (StrictMath.log(to) - StrictMath.log(from)));
        }
        return from + t * (to - from);
    }

    /** The specification as typed: NAME=FROM:TO:COUNT[:log] (numbers in shortest round-trip form). */
    public String text() {
        return name + "=" + from + ":" + to + ":" + count + (log ? ":log" : "");
    }

    private static String fmt(double v) {
        return String.format(Locale.ROOT, "%.6g", v);
    }
}
