package rdstab.solver.continuation;

/**
 * A point of a branch in the extended space (u, p) with its unit tangent, as the corrector leaves it.
 *
 * @param u           unknown vector, F(u; p) = 0 to the corrector tolerance
 * @param p           parameter value
 * @param tangentU    state part of the unit tangent (scaled inner product of {@link ParameterFamily})
 * @param tangentP    parameter part of the unit tangent (dp/ds); changes sign at a fold
 * @param iterations  corrector (Newton) iterations taken
 * @param residual    final scaled residual max_i |F_i| / w_i
 */
public record BranchPoint(double[] u, double p, double[] tangentU, double tangentP, int iterations, double residual) {
}
