package rdstab.solver.linear;

import org.ejml.data.DMatrixRMaj;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.interfaces.linsol.LinearSolverSparse;
import org.ejml.sparse.FillReducing;
import org.ejml.sparse.csc.decomposition.lu.LuUpLooking_DSCC;
import org.ejml.sparse.csc.factory.LinearSolverFactory_DSCC;
import rdstab.solver.error.ConvergenceException;

/**
 * Sparse LU with partial (row) pivoting of a general square matrix, P_r A(p,p) = L U, where p is
 * the symmetric fill-reducing {@link Ordering} and P_r EJML's row pivoting.
 *
 * <p>Singularity test: the factorization is rejected ({@code SINGULAR_SHIFT}) when EJML reports it
 * singular or when some |U_ii| ≤ ε·max(n,10)·‖A‖₁ (ε the double machine epsilon) or is not finite.
 */
public final class SparseLU extends PermutedFactorization {

    private final long nonZeros;
    private final double smallestPivot;

    private SparseLU(int n, int[] perm, LinearSolverSparse<DMatrixSparseCSC, DMatrixRMaj> solver,
                     long nonZeros, double smallestPivot) {
        super(n, perm, solver);
        this.nonZeros = nonZeros;
        this.smallestPivot = smallestPivot;
    }

    /**
     * Factorizes A.
     *
     * @param a        square matrix, not modified
     * @param ordering symmetric fill-reducing permutation
     * @throws ConvergenceException SINGULAR_SHIFT when A is numerically singular
     */
    public static SparseLU factor(DMatrixSparseCSC a, Ordering ordering) {
        requireSquare(a);
        int[] p = ordering.permutation(a);
        return factorPermuted(a, p, SparseOps.permuteSymmetric(a, p));
    }

    /** Numeric LU of pa = A(p, p), already permuted (the symbolic part of EJML's LU depends on pivots and is redone). */
    static SparseLU factorPermuted(DMatrixSparseCSC a, int[] p, DMatrixSparseCSC pa) {
        int n = a.numCols;
        LinearSolverSparse<DMatrixSparseCSC, DMatrixRMaj> solver = LinearSolverFactory_DSCC.lu(FillReducing.NONE);
        boolean ok = solver.setA(pa);
        LuUpLooking_DSCC lu = solver.getDecomposition();
        double threshold = pivotThreshold(a);
        if (!ok || lu.isSingular()) {
            throw singular(n, 0.0, threshold);
        }
        DMatrixSparseCSC u = lu.getU();
        double smallest = Double.POSITIVE_INFINITY;
        for (int j = 0; j < n; j++) {
            double d = 0.0;
            for (int q = u.col_idx[j]; q < u.col_idx[j + 1]; q++) {
                if (u.nz_rows[q] == j) {
                    d = u.nz_values[q];
                }
            }
            double ad = Math.abs(d);
            if (!(ad > threshold)) {
                throw singular(n, ad, threshold);
            }
            smallest = Math.min(smallest, ad);
        }
        long nnz = (long) lu.getL().nz_length + u.nz_length;
        return new SparseLU(n, p, solver, nnz, n == 0 ? 0.0 : smallest);
    }

    private static ConvergenceException singular(int n, double pivot, double threshold) {
        return new ConvergenceException(ConvergenceException.Reason.SINGULAR_SHIFT,
                "The " + n + "x" + n + " matrix is numerically singular (pivot " + pivot
                        + " at or below the threshold " + threshold + ").", -1, pivot);
    }

    @Override
    public long nonZerosOfFactors() {
        return nonZeros;
    }

    /** Smallest |U_ii|, a cheap (optimistic) indicator of conditioning. */
    public double smallestPivot() {
        return smallestPivot;
    }
}
