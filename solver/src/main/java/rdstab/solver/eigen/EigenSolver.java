package rdstab.solver.eigen;

import java.util.List;
import org.ejml.data.DMatrixSparseCSC;

/**
 * Finds the rightmost eigenvalues (largest real part) of the generalized problem J x = λ M x,
 * M symmetric positive definite. Re λ &gt; 0 means growth.
 */
public interface EigenSolver {

    /**
     * @param j       operator J (n×n), not modified
     * @param m       weight matrix M (n×n, SPD), not modified
     * @param options how many, which shift, tolerances
     * @return the eigenpairs, rightmost first (ties by larger Im first, then the conjugate);
     *         a complex-conjugate pair appears as two entries
     * @throws rdstab.solver.error.ConvergenceException when fewer than the requested pairs converge
     *         (reason EIGEN_NOT_CONVERGED) or the shift is singular and cannot be moved (SINGULAR_SHIFT)
     */
    List<EigenPair> rightmost(DMatrixSparseCSC j, DMatrixSparseCSC m, EigenOptions options);

    /**
     * Same as {@link #rightmost} with the evidence: shift used, counts, certificate, timings.
     */
    Spectrum solve(DMatrixSparseCSC j, DMatrixSparseCSC m, EigenOptions options);
}
