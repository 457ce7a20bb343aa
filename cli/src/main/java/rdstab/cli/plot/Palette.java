package rdstab.cli.plot;

import java.awt.Color;

/**
 * Colour maps and line colours for the plots, all chosen to stay readable for colour-blind readers and in
 * grey-scale print.
 *
 * <ul>
 *   <li>{@link #SEQUENTIAL}: viridis (matplotlib's default map, released CC0), ten evenly spaced samples
 *       (from memory); perceptually uniform, for base states and growth maps of one sign.</li>
 *   <li>{@link #DIVERGING}: ColorBrewer "RdBu", nine classes, reversed so negative is blue, zero white and positive
 *       red (from memory); for modes and signed growth rates with zero in the middle.</li>
 *   <li>{@link #LINES}: the Okabe–Ito colours for categorical lines, black first.</li>
 * </ul>
 * The heat-map facility interpolates linearly between the stops.
 */
public final class Palette {

    /** viridis, dark purple (low) to yellow (high). */
    public static final Color[] SEQUENTIAL = hex("440154", "482878", "3e4989", "31688e", "26828e", "1f9e89", "35b779",
            "6ece58", "b5de2b", "fde725");

    /** blue (negative) – white (zero) – red (positive). */
    public static final Color[] DIVERGING = hex("2166ac", "4393c3", "92c5de", "d1e5f0", "f7f7f7", "fddbc7", "f4a582",
            "d6604d", "b2182b");

    /** Okabe–Ito categorical colours: blue, vermillion, bluish green, reddish purple, orange, sky blue, black. */
    public static final Color[] LINES = hex("0072b2", "d55e00", "009e73", "cc79a7", "e69f00", "56b4e9", "000000");

    /** Light fill for stable ranges (sky blue, translucent). */
    public static final Color STABLE_FILL = new Color(0x56, 0xb4, 0xe9, 70);

    /** Light fill for unstable ranges (vermillion, translucent). */
    public static final Color UNSTABLE_FILL = new Color(0xd5, 0x5e, 0x00, 70);

    private Palette() {
    }

    /** The colour of a map at t ∈ [0, 1] by linear interpolation between its stops (t is clamped). */
    public static Color at(Color[] map, double t) {
        double s = Math.max(0, Math.min(1, t)) * (map.length - 1);
        int i = Math.min((int) Math.floor(s), map.length - 2);
        double f = s - i;
        Color a = map[i];
        Color b = map[i + 1];
        return new Color(mix(a.getRed(), b.getRed(), f), mix(a.getGreen(), b.getGreen(), f), mix(a.getBlue(), b.getBlue(), f));
    }

    /** Line colour number k (cycles). */
    public static Color line(int k) {
        return LINES[Math.floorMod(k, LINES.length)];
    }

    private static int mix(int a, int b, double f) {
        return (int) Math.round(a + (b - a) * f);
    }

    private static Color[] hex(String... codes) {
        Color[] c = new Color[codes.length];
        for (int i = 0; i < codes.length; i++) {
            c[i] = new Color(Integer.parseInt(codes[i], 16));
        }
        return c;
    }
}
