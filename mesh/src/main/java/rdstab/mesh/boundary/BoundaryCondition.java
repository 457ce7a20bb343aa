package rdstab.mesh.boundary;

/**
 * A boundary condition for one field on one boundary part, with its numbers already resolved.
 *
 * <p>Sign convention: n is the outward normal and the flux leaving the body is −k ∂u/∂n.
 * <ul>
 *   <li>{@link FixedValue}: u = value (Dirichlet; the node is not an unknown).</li>
 *   <li>{@link FixedFlux}: −k ∂u/∂n = outflux (zero = insulated or symmetry).</li>
 *   <li>{@link Convective}: −k ∂u/∂n = h (u − ambient) (Newton cooling, Robin; h ≥ 0).</li>
 *   <li>{@link Inlet}: Danckwerts inlet c·u − k ∂u/∂x_in = c·inletValue, for a field with drift c.</li>
 * </ul>
 */
public sealed interface BoundaryCondition
        permits BoundaryCondition.FixedValue, BoundaryCondition.FixedFlux,
                BoundaryCondition.Convective, BoundaryCondition.Inlet {

    /** u = value. */
    record FixedValue(double value) implements BoundaryCondition { }

    /** −k ∂u/∂n = outflux (outward). Zero is insulation or symmetry. */
    record FixedFlux(double outflux) implements BoundaryCondition { }

    /** −k ∂u/∂n = h (u − ambient). */
    record Convective(double h, double ambient) implements BoundaryCondition {
        public Convective {
            if (!(h >= 0) || !Double.isFinite(h)) {
                throw new IllegalArgumentException("heat-transfer coefficient must be finite and >= 0, got " + h);
            }
        }
    }

    /** Danckwerts inlet: the total (drift + diffusive) inflow equals c·inletValue. */
    record Inlet(double inletValue) implements BoundaryCondition { }

    /** True for conditions that fix the value and so remove the node from the unknowns. */
    default boolean fixesValue() {
        return this instanceof FixedValue;
    }
}
