package rdstab.solver.energy;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.ejml.data.DMatrixSparseCSC;
import org.junit.jupiter.api.Test;

/**
 * Peak amplification max_t ‖e^{tA}‖ against a closed form.
 *
 * <p>A = [[−1, K], [0, −2]], M = I: e^{tA} = [[e^{−t}, K(e^{−t} − e^{−2t})], [0, e^{−2t}]] (analytic, the
 * matrix exponential of a triangular matrix); its 2-norm is the largest singular value of a 2×2 matrix,
 * σ² = (s + √(s² − 4 det²))/2 with s the sum of squared entries. The reference peak is the maximum
 * over 200000 sampled t (enough for 7 digits at a smooth maximum).
 */
class TransientGrowthTest {

    static double norm(double k, double t) {
        double a = Math.exp(-t);
        double d = Math.exp(-2 * t);
        double b = k * (a - d);
        double s = a * a + b * b + d * d;
        double det = a * d;
        return Math.sqrt((s + Math.sqrt(s * s - 4 * det * det)) / 2);
    }

    static DMatrixSparseCSC matrix(double[][] v) {
        DMatrixSparseCSC m = new DMatrixSparseCSC(v.length, v.length, 4);
        for (int i = 0; i < v.length; i++) {
            for (int j = 0; j < v.length; j++) {
                if (v[i][j] != 0) {
                    m.set(i, j, v[i][j]);
                }
            }
        }
        return m;
    }

    @Test
    void nonNormalTwoByTwoPeakMatchesClosedForm() {
        double k = 10;
        double best = 0;
        double bestT = 0;
        for (int i = 1; i <= 200000; i++) {
            double t = i * 1e-5;
            double g = norm(k, t);
            if (g > best) {
                best = g;
                bestT = t;
            }
        }
        // M = diag(4, 1), J = M [[−1, K/2], [0, −2]]: A = M⁻¹J and the M-norm of e^{tA} is the 2-norm of
        // M^{1/2} e^{tA} M^{−1/2}, the same triangular exponential with K/2 scaled by √(4/1), i.e. K (analytic)
        DMatrixSparseCSC j = matrix(new double[][] {{-4, 2 * k}, {0, -2}});
        DMatrixSparseCSC m = matrix(new double[][] {{4, 0}, {0, 1}});
        // numerical abscissa: λ_max of [[−1, 5], [5, −2]] = −1.5 + √(0.25 + 25) (analytic)
        double omega = -1.5 + Math.sqrt(25.25);
        TransientGrowth.Result r = TransientGrowth.search(j, m, new double[] {1, 1}, -1.0, omega, 100000);
        // Crank–Nicolson with t/32 steps: relative error ~ (λ t/32)²/12 ≈ 1e-4 near the peak
        assertEquals(best, r.peak(), 1e-3 * best, "peak " + r.peak() + " vs " + best);
        assertEquals(bestT, r.time(), 0.03 * bestT, "peak time");
        assertTrue(best > 2.5, "the example has real transient growth: " + best);
        assertTrue(r.solves() <= 100000 && !r.budgetSpent());
    }

    @Test
    void budgetStopsTheSearchAndSaysSo() {
        DMatrixSparseCSC j = matrix(new double[][] {{-1, 10}, {0, -2}});
        DMatrixSparseCSC m = matrix(new double[][] {{1, 0}, {0, 1}});
        TransientGrowth.Result r = TransientGrowth.search(j, m, new double[] {1, 1}, -1.0, 4.0, 500);
        assertTrue(r.budgetSpent(), "budget of 500 solves is spent");
        assertTrue(r.solves() <= 500, "solves " + r.solves());
    }

    /** Energy weights change the norm: with w = (1, 4) the same flow has the amplification of S A S⁻¹, S = diag(1, 2). */
    @Test
    void weightsDefineTheNorm() {
        double k = 10;
        DMatrixSparseCSC j = matrix(new double[][] {{-1, k}, {0, -2}});
        DMatrixSparseCSC m = matrix(new double[][] {{1, 0}, {0, 1}});
        double best = 0;
        for (int i = 1; i <= 100000; i++) {
            best = Math.max(best, norm(k / 2, i * 2e-5)); // similarity by diag(1, 2) scales K by 1/2 (analytic)
        }
        double omega = -1.5 + Math.sqrt(0.25 + 6.25);
        TransientGrowth.Result r = TransientGrowth.search(j, m, new double[] {1, 4}, -1.0, omega, 100000);
        assertTrue(best > 1.2 && best < norm(k, Math.log(2)), "weighted peak lies between 1 and the unweighted one");
        assertEquals(best, r.peak(), 1e-3 * best);
    }
}
