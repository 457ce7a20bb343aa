package rdstab.solver.units;

import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import javax.measure.Dimension;
import javax.measure.MeasurementException;
import javax.measure.Unit;
import javax.measure.UnitConverter;
import tech.units.indriya.AbstractUnit;
import tech.units.indriya.format.SimpleUnitFormat;
import tech.units.indriya.unit.Units;

/**
 * Reads numbers with units such as "0.18 W/(m*K)", "25 degC", "92 kJ/mol", "0.4 m", "2e9 1/s" and
 * converts them to SI with the JSR 385 reference implementation (Indriya). The number is read by
 * Java (Indriya's own number reading drops exponents), the unit text by Indriya's unit format, after
 * a few spellings engineers type are mapped to its symbols: degC → ℃, "1/s" → "one over s",
 * "^" powers and "*" products are understood by the format itself.
 */
public final class QuantityParser {

    private static final Pattern NUMBER = Pattern.compile(
            "^\\s*([-+]?(?:\\d+\\.?\\d*|\\.\\d+)(?:[eE][-+]?\\d+)?)\\s*(.*?)\\s*$");

    private QuantityParser() {
    }

    /** A parsed quantity: the number as written, its unit (ONE when none) and the value in SI units. */
    public record Parsed(double value, Unit<?> unit, double si, String unitText) {
        /** True when the text had a unit. */
        public boolean hasUnit() {
            return !unitText.isEmpty();
        }
    }

    /**
     * Parses "number [unit]".
     *
     * @throws IllegalArgumentException with a plain message when the number or the unit cannot be read
     */
    public static Parsed parse(String text) {
        Matcher m = NUMBER.matcher(text);
        if (!m.matches()) {
            throw new IllegalArgumentException("expected a number optionally followed by a unit (e.g. '25 degC'), found '" + text + "'");
        }
        double v = Double.parseDouble(m.group(1));
        if (!Double.isFinite(v)) {
            throw new IllegalArgumentException("the number in '" + text + "' is not finite");
        }
        String ut = m.group(2);
        if (ut.isEmpty()) {
            return new Parsed(v, AbstractUnit.ONE, v, "");
        }
        Unit<?> u = unit(ut);
        double si;
        try {
            si = toSi(v, u);
        } catch (UnsupportedOperationException | ArithmeticException | MeasurementException e) {
            throw new IllegalArgumentException("unit '" + ut + "' cannot be converted to SI (an offset unit such as degC "
                    + "cannot be multiplied, divided or raised to a power)");
        }
        return new Parsed(v, u, si, ut);
    }

    /** Parses a unit text alone. */
    public static Unit<?> unit(String text) {
        String t = text.trim().replace("degC", "℃").replace("°C", "℃").replace("deg C", "℃")
                .replace("μ", "µ");
        try {
            if (t.startsWith("1/")) {
                return SimpleUnitFormat.getInstance().parse(t.substring(2).trim()).inverse();
            }
            return SimpleUnitFormat.getInstance().parse(t);
        } catch (MeasurementException | IllegalArgumentException | UnsupportedOperationException e) {
            throw new IllegalArgumentException("unknown unit '" + text + "' (examples: m, kg/m^3, W/(m*K), J/mol, kJ/mol, "
                    + "W/(m^2*K), K, degC, s, min, h, 1/s)");
        }
    }

    /** A value in the given unit, converted to the unit's SI (system) unit. */
    @SuppressWarnings({"unchecked", "rawtypes"})
    public static double toSi(double value, Unit<?> unit) {
        Unit sys = unit.getSystemUnit();
        UnitConverter c = ((Unit) unit).getConverterTo(sys);
        return c.convert(value);
    }

    /** An SI value converted to the given unit. */
    @SuppressWarnings({"unchecked", "rawtypes"})
    public static double fromSi(double si, Unit<?> unit) {
        Unit sys = unit.getSystemUnit();
        UnitConverter c = ((Unit) sys).getConverterTo(unit);
        return c.convert(si);
    }

    /** True when two units measure the same physical dimension. */
    public static boolean sameDimension(Unit<?> a, Unit<?> b) {
        return a.getDimension().equals(b.getDimension());
    }

    /** A readable dimension, e.g. "[L]·[M]/([T]³·[Θ])", or "dimensionless". */
    public static String dimensionText(Unit<?> u) {
        Dimension d = u.getDimension();
        String s = d.toString();
        return s.isEmpty() || "one".equals(s) || u.getSystemUnit().equals(AbstractUnit.ONE) ? "dimensionless" : s;
    }

    /** The kelvin, for checks of absolute temperature. */
    public static Unit<?> kelvin() {
        return Units.KELVIN;
    }

    /** A short display of a unit ("℃" shown as "°C"). */
    public static String display(Unit<?> u) {
        return u.toString().replace("℃", "°C").toLowerCase(Locale.ROOT).equals("one") ? "" : u.toString().replace("℃", "°C");
    }
}
