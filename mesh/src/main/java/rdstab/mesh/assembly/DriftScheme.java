package rdstab.mesh.assembly;

import rdstab.mesh.grid.Grid1D;

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
    UPWIND;

    /**
     * Weights of u at nodes i−1, i, i+1 in this scheme's ∂u/∂x at node i of a line of nodes (an entry is 0
     * where the node is not used; at an end node the missing neighbour's weight is 0).
     *
     * @param c the drift velocity at the node (its sign picks the upwind side)
     */
    public double[] weights(Grid1D line, int i, double c) {
        int last = line.nodeCount() - 1;
        double[] coef = new double[3];
        if (i == 0 || i == last) {
            double h = i == 0 ? line.x(1) - line.x(0) : line.x(last) - line.x(last - 1);
            coef[i == 0 ? 1 : 0] = -1 / h;
            coef[i == 0 ? 2 : 1] = 1 / h;
        } else if (this == CENTRED) {
            double hm = line.x(i) - line.x(i - 1);
            double hp = line.x(i + 1) - line.x(i);
            double den = hm * hp * (hm + hp);
            coef[0] = -hp * hp / den;
            coef[1] = (hp * hp - hm * hm) / den;
            coef[2] = hm * hm / den;
        } else if (c > 0) {
            double hm = line.x(i) - line.x(i - 1);
            coef[0] = -1 / hm;
            coef[1] = 1 / hm;
        } else {
            double hp = line.x(i + 1) - line.x(i);
            coef[1] = -1 / hp;
            coef[2] = 1 / hp;
        }
        return coef;
    }
}
