package rdstab.solver.sweep;

import java.util.ArrayList;
import java.util.List;

/**
 * The neutral curve of a two-parameter sweep: for each value of the first parameter, the first
 * value of the second parameter (walking from its FROM toward its TO) where the case changes from a
 * steady state with growth rate g of one sign to either the other sign or to no steady state.
 *
 * <p><b>Refinement.</b> A sign change of g between neighbouring grid values v₋, v₊ is refined by
 * linear interpolation, v₋ + g₋ (v₊ − v₋)/(g₋ − g₊): its error is O(Δv²) for a smooth g, and at
 * most the spacing. A change to "no steady state" (a fold) is placed at the midpoint of the two
 * grid values (on a log axis, their geometric mean), with half the spacing as its error bound; near
 * a fold g tends to 0 like √(distance), so interpolating g there would be biased. For a sharper
 * value call the critical-value finder at that first-parameter value.
 *
 * <p>Points that failed otherwise (not converged, bad point) interrupt the walk: the entry is
 * "undetermined" with the bracket where it happened.
 */
public final class NeutralCurve {

    /**
     * One entry of the curve.
     *
     * @param first  value of the first parameter
     * @param value  critical value of the second parameter (NaN when none or undetermined)
     * @param low    grid value before the change (NaN when none)
     * @param high   grid value after the change (NaN when none)
     * @param kind   "real crossing", "oscillatory crossing", "fold", "none in range" or "undetermined"
     */
    public record Entry(double first, double value, double low, double high, String kind) {
    }

    private NeutralCurve() {
    }

    /**
     * Computes the curve.
     *
     * @param grid      a two-parameter sweep
     * @param status    status per point number
     * @param growth    growth rate per point number (NaN when not OK)
     * @param frequency Im λ of the rightmost eigenvalue per point number (NaN when not OK)
     */
    public static List<Entry> compute(SweepGrid grid, PointStatus[] status, double[] growth, double[] frequency) {
        if (grid.axes().size() != 2) {
            throw new IllegalArgumentException("a neutral curve needs a two-parameter sweep (two --vary options)");
        }
        Axis second = grid.axes().get(1);
        int n1 = grid.axes().get(0).count();
        List<Entry> out = new ArrayList<>();
        for (int i = 0; i < n1; i++) {
            double first = grid.axes().get(0).value(i);
            out.add(line(second, i, n1, first, status, growth, frequency));
        }
        return out;
    }

    private static Entry line(Axis second, int i, int n1, double first, PointStatus[] status, double[] growth,
                              double[] frequency) {
        int j0 = 0;
        while (j0 < second.count() && status[i + n1 * j0] != PointStatus.OK) {
            j0++;
        }
        for (int j = j0 + 1; j < second.count(); j++) {
            int pm = i + n1 * (j - 1);
            int pp = i + n1 * j;
            double vm = second.value(j - 1);
            double vp = second.value(j);
            if (status[pp] == PointStatus.NO_STEADY_STATE) {
                double mid = second.log() ? Math.sqrt(vm * vp) : 0.5 * (vm + vp);
                return new Entry(first, mid, vm, vp, "fold");
            }
            if (status[pp] != PointStatus.OK) {
                return new Entry(first, Double.NaN, vm, vp, "undetermined");
            }
            double gm = growth[pm];
            double gp = growth[pp];
            if (gp == 0 || Math.signum(gm) != Math.signum(gp)) {
                double v = gp == gm ? vp : vm + gm * (vp - vm) / (gm - gp);
                double f = Math.abs(frequency[pp]) > 0 && Math.abs(frequency[pm]) > 0 ? 1 : 0;
                return new Entry(first, v, vm, vp, f > 0 ? "oscillatory crossing" : "real crossing");
            }
        }
        return new Entry(first, Double.NaN, Double.NaN, Double.NaN, j0 < second.count() ? "none in range" : "undetermined");
    }
}
