package rdstab.mesh.assembly;

/**
 * Discretisation of the drift term −c·∂u/∂x at a node i with neighbour spacings
 * h₋ = x_i − x_{i−1}, h₊ = x_{i+1} − x_i.
 *
 * <ul>
 *   <li>{@link #CENTRED}: the three-point derivative that is exact for quadratics on any grid,
 *   ∂u/∂x ≈ [−h₊² u_{i−1} + (h₊² − h₋²) u_i + h₋² u_{i+1}] / (h₋ h₊ (h₋ + h₊)) — second order,
 *   not monotone when the cell Péclet number |c| h / k exceeds 2.</li>
 *   <li>{@link #UPWIND}: first-order one-sided difference taken on the side the flow comes from,
 *   (u_i − u_{i−1})/h₋ for c &gt; 0 and (u_{i+1} − u_i)/h₊ for c &lt; 0 — monotone, diffusive.</li>
 * </ul>
 * At an end node only one neighbour exists; both schemes then use the first-order one-sided
 * difference toward the interior.
 */
public enum DriftScheme {
    CENTRED,
    UPWIND
}
