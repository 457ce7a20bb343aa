package rdstab.solver.verify;

import java.util.ArrayList;
import java.util.List;
import rdstab.mesh.assembly.Discretization;

/**
 * Transfer of nodal values between two 2D meshes of the same body (rectangle grids or triangle
 * meshes, nested or not): each target node is located in a cell of the source mesh
 * ({@link Discretization#cells()}; quadrilaterals are split into two triangles along the 0–2
 * diagonal) and the source's piecewise-linear interpolant is evaluated there with barycentric
 * weights — exact at coinciding nodes and second-order accurate elsewhere, the order of the schemes.
 * A target node outside every source cell (a curved boundary approximated differently by two meshes)
 * takes the value of the nearest source node. Cells are found through a uniform bucket grid of their
 * bounding boxes, so the cost is about linear in the number of nodes.
 */
final class PlaneTransfer {

    private static final double INSIDE = -1e-10;

    private PlaneTransfer() {
    }

    static double[][] transfer(Discretization from, double[][] values, Discretization to) {
        int ns = from.nodes();
        double[] xs = new double[ns];
        double[] ys = new double[ns];
        double minX = Double.POSITIVE_INFINITY;
        double minY = Double.POSITIVE_INFINITY;
        double maxX = Double.NEGATIVE_INFINITY;
        double maxY = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < ns; i++) {
            xs[i] = from.coordinate(i, 0);
            ys[i] = from.coordinate(i, 1);
            minX = Math.min(minX, xs[i]);
            maxX = Math.max(maxX, xs[i]);
            minY = Math.min(minY, ys[i]);
            maxY = Math.max(maxY, ys[i]);
        }
        List<int[]> tris = triangles(from.cells());
        int nb = Math.max(1, (int) Math.sqrt(tris.size() / 2.0));
        double bw = Math.max((maxX - minX) / nb, 1e-300);
        double bh = Math.max((maxY - minY) / nb, 1e-300);
        List<List<Integer>> buckets = new ArrayList<>(nb * nb);
        for (int b = 0; b < nb * nb; b++) {
            buckets.add(new ArrayList<>());
        }
        for (int t = 0; t < tris.size(); t++) {
            int[] c = tris.get(t);
            int i0 = clamp((Math.min(xs[c[0]], Math.min(xs[c[1]], xs[c[2]])) - minX) / bw, nb);
            int i1 = clamp((Math.max(xs[c[0]], Math.max(xs[c[1]], xs[c[2]])) - minX) / bw, nb);
            int j0 = clamp((Math.min(ys[c[0]], Math.min(ys[c[1]], ys[c[2]])) - minY) / bh, nb);
            int j1 = clamp((Math.max(ys[c[0]], Math.max(ys[c[1]], ys[c[2]])) - minY) / bh, nb);
            for (int i = i0; i <= i1; i++) {
                for (int j = j0; j <= j1; j++) {
                    buckets.get(i * nb + j).add(t);
                }
            }
        }
        double[][] out = new double[values.length][to.nodes()];
        double[] w = new double[3];
        for (int k = 0; k < to.nodes(); k++) {
            double x = to.coordinate(k, 0);
            double y = to.coordinate(k, 1);
            int[] hit = null;
            List<Integer> cand = buckets.get(clamp((x - minX) / bw, nb) * nb + clamp((y - minY) / bh, nb));
            for (int t : cand) {
                if (weights(tris.get(t), xs, ys, x, y, w)) {
                    hit = tris.get(t);
                    break;
                }
            }
            for (int f = 0; f < values.length; f++) {
                out[f][k] = hit == null ? values[f][nearest(xs, ys, x, y)]
                        : w[0] * values[f][hit[0]] + w[1] * values[f][hit[1]] + w[2] * values[f][hit[2]];
            }
        }
        return out;
    }

    private static List<int[]> triangles(int[][] cells) {
        List<int[]> t = new ArrayList<>();
        for (int[] c : cells) {
            if (c.length == 3) {
                t.add(c);
            } else if (c.length == 4) {
                t.add(new int[] {c[0], c[1], c[2]});
                t.add(new int[] {c[0], c[2], c[3]});
            } else {
                throw new IllegalArgumentException("a 2D cell needs 3 or 4 nodes, found " + c.length);
            }
        }
        return t;
    }

    private static int clamp(double v, int nb) {
        return Math.max(0, Math.min(nb - 1, (int) Math.floor(v)));
    }

    /** Barycentric weights of (x, y) in triangle c; true when inside (with a small tolerance). */
    private static boolean weights(int[] c, double[] xs, double[] ys, double x, double y, double[] w) {
        double x0 = xs[c[0]];
        double y0 = ys[c[0]];
        double det = (xs[c[1]] - x0) * (ys[c[2]] - y0) - (xs[c[2]] - x0) * (ys[c[1]] - y0);
        if (det == 0) {
            return false;
        }
        double l1 = ((x - x0) * (ys[c[2]] - y0) - (xs[c[2]] - x0) * (y - y0)) / det;
        double l2 = ((xs[c[1]] - x0) * (y - y0) - (x - x0) * (ys[c[1]] - y0)) / det;
        double l0 = 1 - l1 - l2;
        if (l0 < INSIDE || l1 < INSIDE || l2 < INSIDE) {
            return false;
        }
        w[0] = l0;
        w[1] = l1;
        w[2] = l2;
        return true;
    }

    private static int nearest(double[] xs, double[] ys, double x, double y) {
        int best = 0;
        double bd = Double.POSITIVE_INFINITY;
        for (int i = 0; i < xs.length; i++) {
            double d = (xs[i] - x) * (xs[i] - x) + (ys[i] - y) * (ys[i] - y);
            if (d < bd) {
                bd = d;
                best = i;
            }
        }
        return best;
    }
}
