package rdstab.solver.energy;

import org.ejml.data.DMatrixSparseCSC;
import rdstab.mesh.assembly.Discretization;

/**
 * Energy weights that tighten the a-priori bound for several fields.
 *
 * <p>With W = diag(w_f), the reaction rate ρ_max(w) = max over nodes of λ_max(½(W^{1/2} R W^{−1/2} + its
 * transpose)) depends only on the ratios of the weights (w_0 = 1 is kept). A cross-coupling R_ab, R_ba of
 * opposite signs can be balanced away completely (w_b/w_a = −R_ab/R_ba), one of equal signs reduced to
 * √(R_ab R_ba). The search: for each field f ≥ 1 in turn, a scan of log₁₀ w_f over [−4, 4] in 81 steps,
 * then golden-section refinement (40 steps) inside the best bracket; 1 sweep for two fields, 3 sweeps
 * (cyclic coordinate descent) for more. ρ_max is cheap (node-local blocks), so the search costs about
 * 120 evaluations per field and sweep. It never returns weights worse than unit weights.
 */
final class WeightSearch {

    private static final double LOG_LO = -4;
    private static final double LOG_HI = 4;
    private static final int SCAN = 81;
    private static final int GOLDEN = 40;

    private WeightSearch() {
    }

    static double[] minimiseReactionRate(Discretization d, DMatrixSparseCSC r, DMatrixSparseCSC m, int[] fieldOf) {
        int nf = d.fieldCount();
        double[] w = new double[nf];
        java.util.Arrays.fill(w, 1.0);
        double unitValue = EnergyAnalysis.nodeLocalMax(d, r, m, w);
        int sweeps = nf == 2 ? 1 : 3;
        for (int s = 0; s < sweeps; s++) {
            for (int f = 1; f < nf; f++) {
                w[f] = Math.pow(10, bestLog(d, r, m, w, f));
            }
        }
        if (EnergyAnalysis.nodeLocalMax(d, r, m, w) > unitValue) {
            java.util.Arrays.fill(w, 1.0);
        }
        return w;
    }

    private static double bestLog(Discretization d, DMatrixSparseCSC r, DMatrixSparseCSC m, double[] w, int f) {
        double step = (LOG_HI - LOG_LO) / (SCAN - 1);
        int best = 0;
        double bestValue = Double.POSITIVE_INFINITY;
        for (int i = 0; i < SCAN; i++) {
            double v = value(d, r, m, w, f, LOG_LO + i * step);
            if (v < bestValue) {
                bestValue = v;
                best = i;
            }
        }
        double a = LOG_LO + Math.max(best - 1, 0) * step;
        double b = LOG_LO + Math.min(best + 1, SCAN - 1) * step;
        double g = (Math.sqrt(5) - 1) / 2;
        double x1 = b - g * (b - a);
        double x2 = a + g * (b - a);
        double f1 = value(d, r, m, w, f, x1);
        double f2 = value(d, r, m, w, f, x2);
        for (int it = 0; it < GOLDEN; it++) {
            if (f1 <= f2) {
                b = x2;
                x2 = x1;
                f2 = f1;
                x1 = b - g * (b - a);
                f1 = value(d, r, m, w, f, x1);
            } else {
                a = x1;
                x1 = x2;
                f1 = f2;
                x2 = a + g * (b - a);
                f2 = value(d, r, m, w, f, x2);
            }
        }
        double xm = 0.5 * (a + b);
        return value(d, r, m, w, f, xm) <= bestValue ? xm : LOG_LO + best * step;
    }

    private static double value(Discretization d, DMatrixSparseCSC r, DMatrixSparseCSC m, double[] w, int f, double log) {
        double keep = w[f];
        w[f] = Math.pow(10, log);
        double v = EnergyAnalysis.nodeLocalMax(d, r, m, w);
        w[f] = keep;
        return v;
    }
}
