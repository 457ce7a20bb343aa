package rdstab.solver.eigen;

/**
 * Chooses an eigen-solver: dense for tiny problems (n &lt; {@link ShiftInvertArnoldi#DENSE_BELOW} or
 * when the internal Krylov count 2k + 2 does not leave room in n), shift-invert Lanczos when
 * options.symmetric(), shift-invert Arnoldi otherwise.
 */
public final class EigenSolvers {

    private EigenSolvers() {
    }

    /** The solver suited to a problem of order n with these options. */
    public static EigenSolver create(EigenOptions options, int n) {
        if (n < ShiftInvertArnoldi.DENSE_BELOW || 2 * options.count() + 4 > n) {
            return new DenseEigenSolver();
        }
        return options.symmetric() ? new ShiftInvertLanczos() : new ShiftInvertArnoldi();
    }

    /** Solves J x = λ M x for the rightmost eigenpairs with the solver {@link #create} picks. */
    public static Spectrum solve(org.ejml.data.DMatrixSparseCSC j, org.ejml.data.DMatrixSparseCSC m, EigenOptions options) {
        return create(options, j.numRows).solve(j, m, options);
    }

    /** Name of the ARPACK implementation that loads in this JVM (f2j pure Java or native JNI). */
    public static String arpackImplementation() {
        return ArpackSupport.implementationName();
    }
}
