package rdstab.solver.linear;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.ejml.data.DMatrixSparseCSC;
import rdstab.solver.error.ConvergenceException;

/**
 * Supernodal LU without row interchanges, B = A(p, p) = L U (L unit lower, U upper), on the
 * {@link CholeskySymbolic} structure of the symmetrized pattern A + Aᵀ: with static (diagonal)
 * pivots the patterns of L and Uᵀ are both contained in the Cholesky structure of A + Aᵀ, so the
 * pattern-only analysis, the supernodes and the dense panel kernels of {@link SupernodalCholesky}
 * carry over. L is stored in one m×w panel per supernode (its diagonal slots hold U's diagonal),
 * Uᵀ in a second panel of the same shape.
 *
 * <p><b>Numeric phase</b> (left-looking, as the Cholesky): for column j of supernode t and rows i ≥ j
 * of its structure, L(i,j)·U(j,j) = A(i,j) − Σ_k L(i,k) U(k,j) and U(j,i) = A(j,i) − Σ_k L(j,k) U(k,i),
 * summed over earlier columns k; the panel is then factorized densely without pivoting.
 *
 * <p><b>When it is refused.</b> Without row interchanges the factorization can be unstable even
 * when A is well conditioned. Two tests guard it, and a refusal makes the caller fall back to LU
 * with partial pivoting ({@link SparseLU}): (1) a pivot |U_jj| ≤ ε·max(n,10)·‖A‖₁ or not finite
 * (the round-off level of A's entries); (2) the a-posteriori normwise backward error of one solve
 * with a seeded random right-hand side, η = ‖b − A x‖∞ / (‖A‖∞‖x‖∞ + ‖b‖∞), must not exceed
 * {@link #BACKWARD_ERROR_LIMIT}. A stable LU gives η of order n·ε (about 1e-14 here); element
 * growth that would spoil the eigen-solve's accuracy shows up as a larger η, and one random
 * right-hand side detects it with high probability because the error of an unstable
 * factorization is not confined to a special direction.
 */
final class SupernodalLU implements SparseFactorization {

    /** Largest accepted backward error of the test solve (about 5·10⁵ ε; far above n·ε round-off, far below 1e-8). */
    static final double BACKWARD_ERROR_LIMIT = 1e-10;

    private final CholeskySymbolic sym;
    private final double[] lower;
    private final double[] upper;
    private final PanelSolve solver;

    private SupernodalLU(CholeskySymbolic sym, double[] lower, double[] upper) {
        this.sym = sym;
        this.lower = lower;
        this.upper = upper;
        this.solver = new PanelSolve(sym, lower, upper, true);
    }

    /**
     * Numeric factorization, or null when refused (a pivot at round-off level or a backward error
     * above {@link #BACKWARD_ERROR_LIMIT}): the caller then pivots.
     *
     * @param a       square matrix with the analysed pattern, not modified
     * @param sym     Cholesky analysis of A + Aᵀ's pattern
     * @param targets targets[q] = position of A's entry q in the lower (≥ 0) or upper (encoded −2 − position) panels
     */
    static SupernodalLU tryFactor(DMatrixSparseCSC a, CholeskySymbolic sym, long[] targets) {
        long total = sym.values();
        if (total > Integer.MAX_VALUE - 16) {
            return null;
        }
        double[] lo = new double[(int) total];
        double[] up = new double[(int) total];
        for (int q = 0; q < a.nz_length; q++) {
            long t = targets[q];
            if (t >= 0) {
                lo[(int) t] += a.nz_values[q];
            } else {
                up[(int) (-2 - t)] += a.nz_values[q];
            }
        }
        for (int t = 0; t < sym.supernodes; t++) {
            int m = sym.rowStart[t + 1] - sym.rowStart[t];
            int base = (int) sym.valueStart[t];
            for (int k = 0; k < sym.first[t + 1] - sym.first[t]; k++) {
                up[base + k * m + k] = lo[base + k * m + k];
            }
        }
        double threshold = PermutedFactorization.pivotThreshold(a);
        if (!PanelNumeric.run(sym, () -> new Numeric(sym, lo, up, threshold))) {
            return null;
        }
        SupernodalLU lu = new SupernodalLU(sym, lo, up);
        return lu.backwardError(a) <= BACKWARD_ERROR_LIMIT ? lu : null;
    }

    /**
     * Position of every entry of A in the panels: lower panel index for entries on or below the diagonal
     * of B = A(p, p), −2 − (upper panel index) above it (stored transposed).
     */
    static long[] targets(DMatrixSparseCSC a, CholeskySymbolic sym) {
        int n = sym.n;
        int[] pinv = SparseOps.inverse(sym.perm);
        long[] t = new long[a.nz_length];
        for (int jOld = 0; jOld < n; jOld++) {
            for (int q = a.col_idx[jOld]; q < a.col_idx[jOld + 1]; q++) {
                int i = pinv[a.nz_rows[q]];
                int j = pinv[jOld];
                boolean low = i >= j;
                int col = low ? j : i;
                int row = low ? i : j;
                int s = sym.superOf[col];
                int r0 = sym.rowStart[s];
                int m = sym.rowStart[s + 1] - r0;
                int r = Arrays.binarySearch(sym.rows, r0, r0 + m, row) - r0;
                if (r < 0) {
                    throw new IllegalStateException("entry outside the symbolic structure at (" + row + ", " + col + ")");
                }
                long pos = sym.valueStart[s] + (long) (col - sym.first[s]) * m + r;
                t[q] = low ? pos : -2 - pos;
            }
        }
        return t;
    }

