package rdstab.mesh.fem;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.Locale;
import rdstab.mesh.assembly.BlockSparsity;

/**
 * An immutable, validated mesh of straight-sided triangles in the plane.
 *
 * <ul>
 *   <li>nodes (x_i, y_i), i = 0..N−1;</li>
 *   <li>triangles (a, b, c) listed counter-clockwise (positive signed area);</li>
 *   <li>boundary edges (p, q), each tagged with the name of its boundary part.</li>
 * </ul>
 *
 * <h2>Validation (constructor)</h2>
 * Throws {@link InvalidMeshException} naming the item when: a coordinate is not finite; a triangle
 * uses a node number out of range or twice; a triangle is inverted (clockwise) or degenerate
 * (|area| ≤ 10⁻¹² · L², L the diagonal of the bounding box — zero area to round-off); a node is in
 * no triangle; an edge is shared by more than two triangles; an edge of the boundary (an edge of
 * exactly one triangle) carries no part name; a tagged edge is not on the boundary or is tagged
 * twice.
 *
 * <h2>Quality</h2>
 * {@link #minAngleDegrees()} (60° for equilateral triangles; accuracy and conditioning degrade as
 * it approaches 0) and {@link #maxAspectRatio()} with aspect = ℓ_max · (ℓ_a + ℓ_b + ℓ_c) / (4√3 A),
 * which is 1 for an equilateral triangle and grows without bound for slivers.
 */
public final class TriangleMesh {

    private final double[] x;
    private final double[] y;
    private final int[] tri;
    private final int[] edge;
    private final int[] edgePart;
    private final List<String> parts;

    /**
     * @param x         node x coordinates (copied)
     * @param y         node y coordinates (copied, same length)
     * @param triangles 3 node numbers per triangle, counter-clockwise (copied)
     * @param edges     2 node numbers per boundary edge (copied)
     * @param edgeParts part name of each boundary edge
     */
    public TriangleMesh(double[] x, double[] y, int[] triangles, int[] edges, String[] edgeParts) {
        if (x == null || y == null || x.length != y.length || triangles == null || triangles.length % 3 != 0
                || edges == null || edges.length % 2 != 0 || edgeParts == null || edgeParts.length != edges.length / 2) {
            throw new InvalidMeshException(InvalidMeshException.Item.MESH, -1, "mesh arrays must be given with matching "
                    + "lengths (x, y per node; 3 per triangle; 2 per edge and one part name per edge)");
        }
        this.x = x.clone();
        this.y = y.clone();
        this.tri = triangles.clone();
        this.edge = edges.clone();
        List<String> names = new ArrayList<>();
        this.edgePart = new int[edgeParts.length];
        for (int e = 0; e < edgeParts.length; e++) {
            String p = edgeParts[e];
            if (p == null || p.isBlank()) {
                throw new InvalidMeshException(InvalidMeshException.Item.EDGE, e, "boundary edge " + e + " has no part name");
            }
            int k = names.indexOf(p);
            if (k < 0) {
                k = names.size();
                names.add(p);
            }
            edgePart[e] = k;
        }
        this.parts = Collections.unmodifiableList(names);
        validate();
    }

