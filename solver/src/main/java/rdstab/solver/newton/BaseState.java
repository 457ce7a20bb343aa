package rdstab.solver.newton;

/**
 * A steady solution ū with F(ū) = 0 and its evidence.
 *
 * @param u                 the unknown vector (fixed-value nodes excluded)
 * @param iterations        Newton steps taken
 * @param residual          final scaled residual ‖M⁻¹F(ū)‖∞ (see {@link DampedNewton})
 * @param tolerance         the tolerance it was accepted at (after the round-off floor)
 * @param residualHistory   scaled residual before each step and after the last
 * @param route             how it was reached: "newton" (from the given guess) or "source continuation"
 */
public record BaseState(double[] u, int iterations, double residual, double tolerance, double[] residualHistory,
                        String route) {

    /** A state reached by Newton's method from the given guess. */
    public BaseState(double[] u, int iterations, double residual, double tolerance, double[] residualHistory) {
        this(u, iterations, residual, tolerance, residualHistory, "newton");
    }
}
