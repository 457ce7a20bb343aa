package rdstab.solver.verify;

import java.util.Locale;

/**
 * Observed order, Richardson extrapolation and Grid Convergence Index of one quantity from its values
 * on the three finest of a sequence of systematically refined grids.
 *
 * <h2>Formulas</h2>
 * With f1 the finest, f2 the medium and f3 the coarsest value, refinement ratios r21 = h2/h1 and
 * r32 = h3/h2 (cell-count ratios of a uniformly refined grid), ε21 = f2 − f1, ε32 = f3 − f2:
 * <pre>
 *   p      = ln(ε32/ε21) / ln r                     (constant ratio r = r21 = r32)
 *   p      = |ln|ε32/ε21| + q(p)| / ln r21,  q(p) = ln((r21^p − 1)/(r32^p − 1))
 *                                                   (unequal ratios; solved for p by bisection)
 *   f_ext  = f1 + (f1 − f2)/(r21^p − 1)
 *   GCI_fine   = Fs |ε21| / (r21^p − 1)            band of f1 (absolute, in the quantity's units)
 *   GCI_medium = Fs |ε21| r21^p / (r21^p − 1)      band of f2 (Roache's coarse-grid index of the finest pair)
 * </pre>
 * (Roache 1994, J. Fluids Eng. 116; ASME V&amp;V 20-2009; the fixed-point form for unequal ratios is that of
 * Celik et al. 2008, J. Fluids Eng. 130, 078001.) Fs = 1.25 when the observed order is accepted.
 *
 * <h2>Fallbacks (stated in {@link #note})</h2>
 * <ul>
 *   <li>ROUND_OFF: |ε21| and |ε32| both at or below the round-off floor 1e-11·max(|f1|, 1e-300): the quantity does
 *       not change with the grid (for example a base state that is exactly 0); p is undefined, f_ext = f1 and the
 *       band is the floor itself.</li>
 *   <li>OSCILLATORY: ε32/ε21 &lt; 0 (the values zig-zag), or OUT_OF_BAND: the observed p lies outside
 *       [{@link #ORDER_LOW}, {@link #ORDER_HIGH}] times the formal order: the formal order is used instead and the
 *       safety factor raised to Fs = 3 (Roache's recommendation when the observed order is not confirmed;
 *       from memory), so the band is wide and honest rather than tight and wrong.</li>
 * </ul>
 *
 * @param f1           finest value
 * @param f2           medium value
 * @param f3           coarsest value
 * @param r21          ratio h2/h1 (&gt; 1)
 * @param r32          ratio h3/h2 (&gt; 1)
 * @param observed     observed order p (NaN when undefined)
 * @param order        order used for extrapolation and GCI (observed, or the formal order on fallback)
 * @param status       how the order was obtained
 * @param safetyFactor Fs used
 * @param extrapolated Richardson-extrapolated value
 * @param gciFine      absolute band of f1
 * @param gciMedium    absolute band of f2
 * @param note         one plain sentence on the fallback, empty when the observed order was used
 */