    private void validate() {
        int n = x.length;
        if (tri.length == 0) {
            throw new InvalidMeshException(InvalidMeshException.Item.MESH, -1, "the mesh has no triangles");
        }
        double minX = Double.POSITIVE_INFINITY;
        double maxX = Double.NEGATIVE_INFINITY;
        double minY = Double.POSITIVE_INFINITY;
        double maxY = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < n; i++) {
            if (!Double.isFinite(x[i]) || !Double.isFinite(y[i])) {
                throw new InvalidMeshException(InvalidMeshException.Item.NODE, i, "node " + i + " has a coordinate that "
                        + "is not a finite number: (" + x[i] + ", " + y[i] + ")");
            }
            minX = Math.min(minX, x[i]);
            maxX = Math.max(maxX, x[i]);
            minY = Math.min(minY, y[i]);
            maxY = Math.max(maxY, y[i]);
        }
        double tol = 1e-12 * ((maxX - minX) * (maxX - minX) + (maxY - minY) * (maxY - minY));
        boolean[] used = new boolean[n];
        for (int t = 0; t < triangleCount(); t++) {
            for (int k = 0; k < 3; k++) {
                int v = tri[3 * t + k];
                if (v < 0 || v >= n) {
                    throw new InvalidMeshException(InvalidMeshException.Item.TRIANGLE, t, "triangle " + t + " uses node "
                            + v + "; nodes are numbered 0 to " + (n - 1));
                }
                used[v] = true;
            }
            int a = tri[3 * t];
            int b = tri[3 * t + 1];
            int c = tri[3 * t + 2];
            if (a == b || b == c || a == c) {
                throw new InvalidMeshException(InvalidMeshException.Item.TRIANGLE, t, "triangle " + t + " uses a node twice: "
                        + a + ", " + b + ", " + c);
            }
            double area = area(t);
            if (Math.abs(area) <= tol) {
                throw new InvalidMeshException(InvalidMeshException.Item.TRIANGLE, t, "triangle " + t + " is degenerate "
                        + "(its three corners are on one line; area " + fmt(area) + ")");
            }
            if (area < 0) {
                throw new InvalidMeshException(InvalidMeshException.Item.TRIANGLE, t, "triangle " + t + " is inverted "
                        + "(its corners are listed clockwise; list them counter-clockwise)");
            }
        }
        for (int i = 0; i < n; i++) {
            if (!used[i]) {
                throw new InvalidMeshException(InvalidMeshException.Item.NODE, i, "node " + i + " is in no triangle");
            }
        }
        checkBoundary(n);
    }

    /** Every edge of exactly one triangle is tagged once; every tagged edge is such an edge. */
    private void checkBoundary(int n) {
        int m = triangleCount();
        long[] keys = new long[3 * m];
        for (int t = 0; t < m; t++) {
            for (int k = 0; k < 3; k++) {
                keys[3 * t + k] = key(tri[3 * t + k], tri[3 * t + (k + 1) % 3]);
            }
        }
        Arrays.sort(keys);
        long[] tagged = new long[edgePart.length];
        for (int e = 0; e < tagged.length; e++) {
            tagged[e] = key(edge[2 * e], edge[2 * e + 1]);
        }
        long[] sortedTags = tagged.clone();
        Arrays.sort(sortedTags);
        for (int i = 0; i < keys.length; ) {
            int j = i;
            while (j < keys.length && keys[j] == keys[i]) {
                j++;
            }
            if (j - i > 2) {
                throw new InvalidMeshException(InvalidMeshException.Item.MESH, -1, "edge " + edgeText(keys[i])
                        + " is shared by " + (j - i) + " triangles (at most 2 allowed)");
            }
            if (j - i == 1 && Arrays.binarySearch(sortedTags, keys[i]) < 0) {
                throw new InvalidMeshException(InvalidMeshException.Item.MESH, -1, "boundary edge " + edgeText(keys[i])
                        + " has no part name (every edge of the boundary must be listed with its part)");
            }
            i = j;
        }
        for (int i = 1; i < sortedTags.length; i++) {
            if (sortedTags[i] == sortedTags[i - 1]) {
                int second = -1;
                for (int e = 0, seen = 0; e < tagged.length && second < 0; e++) {
                    if (tagged[e] == sortedTags[i] && ++seen == 2) {
                        second = e;
                    }
                }
                throw new InvalidMeshException(InvalidMeshException.Item.EDGE, second, "boundary edge "
                        + edgeText(sortedTags[i]) + " is listed twice");
            }
        }
        for (int e = 0; e < tagged.length; e++) {
            int lo = lowerBound(keys, tagged[e]);
            int count = 0;
            while (lo + count < keys.length && keys[lo + count] == tagged[e]) {
                count++;
            }
            if (count != 1) {
                throw new InvalidMeshException(InvalidMeshException.Item.EDGE, e, "edge " + edgeText(tagged[e]) + " is "
                        + (count == 0 ? "not an edge of any triangle" : "between two triangles, not on the boundary"));
            }
        }
    }

    private static int lowerBound(long[] a, long v) {
        int lo = 0;
        int hi = a.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (a[mid] < v) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    private static long key(int a, int b) {
        return ((long) Math.min(a, b) << 32) | Math.max(a, b);
    }

    private static String edgeText(long key) {
        return "(" + (key >>> 32) + ", " + (int) key + ")";
    }

    private static String fmt(double v) {
        return String.format(Locale.ROOT, "%.3g", v);
    }

    /** Number of nodes. */
    public int nodeCount() {
        return x.length;
    }

    /** Number of triangles. */
    public int triangleCount() {
        return tri.length / 3;
    }

    /** Number of boundary edges. */
    public int edgeCount() {
        return edgePart.length;
    }

    /** x of node i. */
    public double x(int i) {
        return x[i];
    }

    /** y of node i. */
    public double y(int i) {
        return y[i];
    }

    /** Corner k (0..2) of triangle t. */
    public int corner(int t, int k) {
        return tri[3 * t + k];
    }

    /** Node graph of the triangle edges in CSR form, self included, sorted: {adjStart, adj} ({@link BlockSparsity#graph}). */
    public int[][] nodeGraph() {
        int m = triangleCount();
        int[] a = new int[3 * m];
        int[] b = new int[3 * m];
        for (int t = 0; t < m; t++) {
            for (int k = 0; k < 3; k++) {
                a[3 * t + k] = corner(t, k);
                b[3 * t + k] = corner(t, (k + 1) % 3);
            }
        }
        return BlockSparsity.graph(nodeCount(), a, b);
    }

    /** End k (0, 1) of boundary edge e. */
    public int edgeEnd(int e, int k) {
        return edge[2 * e + k];
    }

    /** Part number of boundary edge e (index into {@link #partNames()}). */
    public int edgePart(int e) {
        return edgePart[e];
    }

    /** Boundary part names, in order of first appearance. */
    public List<String> partNames() {
        return parts;
    }

    /** Signed area of triangle t (positive when counter-clockwise). */
    public double area(int t) {
        int a = tri[3 * t];
        int b = tri[3 * t + 1];
        int c = tri[3 * t + 2];
        return 0.5 * ((x[b] - x[a]) * (y[c] - y[a]) - (x[c] - x[a]) * (y[b] - y[a]));
    }

    /** Total area. */
    public double totalArea() {
        double s = 0;
        for (int t = 0; t < triangleCount(); t++) {
            s += area(t);
        }
        return s;
    }

    /** Smallest interior angle over all triangles, in degrees. */
    public double minAngleDegrees() {
        double best = 180;
        for (int t = 0; t < triangleCount(); t++) {
            for (int k = 0; k < 3; k++) {
                int p = tri[3 * t + k];
                int q = tri[3 * t + (k + 1) % 3];
                int r = tri[3 * t + (k + 2) % 3];
                double ux = x[q] - x[p];
                double uy = y[q] - y[p];
                double vx = x[r] - x[p];
                double vy = y[r] - y[p];
                double ang = Math.atan2(Math.abs(ux * vy - uy * vx), ux * vx + uy * vy);
                best = Math.min(best, Math.toDegrees(ang));
            }
        }
        return best;
    }

    /** Largest aspect ratio ℓ_max (ℓ_a + ℓ_b + ℓ_c) / (4√3 A) over all triangles (1 = equilateral). */
    public double maxAspectRatio() {
        double worst = 1;
        for (int t = 0; t < triangleCount(); t++) {
            double s = 0;
            double lmax = 0;
            for (int k = 0; k < 3; k++) {
                int p = tri[3 * t + k];
                int q = tri[3 * t + (k + 1) % 3];
                double l = Math.hypot(x[q] - x[p], y[q] - y[p]);
                s += l;
                lmax = Math.max(lmax, l);
            }
            worst = Math.max(worst, lmax * s / (4 * Math.sqrt(3) * area(t)));
        }
        return worst;
    }

    /** Longest edge over all triangles (the mesh size h). */
    public double maxEdgeLength() {
        double h = 0;
        for (int t = 0; t < triangleCount(); t++) {
            for (int k = 0; k < 3; k++) {
                int p = tri[3 * t + k];
                int q = tri[3 * t + (k + 1) % 3];
                h = Math.max(h, Math.hypot(x[q] - x[p], y[q] - y[p]));
            }
        }
        return h;
    }

    @Override
    public String toString() {
        return "TriangleMesh[" + nodeCount() + " nodes, " + triangleCount() + " triangles, parts " + parts + "]";
    }
}
