package rdstab.solver.linear;

import java.util.Arrays;
import org.ejml.data.DMatrixSparseCSC;
import rdstab.solver.error.ConvergenceException;

/**
 * Left-looking supernodal Cholesky A(p, p) = L Lᵀ of a symmetric positive definite sparse matrix,
 * on the structure of a {@link CholeskySymbolic} analysis (computed once per pattern and ordering).
 *
 * <p><b>Numeric phase.</b> Supernodes are processed in (postorder) column order. For supernode s
 * (columns f..l, panel of m rows × w columns) the lower triangle of A's columns f..l is scattered
 * into the panel, every earlier supernode d with a row in f..l subtracts its contribution
 * L_d[rows ≥ f] · L_d[rows in f..l]ᵀ (one dense product, then a scatter through the relative row
 * map), and the panel is factorized densely: Cholesky of the w×w diagonal block and a triangular
 * solve for the rows below. Descendants are found through linked lists keyed by the next row each
 * one still has to deliver (Ng–Peyton). The dense inner loops run down contiguous panel columns.
 *
 * <p><b>Singularity.</b> A pivot d_j = L_jj² with d_j ≤ ε·max(n,10)·‖A‖₁ (ε the double machine
 * epsilon) or not finite means A is not (numerically) positive definite and raises
 * {@link ConvergenceException} with reason SINGULAR_SHIFT; the threshold is the round-off level of
 * the entries of A, below which a pivot carries no information.
 *
 * <p><b>Solve.</b> L y = P b forward and Lᵀ z = y backward by panels, x = Pᵀ z; about 4|L| flops.
 * Symmetry of A is assumed, not checked: only entries on or below the diagonal of A(p, p) are read.
 */
public final class SupernodalCholesky implements SparseFactorization {

    private final CholeskySymbolic sym;
    private final double[] values;
    private final PanelSolve solver;

    private SupernodalCholesky(CholeskySymbolic sym, double[] values) {
        this.sym = sym;
        this.values = values;
        this.solver = new PanelSolve(sym, values, values, false);
    }

    /**
     * Numeric factorization of A on a symbolic analysis of A's pattern.
     *
     * @param a   SPD matrix with exactly the pattern the analysis was made for; not modified
     * @param sym symbolic analysis
     * @throws ConvergenceException SINGULAR_SHIFT when A is not numerically positive definite
     */
    static SupernodalCholesky factor(DMatrixSparseCSC a, CholeskySymbolic sym) {
        long total = sym.values();
        if (total > Integer.MAX_VALUE - 16) {
            throw new IllegalArgumentException("the Cholesky factor would need " + total
                    + " stored values, more than one Java array holds; use a better ordering or a smaller grid");
        }
        double[] v = new double[(int) total];
        for (int q = 0; q < a.nz_length; q++) {
            long t = sym.scatter[q];
            if (t >= 0) {
                v[(int) t] += a.nz_values[q];
            }
        }
        double threshold = PermutedFactorization.pivotThreshold(a);
        PanelNumeric.run(sym, () -> new Numeric(sym, v, threshold));
        return new SupernodalCholesky(sym, v);
    }

    /** The numeric phase, with its scratch arrays. */
    private static final class Numeric extends PanelNumeric {
        private final double[] v;
        private final double threshold;
        private double[] acc = new double[16];

        Numeric(CholeskySymbolic s, double[] v, double threshold) {
            super(s);
            this.v = v;
            this.threshold = threshold;
        }

        /** Subtracts supernode d's contribution (its rows p1 … p2−1) to the panel of t. */
        @Override
        void update(int d, int t, int p1, int p2, int base, int m) {
            int dr0 = s.rowStart[d];
            int md = s.rowStart[d + 1] - dr0;
            int wd = s.first[d + 1] - s.first[d];
            int dbase = (int) s.valueStart[d];
            int len = md - p1;
            if (acc.length < len) {
                acc = new double[Math.max(len, 2 * acc.length)];
            }
            int tf = s.first[t];
            for (int jj = p1; jj < p2; jj++) {
                int cnt = md - jj;
                Arrays.fill(acc, 0, cnt, 0.0);
                for (int k = 0; k < wd; k++) {
                    int col = dbase + k * md;
                    double b = v[col + jj];
                    if (b == 0.0) {
                        continue;
                    }
                    for (int i = 0; i < cnt; i++) {
                        acc[i] += v[col + jj + i] * b;
                    }
                }
                int target = base + (s.rows[dr0 + jj] - tf) * m;
                for (int i = 0; i < cnt; i++) {
                    v[target + map[s.rows[dr0 + jj + i]]] -= acc[i];
                }
            }
        }

        /** Dense right-looking Cholesky of the m×w panel (diagonal block and the rows below). */
        @Override
        boolean factorPanel(int base, int m, int w, int f) {
            for (int k = 0; k < w; k++) {
                int ck = base + k * m;
                double pivot = v[ck + k];
                if (!(pivot > threshold) || !Double.isFinite(pivot)) {
                    throw new ConvergenceException(ConvergenceException.Reason.SINGULAR_SHIFT,
                            "The " + s.n + "x" + s.n + " matrix is not numerically positive definite (Cholesky pivot "
                                    + pivot + " at column " + (f + k) + ", threshold " + threshold + ").", -1, pivot);
                }
                double dkk = Math.sqrt(pivot);
                v[ck + k] = dkk;
                double inv = 1.0 / dkk;
                for (int i = k + 1; i < m; i++) {
                    v[ck + i] *= inv;
                }
                for (int j = k + 1; j < w; j++) {
                    double ljk = v[ck + j];
                    if (ljk == 0.0) {
                        continue;
                    }
                    int cj = base + j * m;
                    for (int i = j; i < m; i++) {
                        v[cj + i] -= v[ck + i] * ljk;
                    }
                }
            }
            return true;
        }
    }

    @Override
    public int size() {
        return sym.n;
    }

    @Override
    public void solve(double[] b, double[] x) {
        solver.solve(b, x);
    }

    /** Two right-hand sides per pass over the factor. */
    @Override
    public void solve(double[][] b, double[][] x, int count) {
        solver.solve(b, x, count);
    }

    @Override
    public long nonZerosOfFactors() {
        return sym.nonZeros;
    }

    /** Stored panel entries including the explicit zeros of relaxed supernodes (memory use is 8 bytes each). */
    public long storedValues() {
        return sym.values();
    }
}