public record RichardsonEstimate(double f1, double f2, double f3, double r21, double r32, double observed, double order,
                                 Status status, double safetyFactor, double extrapolated, double gciFine,
                                 double gciMedium, String note) {

    /** How the order used was obtained. */
    public enum Status {
        /** Observed order inside the accepted band: Fs = 1.25. */
        OBSERVED,
        /** Values zig-zag between grids: formal order, Fs = 3. */
        OSCILLATORY,
        /** Observed order outside the accepted band: formal order, Fs = 3. */
        OUT_OF_BAND,
        /** No change above round-off: no order, value taken as converged. */
        ROUND_OFF
    }

    /** Safety factor of a three-grid study whose observed order is accepted (Roache 1994; ASME V&amp;V 20). */
    public static final double FS_THREE_GRIDS = 1.25;
    /** Safety factor when the observed order is not confirmed (Roache; from memory). */
    public static final double FS_UNCONFIRMED = 3.0;
    /** Lower end of the accepted observed order, as a fraction of the formal order. */
    public static final double ORDER_LOW = 0.5;
    /** Upper end of the accepted observed order, as a multiple of the formal order. */
    public static final double ORDER_HIGH = 2.0;
    /** Relative round-off floor below which a change between grids counts as none. */
    public static final double ROUND_OFF = 1e-11;

    /**
     * Estimates from three values.
     *
     * @param f1          finest
     * @param f2          medium
     * @param f3          coarsest
     * @param r21         h2/h1 &gt; 1
     * @param r32         h3/h2 &gt; 1
     * @param formalOrder the scheme's formal order (2 for the finite volumes of the mesh module)
     */
    public static RichardsonEstimate of(double f1, double f2, double f3, double r21, double r32, double formalOrder) {
        if (!(r21 > 1) || !(r32 > 1)) {
            throw new IllegalArgumentException("refinement ratios must be > 1, got " + r21 + " and " + r32);
        }
        double e21 = f2 - f1;
        double e32 = f3 - f2;
        double floor = ROUND_OFF * Math.max(Math.max(Math.abs(f1), Math.abs(f2)), Double.MIN_NORMAL);
        if (Math.abs(e21) <= floor && Math.abs(e32) <= floor) {
            return new RichardsonEstimate(f1, f2, f3, r21, r32, Double.NaN, Double.NaN, Status.ROUND_OFF, FS_THREE_GRIDS,
                    f1, floor, floor, "no change between grids above round-off: taken as grid-independent");
        }
        double ratio = e32 / e21;
        if (!(ratio > 0) || !Double.isFinite(ratio)) {
            return fallback(f1, f2, f3, r21, r32, Double.NaN, formalOrder, Status.OSCILLATORY,
                    "the values oscillate between grids (no monotone convergence)");
        }
        double p = observedOrder(ratio, r21, r32);
        if (!(p >= ORDER_LOW * formalOrder && p <= ORDER_HIGH * formalOrder)) {
            return fallback(f1, f2, f3, r21, r32, p, formalOrder, Status.OUT_OF_BAND,
                    String.format(Locale.ROOT, "observed order %.3g is outside [%.3g, %.3g]", p,
                            ORDER_LOW * formalOrder, ORDER_HIGH * formalOrder));
        }
        return build(f1, f2, f3, r21, r32, p, p, Status.OBSERVED, FS_THREE_GRIDS, "");
    }

    private static RichardsonEstimate fallback(double f1, double f2, double f3, double r21, double r32, double p,
                                               double formal, Status s, String why) {
        String note = why + String.format(Locale.ROOT, ": the formal order %.3g is used with safety factor %.3g", formal,
                FS_UNCONFIRMED);
        return build(f1, f2, f3, r21, r32, p, formal, s, FS_UNCONFIRMED, note);
    }

    private static RichardsonEstimate build(double f1, double f2, double f3, double r21, double r32, double observed,
                                            double order, Status s, double fs, String note) {
        double rp = Math.pow(r21, order);
        double e21 = f2 - f1;
        double ext = f1 - e21 / (rp - 1);
        double gciFine = fs * Math.abs(e21) / (rp - 1);
        double gciMedium = fs * Math.abs(e21) * rp / (rp - 1);
        return new RichardsonEstimate(f1, f2, f3, r21, r32, observed, order, s, fs, ext, gciFine, gciMedium, note);
    }

    /**
     * Observed order from ε32/ε21 &gt; 0: explicit for equal ratios; for unequal ratios the root of
     * g(p) = ln(r21^p (r32^p − 1)/(r21^p − 1)) − ln(ε32/ε21), which is Celik et al.'s fixed-point equation rewritten,
     * found by bisection on [1e-6, 50] to 1e-13 (the fixed-point iteration itself converges slowly when r21 ≈ r32).
     * NaN when there is no root in that range.
     */
    static double observedOrder(double ratio, double r21, double r32) {
        if (Math.abs(r21 - r32) <= 1e-12 * r21) {
            return Math.log(ratio) / Math.log(r21);
        }
        double target = Math.log(ratio);
        double lo = 1e-6;
        double hi = 50;
        double glo = g(lo, r21, r32) - target;
        double ghi = g(hi, r21, r32) - target;
        if (glo * ghi > 0) {
            return Double.NaN;
        }
        for (int it = 0; it < 200 && hi - lo > 1e-13 * hi; it++) {
            double mid = 0.5 * (lo + hi);
            double gm = g(mid, r21, r32) - target;
            if ((gm < 0) == (glo < 0)) {
                lo = mid;
                glo = gm;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }

    private static double g(double p, double r21, double r32) {
        return p * Math.log(r21) + Math.log(Math.expm1(p * Math.log(r32)) / Math.expm1(p * Math.log(r21)));
    }

    /** True when the observed order was accepted (Fs = 1.25 and a tight band). */
    public boolean orderConfirmed() {
        return status == Status.OBSERVED;
    }
}
