package rdstab.solver.eigen;

/**
 * Chooses an eigen-solver: dense for tiny problems (n &lt; {@link ShiftInvertArnoldi#DENSE_BELOW} or
 * when the internal Krylov count 2k + 2 does not leave room in n), the pure-Java
 * {@link ThickRestartLanczos} when options.symmetric() (no global state, so sweep threads solve in
 * parallel), shift-invert Arnoldi (ARPACK) otherwise. ARPACK's {@link ShiftInvertLanczos} stays
 * available as the cross-check of the symmetric path.
 */
public final class EigenSolvers {

    private EigenSolvers() {
    }

    /** The solver suited to a problem of order n with these options. */
    public static EigenSolver create(EigenOptions options, int n) {
        if (n < ShiftInvertArnoldi.DENSE_BELOW || 2 * options.count() + 4 > n) {
            return new DenseEigenSolver();
        }
        return options.symmetric() ? new ThickRestartLanczos() : new ShiftInvertArnoldi();
    }

    /**
     * Solves J x = λ M x for the rightmost eigenpairs with the solver {@link #create} picks. A non-symmetric J
     * with a diagonal M is first brought as close to symmetric as a diagonal similarity can
     * ({@link DiagonalScaling#symmetrizing}): same eigenvalues, computed where they are well conditioned; the
     * eigenvectors come back in the original coordinates, the residuals stay those of the scaled pencil.
     */
    public static Spectrum solve(org.ejml.data.DMatrixSparseCSC j, org.ejml.data.DMatrixSparseCSC m, EigenOptions options) {
        EigenSolver solver = create(options, j.numRows);
        if (options.symmetric() || solver instanceof DenseEigenSolver) {
            return solver.solve(j, m, options);
        }
        long t0 = System.nanoTime();
        DiagonalScaling.Symmetrized s = DiagonalScaling.symmetrize(j, m);
        double prepared = (System.nanoTime() - t0) * 1e-9;
        Spectrum sp = solver.solve(s.scaled(), m, options);
        return s.scaling().isIdentity() ? sp.plusPreparation(prepared) : sp.inOriginalCoordinates(s.scaling(), m, prepared);
    }

    /** Name of the ARPACK implementation that loads in this JVM (f2j pure Java or native JNI). */
    public static String arpackImplementation() {
        return ArpackSupport.implementationName();
    }
}
