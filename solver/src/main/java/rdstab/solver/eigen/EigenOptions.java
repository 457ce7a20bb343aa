package rdstab.solver.eigen;

/**
 * Settings for an eigen-solve. Immutable; validated on construction.
 *
 * @param count        number of rightmost eigenpairs wanted (k ≥ 1)
 * @param shift        shift σ for shift-invert; NaN = automatic (placed to the right of the spectrum)
 * @param symmetric    true when J is symmetric (the operator is self-adjoint in the M inner product):
 *                     allows Lanczos and Cholesky
 * @param tolerance    relative accuracy of the Ritz residuals; 0 = the solver's default: the unit round-off for
 *                     Arnoldi (ARPACK), 1e-10 for the symmetric Lanczos, where it already gives the
 *                     eigenvalues to round-off ({@link ThickRestartLanczos})
 * @param maxRestarts  cap on implicit restarts (ARPACK's iparam[2])
 * @param subspace     Krylov subspace size ncv; 0 = automatic (max(2k+1, 20), at most n)
 */
public record EigenOptions(int count, double shift, boolean symmetric, double tolerance, int maxRestarts, int subspace) {

    /** Default: the solver's default tolerance, 3000 restarts, automatic shift and subspace. */
    public static EigenOptions rightmost(int count, boolean symmetric) {
        return new EigenOptions(count, Double.NaN, symmetric, 0.0, 3000, 0);
    }

    public EigenOptions {
        if (count < 1) {
            throw new IllegalArgumentException("number of eigenvalues must be >= 1, got " + count);
        }
        if (tolerance < 0 || Double.isNaN(tolerance)) {
            throw new IllegalArgumentException("eigen tolerance must be >= 0, got " + tolerance);
        }
        if (maxRestarts < 1) {
            throw new IllegalArgumentException("restart cap must be >= 1, got " + maxRestarts);
        }
        if (subspace < 0) {
            throw new IllegalArgumentException("subspace size must be >= 0, got " + subspace);
        }
    }

    /** Copy with another shift. */
    public EigenOptions withShift(double s) {
        return new EigenOptions(count, s, symmetric, tolerance, maxRestarts, subspace);
    }

    /** Copy with another count. */
    public EigenOptions withCount(int k) {
        return new EigenOptions(k, shift, symmetric, tolerance, maxRestarts, subspace);
    }
}
