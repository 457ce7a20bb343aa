package rdstab.solver.model;

/**
 * Analysis options with their defaults; every tolerance is stated here and can be overridden per case.
 *
 * @param modes               number of rightmost eigenpairs (default 6)
 * @param shift               shift σ for shift-invert, NaN = automatic (default)
 * @param newtonTolerance     Newton stops when the scaled residual ‖M⁻¹F‖∞ ≤ this (default 1e-9)
 * @param newtonMaxSteps      Newton iteration cap (default 60)
 * @param eigenTolerance      relative residual tolerance of the eigen-solver, 0 = its default (default 0)
 * @param marginalBand        |growth rate| at or below this counts as marginal (default 1e-6)
 * @param residualLimit       an eigenpair with residual above this is not reported as converged (default 1e-8)
 * @param driftScheme         "centred" (second order, default) or "upwind" (first order, monotone) for drift terms
 * @param energyWeights       weights w_f of the energy E = ½ Σ_f w_f ‖u_f‖², one per field, each &gt; 0; null = chosen
 *                            automatically (1 for one field; for several, the weights that minimise the a-priori bound)
 * @param amplificationBudget largest number of linear solves (time steps, forward and adjoint) spent on the peak
 *                            energy amplification max_t ‖e^{tA}‖; 0 = do not compute it (default
 *                            {@link #DEFAULT_AMPLIFICATION_BUDGET})
 */
public record AnalysisSpec(int modes, double shift, double newtonTolerance, int newtonMaxSteps,
                           double eigenTolerance, double marginalBand, double residualLimit,
                           String driftScheme, double[] energyWeights, int amplificationBudget) {

    /** Default cap on linear solves for the peak amplification: 20000 steps (about 0.1 s for 1D grids of 400 cells). */
    public static final int DEFAULT_AMPLIFICATION_BUDGET = 20000;

    /** The first seven options with the defaults of the rest (centred drift, automatic weights, default budget). */
    public AnalysisSpec(int modes, double shift, double newtonTolerance, int newtonMaxSteps,
                        double eigenTolerance, double marginalBand, double residualLimit) {
        this(modes, shift, newtonTolerance, newtonMaxSteps, eigenTolerance, marginalBand, residualLimit,
                "centred", null, DEFAULT_AMPLIFICATION_BUDGET);
    }

    public AnalysisSpec {
        energyWeights = energyWeights == null ? null : energyWeights.clone();
    }

    /** The defaults. */
    public static AnalysisSpec defaults() {
        return new AnalysisSpec(6, Double.NaN, 1e-9, 60, 0.0, 1e-6, 1e-8);
    }

    /** Copy with another mode count. */
    public AnalysisSpec withModes(int k) {
        return new AnalysisSpec(k, shift, newtonTolerance, newtonMaxSteps, eigenTolerance, marginalBand, residualLimit,
                driftScheme, energyWeights, amplificationBudget);
    }

    /** Copy with another shift. */
    public AnalysisSpec withShift(double s) {
        return new AnalysisSpec(modes, s, newtonTolerance, newtonMaxSteps, eigenTolerance, marginalBand, residualLimit,
                driftScheme, energyWeights, amplificationBudget);
    }

    /** Copy with another amplification budget. */
    public AnalysisSpec withAmplificationBudget(int b) {
        return new AnalysisSpec(modes, shift, newtonTolerance, newtonMaxSteps, eigenTolerance, marginalBand, residualLimit,
                driftScheme, energyWeights, b);
    }

    /** Copy with another drift scheme ("centred" or "upwind"). */
    public AnalysisSpec withDriftScheme(String s) {
        return new AnalysisSpec(modes, shift, newtonTolerance, newtonMaxSteps, eigenTolerance, marginalBand, residualLimit,
                s, energyWeights, amplificationBudget);
    }

    /** Copy with given energy weights (null = automatic). */
    public AnalysisSpec withEnergyWeights(double[] w) {
        return new AnalysisSpec(modes, shift, newtonTolerance, newtonMaxSteps, eigenTolerance, marginalBand, residualLimit,
                driftScheme, w, amplificationBudget);
    }

    /** The energy weights as given (a copy), or null. */
    @Override
    public double[] energyWeights() {
        return energyWeights == null ? null : energyWeights.clone();
    }
}
