package rdstab.solver.linear;

import rdstab.solver.error.ConvergenceException;

/**
 * Triangular solves with the supernodal panels of a {@link CholeskySymbolic} structure, shared by
 * {@link SupernodalCholesky} (L y = b, Lᵀ z = y) and {@link SupernodalLU} (unit-lower L y = b, U z = y
 * with U stored as Uᵀ panels).
 *
 * <p>Panel t holds columns f..f+w−1 of a lower-triangular factor as a dense m×w column-major block whose
 * first w rows are the columns themselves (the diagonal block) and whose last m − w rows are the
 * scattered rows r_w … r_{m−1} below it. The solves run down each panel column in one loop (diagonal
 * block and rows below together): most panels are a few columns of a few dozen rows, where the loop count,
 * not the arithmetic, sets the time. Variants that split each column into its diagonal and scattered parts,
 * or combined four columns per sweep of a gathered scratch vector, measured 40–70 % slower at 512²
 * (docs/design-notes.md).
 *
 * <p>Range variants ({@code fromPanel}, {@code toPanel}) solve a contiguous run of panels: in postorder a
 * subtree of the elimination tree is such a run, so disjoint subtrees can be solved by different threads
 * (see {@link SupernodalCholesky#solve}).
 */
final class PanelSolve {

    private PanelSolve() {
    }

    /**
     * Forward substitution over panels [fromPanel, toPanel): y ← L⁻¹ y on those columns, subtracting their
     * contributions from the rows below (which may lie outside the range).
     *
     * @param unitDiagonal true for the unit-lower L of an LU (diagonal entries of the panels not used)
     */
    static void forward(CholeskySymbolic s, double[] v, double[] y, boolean unitDiagonal, int fromPanel,
                        int toPanel) {
        int[] rows = s.rows;
        for (int t = fromPanel; t < toPanel; t++) {
            int f = s.first[t];
            int w = s.first[t + 1] - f;
            int r0 = s.rowStart[t];
            int m = s.rowStart[t + 1] - r0;
            int base = (int) s.valueStart[t];
            for (int k = 0; k < w; k++) {
                int ck = base + k * m;
                double yk = unitDiagonal ? y[f + k] : y[f + k] / v[ck + k];
                y[f + k] = yk;
                for (int i = k + 1; i < m; i++) {
                    y[rows[r0 + i]] -= v[ck + i] * yk;
                }
            }
        }
    }

    /**
     * Backward substitution over panels [fromPanel, toPanel), last panel first: y ← L⁻ᵀ y on those columns,
     * reading (not writing) the already solved rows below them.
     */
    static void backward(CholeskySymbolic s, double[] v, double[] y, int fromPanel, int toPanel) {
        int[] rows = s.rows;
        for (int t = toPanel - 1; t >= fromPanel; t--) {
            int f = s.first[t];
            int w = s.first[t + 1] - f;
            int r0 = s.rowStart[t];
            int m = s.rowStart[t + 1] - r0;
            int base = (int) s.valueStart[t];
            for (int k = w - 1; k >= 0; k--) {
                int ck = base + k * m;
                double sum = y[f + k];
                for (int i = k + 1; i < m; i++) {
                    sum -= v[ck + i] * y[rows[r0 + i]];
                }
                y[f + k] = sum / v[ck + k];
            }
        }
    }

    /** {@link #forward} for two vectors at once: each panel value is loaded once for both. */
    static void forward2(CholeskySymbolic s, double[] v, double[] y, double[] z, boolean unitDiagonal) {
        int[] rows = s.rows;
        for (int t = 0; t < s.supernodes; t++) {
            int f = s.first[t];
            int w = s.first[t + 1] - f;
            int r0 = s.rowStart[t];
            int m = s.rowStart[t + 1] - r0;
            int base = (int) s.valueStart[t];
            for (int k = 0; k < w; k++) {
                int ck = base + k * m;
                double d = unitDiagonal ? 1.0 : v[ck + k];
                double yk = y[f + k] / d;
                double zk = z[f + k] / d;
                y[f + k] = yk;
                z[f + k] = zk;
                for (int i = k + 1; i < m; i++) {
                    int row = rows[r0 + i];
                    double l = v[ck + i];
                    y[row] -= l * yk;
                    z[row] -= l * zk;
                }
            }
        }
    }

    /** {@link #backward} for two vectors at once. */
    static void backward2(CholeskySymbolic s, double[] v, double[] y, double[] z) {
        int[] rows = s.rows;
        for (int t = s.supernodes - 1; t >= 0; t--) {
            int f = s.first[t];
            int w = s.first[t + 1] - f;
            int r0 = s.rowStart[t];
            int m = s.rowStart[t + 1] - r0;
            int base = (int) s.valueStart[t];
            for (int k = w - 1; k >= 0; k--) {
                int ck = base + k * m;
                double sy = y[f + k];
                double sz = z[f + k];
                for (int i = k + 1; i < m; i++) {
                    int row = rows[r0 + i];
                    double l = v[ck + i];
                    sy -= l * y[row];
                    sz -= l * z[row];
                }
                double d = v[ck + k];
                y[f + k] = sy / d;
                z[f + k] = sz / d;
            }
        }
    }

    /** y = P b: the right-hand side in the factor's (permuted) order. */
    static void permute(int[] perm, double[] b, double[] y) {
        for (int k = 0; k < y.length; k++) {
            y[k] = b[perm[k]];
        }
    }

    /**
     * x = Pᵀ y, checking that every value is finite.
     *
     * @throws ConvergenceException SINGULAR_SHIFT on a value that is not finite
     */
    static void unpermute(int[] perm, double[] y, double[] x) {
        for (int k = 0; k < y.length; k++) {
            double vk = y[k];
            if (!Double.isFinite(vk)) {
                throw new ConvergenceException(ConvergenceException.Reason.SINGULAR_SHIFT,
                        "The linear solve produced a non-finite value: the factored matrix is singular or badly scaled.",
                        -1, Double.NaN);
            }
            x[perm[k]] = vk;
        }
    }
}
