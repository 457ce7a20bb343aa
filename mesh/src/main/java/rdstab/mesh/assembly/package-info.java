/**
 * Assembly of M du/dt = F(u), its exact Jacobian and the weight matrix. Which class to use:
 * <ul>
 *   <li>{@link rdstab.mesh.assembly.Discretization} — what the solver layer talks to.</li>
 *   <li>{@link rdstab.mesh.assembly.FiniteVolume1D} — the 1D implementation: a
 *   {@link rdstab.mesh.grid.Grid1D}, a {@link rdstab.mesh.assembly.PointKernel} and one boundary
 *   condition per field at each end; {@code pureDiffusion(u)} gives the operator for Poincaré
 *   constants.</li>
 *   <li>{@link rdstab.mesh.assembly.FaceAverage}, {@link rdstab.mesh.assembly.DriftScheme} — scheme
 *   options (defaults: arithmetic face diffusivity, centred drift).</li>
 * </ul>
 */
package rdstab.mesh.assembly;
