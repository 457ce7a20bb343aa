package rdstab.solver.linear;

import org.ejml.data.DMatrixRMaj;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.interfaces.linsol.LinearSolverSparse;
import org.ejml.sparse.FillReducing;
import org.ejml.sparse.csc.decomposition.chol.CholeskyUpLooking_DSCC;
import org.ejml.sparse.csc.factory.LinearSolverFactory_DSCC;
import rdstab.solver.error.ConvergenceException;

/**
 * Sparse Cholesky A(p,p) = L Lᵀ of a symmetric positive definite matrix, p a symmetric
 * {@link Ordering}. Symmetry is assumed, not checked.
 *
 * <p>Rejected ({@code SINGULAR_SHIFT}) when EJML meets a non-positive pivot (A not positive
 * definite) or when some L_ii² ≤ ε·max(n,10)·‖A‖₁ (numerically singular).
 */
public final class SparseCholesky extends PermutedFactorization {

    private final long nonZeros;

    private SparseCholesky(int n, int[] perm, LinearSolverSparse<DMatrixSparseCSC, DMatrixRMaj> solver, long nonZeros) {
        super(n, perm, solver);
        this.nonZeros = nonZeros;
    }

    /**
     * Factorizes the SPD matrix A.
     *
     * @throws ConvergenceException SINGULAR_SHIFT when A is not (numerically) positive definite
     */
    public static SparseCholesky factor(DMatrixSparseCSC a, Ordering ordering) {
        requireSquare(a);
        int n = a.numCols;
        int[] p = ordering.permutation(a);
        DMatrixSparseCSC pa = SparseOps.permuteSymmetric(a, p);
        LinearSolverSparse<DMatrixSparseCSC, DMatrixRMaj> solver = LinearSolverFactory_DSCC.cholesky(FillReducing.NONE);
        double threshold = pivotThreshold(a);
        if (!solver.setA(pa)) {
            throw new ConvergenceException(ConvergenceException.Reason.SINGULAR_SHIFT,
                    "The " + n + "x" + n + " matrix is not positive definite (Cholesky met a non-positive pivot).",
                    -1, Double.NaN);
        }
        CholeskyUpLooking_DSCC chol = solver.getDecomposition();
        DMatrixSparseCSC l = chol.getL();
        for (int j = 0; j < n; j++) {
            double d = 0.0;
            for (int q = l.col_idx[j]; q < l.col_idx[j + 1]; q++) {
                if (l.nz_rows[q] == j) {
                    d = l.nz_values[q];
                }
            }
            if (!(d * d > threshold)) {
                throw new ConvergenceException(ConvergenceException.Reason.SINGULAR_SHIFT,
                        "The " + n + "x" + n + " matrix is numerically singular (Cholesky pivot " + d * d
                                + " at or below " + threshold + ").", -1, d * d);
            }
        }
        return new SparseCholesky(n, p, solver, l.nz_length);
    }

    @Override
    public long nonZerosOfFactors() {
        return nonZeros;
    }
}
