/**
 * Grids. Which class to use:
 * <ul>
 *   <li>{@link rdstab.mesh.grid.Geometry1D} — pick SLAB, CYLINDER or SPHERE (metric r^j, j = 0, 1, 2).</li>
 *   <li>{@link rdstab.mesh.grid.Grid1D} — the nodes on [a, b]: {@code uniform} by default,
 *   {@code tanh} to cluster nodes smoothly at one or both ends (boundary layers),
 *   {@code geometric} for a fixed growth ratio, {@code of} for explicit coordinates. It also owns
 *   the exact control-volume weights and face area factors used by the assembly.</li>
 * </ul>
 */
package rdstab.mesh.grid;
