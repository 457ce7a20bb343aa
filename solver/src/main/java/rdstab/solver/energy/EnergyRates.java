package rdstab.solver.energy;

/**
 * The energy method's growth rates beside the modal one, all as growth rates (negative = decay):
 * spectral abscissa ≤ numerical abscissa ≤ a-priori bound, all in the weighted energy
 * E = ½ Σ_f w_f ‖u_f‖²_M (the spectral abscissa does not depend on the weights; the other two do).
 *
 * @param bound              a-priori bound: −μ₁ + ρ_max, the largest growth any disturbance can have in the
 *                           energy norm by the energy argument (Weyl's inequality on the split J = T + R)
 * @param numericalAbscissa  sharp energy rate ω = max uᵀ½(WJ+JᵀW)u / uᵀWMu: every disturbance satisfies
 *                           ‖u(t)‖ ≤ e^{ωt} ‖u(0)‖ in the weighted norm, and ω is attained at t = 0 by some disturbance
 * @param poincare           μ₁ = −λ_max of the symmetric part of the transport operator T (diffusion, drift and
 *                           boundary exchange, no source) in the weighted inner product: the discrete
 *                           Poincaré/Friedrichs constant scaled by the diffusivity
 * @param reactionRate       ρ_max = largest eigenvalue of the symmetric part of the source Jacobian R over the body
 * @param weights            energy weights per field, as used in all three rates
 * @param selfAdjoint        true when J is symmetric, so the numerical and spectral abscissae coincide
 * @param weightChoice       how the weights were set: "unit" (one field), "given" (case file) or
 *                           "chosen to minimise the bound"
 * @param unitWeightBound    the a-priori bound with every weight 1, for comparison
 * @param analyticPoincare   μ₁ of the continuous problem from the shape's first root ζ₁ (k ζ₁²/L²), NaN when the
 *                           shape, coefficients or conditions allow none
 * @param poincareSource     how {@code analyticPoincare} was found, or "computed" when it was not
 * @param peakAmplification  max_t ‖e^{tA}‖ in the energy norm (A = M⁻¹J), NaN when not computed
 * @param peakTime           the t of that maximum, NaN when not computed
 * @param amplificationNote  how the amplification was found, or why it was not computed
 */
public record EnergyRates(double bound, double numericalAbscissa, double poincare, double reactionRate,
                          double[] weights, boolean selfAdjoint, String weightChoice, double unitWeightBound,
                          double analyticPoincare, String poincareSource, double peakAmplification, double peakTime,
                          String amplificationNote) {

    /** The six basic rates with unit weights and nothing else computed. */
    public EnergyRates(double bound, double numericalAbscissa, double poincare, double reactionRate,
                       double[] weights, boolean selfAdjoint) {
        this(bound, numericalAbscissa, poincare, reactionRate, weights, selfAdjoint, "unit", bound, Double.NaN,
                "computed", Double.NaN, Double.NaN, "not computed");
    }

    public EnergyRates {
        weights = weights.clone();
    }

    /** The weights (a copy). */
    @Override
    public double[] weights() {
        return weights.clone();
    }

    /** Copy with the analytic Poincaré constant and how it was found. */
    public EnergyRates withPoincare(double analytic, String source) {
        return new EnergyRates(bound, numericalAbscissa, poincare, reactionRate, weights, selfAdjoint, weightChoice,
                unitWeightBound, analytic, source, peakAmplification, peakTime, amplificationNote);
    }

    /** Copy with the peak amplification. */
    public EnergyRates withAmplification(double peak, double time, String note) {
        return new EnergyRates(bound, numericalAbscissa, poincare, reactionRate, weights, selfAdjoint, weightChoice,
                unitWeightBound, analyticPoincare, poincareSource, peak, time, note);
    }
}
