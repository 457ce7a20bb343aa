package rdstab.solver.linear;

/**
 * A factorization of a square sparse matrix A, computed once and reused for many right-hand sides.
 *
 * <p>Contract: {@link #solve} returns x with A x = b to the backward accuracy of the underlying
 * factorization; an output that is not finite raises
 * {@link rdstab.solver.error.ConvergenceException} with reason {@code SINGULAR_SHIFT}. Implementations
 * keep scratch arrays and are therefore not thread-safe.
 */
public interface SparseFactorization {

    /** Order n of the factored matrix. */
    int size();

    /**
     * Solves A x = b.
     *
     * @param b right-hand side, length n, not modified
     * @param x solution, length n, overwritten (may not alias {@code b})
     */
    void solve(double[] b, double[] x);

    /**
     * Solves A x_i = b_i for i &lt; count. The default solves one after the other; the supernodal factors
     * override it to stream the factor through memory once for two right-hand sides.
     *
     * @param b     right-hand sides (at least count), not modified
     * @param x     solutions, overwritten (none may alias a right-hand side)
     * @param count number of systems
     */
    default void solve(double[][] b, double[][] x, int count) {
        for (int i = 0; i < count; i++) {
            solve(b[i], x[i]);
        }
    }

    /** Number of stored non-zeros in the factors (L + U, or L), a measure of fill-in. */
    long nonZerosOfFactors();
}
