package rdstab.solver.verify;

import rdstab.mesh.assembly.Discretization;

/**
 * Piecewise-linear transfer of nodal values between two 1D grids of the same interval (2D meshes:
 * {@link PlaneTransfer}).
 *
 * <p>For a target node at x with x_i ≤ x ≤ x_{i+1} on the source grid, the value is
 * v_i + (v_{i+1} − v_i)(x − x_i)/(x_{i+1} − x_i): exact at coinciding nodes (nested grids) and second-order
 * accurate elsewhere, the same order as the scheme, so it does not spoil the comparison of modes or the warm
 * start of a finer grid. Targets outside the source interval (round-off at the ends) take the end value.
 */
public final class NodalInterpolation {

    private NodalInterpolation() {
    }

    /**
     * Interpolates nodal values [field][node] of {@code from} onto the nodes of {@code to}.
     *
     * @throws IllegalArgumentException when either discretization is not one-dimensional
     */
    public static double[][] transfer(Discretization from, double[][] values, Discretization to) {
        if (from.dimension() == 2 && to.dimension() == 2) {
            return PlaneTransfer.transfer(from, values, to);
        }
        if (from.dimension() != 1 || to.dimension() != 1) {
            throw new IllegalArgumentException("grid transfer needs two meshes of the same dimension (got dimensions "
                    + from.dimension() + " and " + to.dimension() + ")");
        }
        int ns = from.nodes();
        double[] xs = new double[ns];
        for (int i = 0; i < ns; i++) {
            xs[i] = from.coordinate(i, 0);
        }
        double[][] out = new double[values.length][to.nodes()];
        int seg = 0;
        for (int k = 0; k < to.nodes(); k++) {
            double x = to.coordinate(k, 0);
            while (seg < ns - 2 && x > xs[seg + 1]) {
                seg++;
            }
            while (seg > 0 && x < xs[seg]) {
                seg--;
            }
            double t = (x - xs[seg]) / (xs[seg + 1] - xs[seg]);
            t = Math.max(0.0, Math.min(1.0, t));
            for (int f = 0; f < values.length; f++) {
                out[f][k] = values[f][seg] + t * (values[f][seg + 1] - values[f][seg]);
            }
        }
        return out;
    }
}
