package rdstab.solver.error;

/**
 * A numerical method did not reach its stated tolerance. Carries why, after how many iterations,
 * the last residual, and (when known) the parameter value at which it happened.
 */
public class ConvergenceException extends RuntimeException {

    private static final long serialVersionUID = 1L;

    /** Why a method stopped without a result. */
    public enum Reason {
        /** Iteration cap reached with the residual above tolerance. */
        MAX_ITERATIONS,
        /** The residual grew and damping could not bring it down. */
        DIVERGED,
        /** A NaN or infinity appeared. */
        NOT_FINITE,
        /** The shifted operator could not be factorized (shift on an eigenvalue, or singular J). */
        SINGULAR_SHIFT,
        /** No steady state was found (for example beyond a fold). */
        NO_STEADY_STATE,
        /** The eigen-solver converged fewer eigenpairs than requested. */
        EIGEN_NOT_CONVERGED
    }

    private final Reason reason;
    private final int iterations;
    private final double lastResidual;

    /**
     * @param reason       why it stopped
     * @param message      one plain sentence for the user
     * @param iterations   iterations done (−1 when not applicable)
     * @param lastResidual last residual norm (NaN when not applicable)
     */
    public ConvergenceException(Reason reason, String message, int iterations, double lastResidual) {
        super(message);
        this.reason = reason;
        this.iterations = iterations;
        this.lastResidual = lastResidual;
    }

    /** Same with a cause. */
    public ConvergenceException(Reason reason, String message, int iterations, double lastResidual, Throwable cause) {
        super(message, cause);
        this.reason = reason;
        this.iterations = iterations;
        this.lastResidual = lastResidual;
    }

    /** Why it stopped. */
    public Reason reason() {
        return reason;
    }

    /** Iterations done, or −1. */
    public int iterations() {
        return iterations;
    }

    /** Last residual, or NaN. */
    public double lastResidual() {
        return lastResidual;
    }
}
