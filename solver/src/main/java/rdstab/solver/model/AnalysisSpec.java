package rdstab.solver.model;

/**
 * Analysis options with their defaults; every tolerance is stated here and can be overridden per case.
 *
 * @param modes            number of rightmost eigenpairs (default 6)
 * @param shift            shift σ for shift-invert, NaN = automatic (default)
 * @param newtonTolerance  Newton stops when the scaled residual ‖M⁻¹F‖∞ ≤ this (default 1e-9)
 * @param newtonMaxSteps   Newton iteration cap (default 60)
 * @param eigenTolerance   ARPACK relative tolerance, 0 = machine precision (default 0)
 * @param marginalBand     |growth rate| at or below this counts as marginal (default 1e-6)
 * @param residualLimit    an eigenpair with residual above this is not reported as converged (default 1e-8)
 */
public record AnalysisSpec(int modes, double shift, double newtonTolerance, int newtonMaxSteps,
                           double eigenTolerance, double marginalBand, double residualLimit) {

    /** The defaults. */
    public static AnalysisSpec defaults() {
        return new AnalysisSpec(6, Double.NaN, 1e-9, 60, 0.0, 1e-6, 1e-8);
    }

    /** Copy with another mode count. */
    public AnalysisSpec withModes(int k) {
        return new AnalysisSpec(k, shift, newtonTolerance, newtonMaxSteps, eigenTolerance, marginalBand, residualLimit);
    }

    /** Copy with another shift. */
    public AnalysisSpec withShift(double s) {
        return new AnalysisSpec(modes, s, newtonTolerance, newtonMaxSteps, eigenTolerance, marginalBand, residualLimit);
    }
}
