package rdstab.solver.continuation;

import org.ejml.data.DMatrixSparseCSC;
import rdstab.solver.linear.Factorizations;
import rdstab.solver.linear.Ordering;
import rdstab.solver.linear.SparseFactorization;

/**
 * The bordered matrix of the extended (pseudo-arclength) system, assembled as one sparse CSC matrix
 * of order n + 1 and factored once by sparse LU ({@link Factorizations}, partial pivoting):
 * <pre>
 *   A = [ J    a ]      J = ∂F/∂u (n×n, sparse),  a = ∂F/∂p (dense column)
 *       [ cᵀ   d ]      c, d: the border row (the previous tangent in the scaled inner product)
 * </pre>
 * Assembling A, rather than block elimination with two solves of J, keeps the solve well conditioned
 * at a fold, where J itself is singular but A is not (for a regular turning point the border restores
 * full rank). The fill-reducing ordering is reverse Cuthill–McKee of J with the border index last, so
 * the dense row and column add O(n) fill only.
 */
final class BorderedSystem {

    private final SparseFactorization lu;
    private final int n;

    private BorderedSystem(SparseFactorization lu, int n) {
        this.lu = lu;
        this.n = n;
    }

    /**
     * Assembles and factors A.
     *
     * @throws rdstab.solver.error.ConvergenceException SINGULAR_SHIFT when A is numerically singular
     */
    static BorderedSystem factor(DMatrixSparseCSC j, double[] a, double[] c, double d) {
        int n = j.numCols;
        DMatrixSparseCSC m = new DMatrixSparseCSC(n + 1, n + 1, j.nz_length + 2 * n + 1);
        int nz = 0;
        for (int col = 0; col < n; col++) {
            m.col_idx[col] = nz;
            for (int k = j.col_idx[col]; k < j.col_idx[col + 1]; k++) {
                m.nz_rows[nz] = j.nz_rows[k];
                m.nz_values[nz++] = j.nz_values[k];
            }
            m.nz_rows[nz] = n;
            m.nz_values[nz++] = c[col];
        }
        m.col_idx[n] = nz;
        for (int i = 0; i < n; i++) {
            m.nz_rows[nz] = i;
            m.nz_values[nz++] = a[i];
        }
        m.nz_rows[nz] = n;
        m.nz_values[nz++] = d;
        m.col_idx[n + 1] = nz;
        m.nz_length = nz;
        m.indicesSorted = false;
        m.sortIndices(null);
        int[] inner = Factorizations.defaultOrdering().permutation(j);
        Ordering borderLast = x -> {
            int[] p = java.util.Arrays.copyOf(inner, n + 1);
            p[n] = n;
            return p;
        };
        return new BorderedSystem(Factorizations.factor(m, false, borderLast), n);
    }

    /**
     * Solves A (x, xp) = (b, bp).
     *
     * @return array of length n + 1: x then xp
     */
    double[] solve(double[] b, double bp) {
        double[] rhs = java.util.Arrays.copyOf(b, n + 1);
        rhs[n] = bp;
        double[] x = new double[n + 1];
        lu.solve(rhs, x);
        return x;
    }
}
