package rdstab.solver.linear;

import org.ejml.data.DMatrixRMaj;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.interfaces.linsol.LinearSolverSparse;

/**
 * Shared solve path: b is permuted into the ordering, the EJML solver runs on A(p, p), the result is
 * permuted back and checked for finiteness.
 */
abstract class PermutedFactorization implements SparseFactorization {

    /** A pivot below {@code PIVOT_RELATIVE_TOLERANCE · max(n, 10) · ‖A‖₁} counts as zero. */
    static final double PIVOT_RELATIVE_TOLERANCE = 2.220446049250313e-16;

    private final int n;
    private final int[] perm;
    private final LinearSolverSparse<DMatrixSparseCSC, DMatrixRMaj> solver;
    private final DMatrixRMaj rhs;
    private final DMatrixRMaj sol;

    PermutedFactorization(int n, int[] perm, LinearSolverSparse<DMatrixSparseCSC, DMatrixRMaj> solver) {
        this.n = n;
        this.perm = perm;
        this.solver = solver;
        this.rhs = new DMatrixRMaj(n, 1);
        this.sol = new DMatrixRMaj(n, 1);
    }

    static double pivotThreshold(DMatrixSparseCSC a) {
        return PIVOT_RELATIVE_TOLERANCE * Math.max(a.numCols, 10) * SparseOps.norm1(a);
    }

    static void requireSquare(DMatrixSparseCSC a) {
        if (a.numRows != a.numCols) {
            throw new IllegalArgumentException("matrix must be square, got " + a.numRows + "x" + a.numCols);
        }
    }

    @Override
    public int size() {
        return n;
    }

    @Override
    public void solve(double[] b, double[] x) {
        PanelSolve.permute(perm, b, rhs.data);
        solver.solve(rhs, sol);
        PanelSolve.unpermute(perm, sol.data, x);
    }
}
