/**
 * Transport numbers and the linear pattern analysis of a base state.
 *
 * <p>Which class to use: {@link rdstab.solver.pattern.PecletNumbers} for the Péclet numbers of fields
 * with drift (and the oscillation risk of the centred scheme); {@link rdstab.solver.pattern.DispersionRelation}
 * for the growth rate λ(k) of Fourier modes about a spatially uniform base state, at the wavenumbers the
 * domain admits, and the kind of instability (uniform oscillation / Hopf, stationary pattern / Turing).
 */
package rdstab.solver.pattern;