    /** The numeric phase, with its scratch arrays (same descendant lists as the Cholesky). */
    private static final class Numeric extends PanelNumeric {
        private final double[] lo;
        private final double[] up;
        private final double threshold;
        private double[] accL = new double[16];
        private double[] accU = new double[16];

        Numeric(CholeskySymbolic s, double[] lo, double[] up, double threshold) {
            super(s);
            this.lo = lo;
            this.up = up;
            this.threshold = threshold;
        }

        /** Subtracts supernode d's contributions L_d U_d (its rows p1 … p2−1) to both panels of t. */
        @Override
        void update(int d, int t, int p1, int p2, int base, int m) {
            int dr0 = s.rowStart[d];
            int md = s.rowStart[d + 1] - dr0;
            int wd = s.first[d + 1] - s.first[d];
            int dbase = (int) s.valueStart[d];
            int len = md - p1;
            if (accL.length < len) {
                accL = new double[Math.max(len, 2 * accL.length)];
                accU = new double[accL.length];
            }
            int tf = s.first[t];
            for (int jj = p1; jj < p2; jj++) {
                int cnt = md - jj;
                Arrays.fill(accL, 0, cnt, 0.0);
                Arrays.fill(accU, 0, cnt, 0.0);
                for (int k = 0; k < wd; k++) {
                    int col = dbase + k * md;
                    double bu = up[col + jj];
                    double bl = lo[col + jj];
                    for (int i = 0; i < cnt; i++) {
                        accL[i] += lo[col + jj + i] * bu;
                        accU[i] += up[col + jj + i] * bl;
                    }
                }
                int target = base + (s.rows[dr0 + jj] - tf) * m;
                for (int i = 0; i < cnt; i++) {
                    int at = target + map[s.rows[dr0 + jj + i]];
                    lo[at] -= accL[i];
                    up[at] -= accU[i];
                }
            }
        }

        /** Dense right-looking LU without pivoting of the panel pair; false on a round-off-level pivot. */
        @Override
        boolean factorPanel(int base, int m, int w, int f) {
            for (int k = 0; k < w; k++) {
                int ck = base + k * m;
                double pivot = up[ck + k];
                if (!(Math.abs(pivot) > threshold) || !Double.isFinite(pivot)) {
                    return false;
                }
                lo[ck + k] = pivot;
                double inv = 1.0 / pivot;
                for (int i = k + 1; i < m; i++) {
                    lo[ck + i] *= inv;
                }
                for (int j = k + 1; j < w; j++) {
                    double ujk = up[ck + j];
                    double ljk = lo[ck + j];
                    int cj = base + j * m;
                    for (int i = j; i < m; i++) {
                        lo[cj + i] -= lo[ck + i] * ujk;
                        up[cj + i] -= up[ck + i] * ljk;
                    }
                }
            }
            return true;
        }
    }

    /** η = ‖b − A x‖∞ / (‖A‖∞‖x‖∞ + ‖b‖∞) for x = this.solve(b), b seeded random in [−1, 1]. */
    private double backwardError(DMatrixSparseCSC a) {
        int n = sym.n;
        double[] b = new double[n];
        SplittableRandom rnd = new SplittableRandom(7340033L);
        for (int i = 0; i < n; i++) {
            b[i] = rnd.nextDouble(-1.0, 1.0);
        }
        double[] x = new double[n];
        try {
            solve(b, x);
        } catch (ConvergenceException e) {
            return Double.POSITIVE_INFINITY;
        }
        double[] ax = new double[n];
        double[] rowSum = new double[n];
        SparseOps.multiply(a, x, ax);
        for (int q = 0; q < a.nz_length; q++) {
            rowSum[a.nz_rows[q]] += Math.abs(a.nz_values[q]);
        }
        double r = 0;
        double normA = 0;
        double normX = 0;
        double normB = 0;
        for (int i = 0; i < n; i++) {
            r = Math.max(r, Math.abs(b[i] - ax[i]));
            normA = Math.max(normA, rowSum[i]);
            normX = Math.max(normX, Math.abs(x[i]));
            normB = Math.max(normB, Math.abs(b[i]));
        }
        double eta = r / (normA * normX + normB);
        return Double.isNaN(eta) ? Double.POSITIVE_INFINITY : eta;
    }

    @Override
    public int size() {
        return sym.n;
    }

    /** L y = P b forward (unit diagonal), U z = y backward through the stored Uᵀ panels, x = Pᵀ z. */
    @Override
    public void solve(double[] b, double[] x) {
        solver.solve(b, x);
    }

    /** Two right-hand sides per pass over the factor. */
    @Override
    public void solve(double[][] b, double[][] x, int count) {
        solver.solve(b, x, count);
    }

    /** Non-zeros of L and U (each counted with the diagonal, as for the pivoted LU), explicit panel zeros excluded. */
    @Override
    public long nonZerosOfFactors() {
        return 2 * sym.nonZeros;
    }
}
