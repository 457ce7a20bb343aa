/**
 * Boundary conditions with resolved numbers, one per field and boundary part:
 * {@link rdstab.mesh.boundary.BoundaryCondition} and its records FixedValue, FixedFlux, Convective,
 * Inlet (sign convention: outward flux −k ∂u/∂n). In 1D, Inlet is not implemented yet.
 */
package rdstab.mesh.boundary;
