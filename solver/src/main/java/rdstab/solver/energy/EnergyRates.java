package rdstab.solver.energy;

/**
 * The energy method's growth rates beside the modal one, all as growth rates (negative = decay):
 * spectral abscissa ≤ numerical abscissa ≤ a-priori bound.
 *
 * @param bound              a-priori bound: −μ₁ + ρ_max, the largest growth any disturbance can have in the
 *                           energy norm ‖u‖²_M by the energy argument (Weyl's inequality on the split J = T + R)
 * @param numericalAbscissa  sharp energy rate ω = max uᵀ½(J+Jᵀ)u / uᵀMu: every disturbance satisfies
 *                           ‖u(t)‖_M ≤ e^{ωt} ‖u(0)‖_M, and ω is attained at t = 0 by some disturbance
 * @param poincare           μ₁ = −λ_max of the symmetric part of the transport operator T (diffusion, drift and
 *                           boundary exchange, no source) in the M inner product: the discrete Poincaré/Friedrichs constant
 *                           scaled by the diffusivity
 * @param reactionRate       ρ_max = largest eigenvalue of the symmetric part of the source Jacobian R over the body
 * @param weights            energy weights per field (1 = plain L² energy), as used in the bound
 * @param selfAdjoint        true when J is symmetric, so the numerical and spectral abscissae coincide
 */
public record EnergyRates(double bound, double numericalAbscissa, double poincare, double reactionRate,
                          double[] weights, boolean selfAdjoint) {
}
