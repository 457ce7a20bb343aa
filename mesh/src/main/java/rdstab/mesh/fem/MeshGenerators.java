package rdstab.mesh.fem;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Triangle meshes of common plate shapes, with named boundary parts.
 *
 * <ul>
 *   <li>{@link #rectangle} — structured: the cells of an nx × ny grid cut along alternating diagonals
 *   (cell (i, j) along (i, j)–(i+1, j+1) when i + j is even, else along the other diagonal), which
 *   keeps the symmetries of the square for even nx = ny, so symmetric mode pairs stay degenerate;
 *   parts "left", "right", "bottom", "top" (corner nodes belong to both of their edges).</li>
 *   <li>{@link #disk} — part "edge"; {@link #annulus} — parts "inner" and "outer". Nodes on
 *   concentric circles r_k = k·Δr (boundary nodes exactly on the circle), each circle divided into
 *   about 2π r_k / Δr equal arcs, then Delaunay triangulation. The polygonal boundary is within
 *   O(h²) of the circle, so P1 eigenvalues keep their second order.</li>
 *   <li>{@link #lShape} — the rectangle [a, b] × [c, d] without its upper-right quarter; part "edge".</li>
 *   <li>{@link #polygon} — any simple polygon with simple holes (see {@link PolygonMesher} for the
 *   method, the part naming and the validation).</li>
 * </ul>
 * Element size: {@code size} is the target edge length h; every generator refines to it (boundary
 * sides split into pieces ≤ h, interior seeded at spacing h). All throw {@link IllegalArgumentException}
 * for bad input with the actual and expected values.
 */
public final class MeshGenerators {

    /** Largest number of nodes a generator will make (memory guard; about 10^7). */
    public static final long MAX_NODES = 10_000_000L;

    private MeshGenerators() {
    }

    /** Structured triangles on [a, b] × [c, d] with nx × ny cells cut along alternating diagonals (class comment). */
    public static TriangleMesh rectangle(double a, double b, double c, double d, int nx, int ny) {
        if (!(b > a) || !(d > c) || !Double.isFinite(b - a) || !Double.isFinite(d - c)) {
            throw new IllegalArgumentException("rectangle needs a < b and c < d (finite), got [" + a + ", " + b + "] x ["
                    + c + ", " + d + "]");
        }
        if (nx < 1 || ny < 1 || (long) (nx + 1) * (ny + 1) > MAX_NODES) {
            throw new IllegalArgumentException("rectangle cells must be >= 1 per side and at most " + MAX_NODES
                    + " nodes in all, got " + nx + " x " + ny);
        }
        int nxn = nx + 1;
        int n = nxn * (ny + 1);
        double[] x = new double[n];
        double[] y = new double[n];
        for (int j = 0; j <= ny; j++) {
            for (int i = 0; i <= nx; i++) {
                x[j * nxn + i] = i == nx ? b : a + (b - a) * i / nx;
                y[j * nxn + i] = j == ny ? d : c + (d - c) * j / ny;
            }
        }
        int[] tri = new int[6 * nx * ny];
        int t = 0;
        for (int j = 0; j < ny; j++) {
            for (int i = 0; i < nx; i++) {
                int p = j * nxn + i;
                int[] six = (i + j) % 2 == 0 ? new int[] {p, p + 1, p + 1 + nxn, p, p + 1 + nxn, p + nxn}
                        : new int[] {p, p + 1, p + nxn, p + 1, p + 1 + nxn, p + nxn};
                System.arraycopy(six, 0, tri, t, 6);
                t += 6;
            }
        }
        int edges = 2 * (nx + ny);
        int[] e = new int[2 * edges];
        String[] parts = new String[edges];
        int k = 0;
        for (int i = 0; i < nx; i++) {
            k = edge(e, parts, k, i, i + 1, "bottom");
            k = edge(e, parts, k, ny * nxn + i + 1, ny * nxn + i, "top");
        }
        for (int j = 0; j < ny; j++) {
            k = edge(e, parts, k, (j + 1) * nxn, j * nxn, "left");
            k = edge(e, parts, k, j * nxn + nx, (j + 1) * nxn + nx, "right");
        }
        return new TriangleMesh(x, y, tri, e, parts);
    }

    private static int edge(int[] e, String[] parts, int k, int p, int q, String name) {
        e[2 * k] = p;
        e[2 * k + 1] = q;
        parts[k] = name;
        return k + 1;
    }

    /** The rectangle with a target edge length h (cells per side ⌈side/h⌉). */
    public static TriangleMesh rectangle(double a, double b, double c, double d, double size) {
        checkSize(size, Math.max(b - a, d - c));
        return rectangle(a, b, c, d, (int) Math.ceil((b - a) / size - 1e-9), (int) Math.ceil((d - c) / size - 1e-9));
    }

    /** Disk of radius R centred at the origin, target edge length h; part "edge". */
    public static TriangleMesh disk(double radius, double size) {
        if (!(radius > 0) || !Double.isFinite(radius)) {
            throw new IllegalArgumentException("disk radius must be finite and > 0, got " + radius);
        }
        checkSize(size, radius);
        int nr = Math.max(2, (int) Math.ceil(radius / size - 1e-9));
        double dr = radius / nr;
        checkNodes(Math.PI * nr * (nr + 1.0));
        List<double[]> interior = new ArrayList<>();
        interior.add(new double[] {0, 0});
        for (int k = 1; k < nr; k++) {
            interior.addAll(Arrays.asList(circle(k * dr, dr, k)));
        }
        double[][] edge = circle(radius, dr, nr);
        return PolygonMesher.mesh(List.of(new PolygonMesher.BoundaryLoop(edge, names(edge.length, "edge"))), interior,
                0.5 * dr);
    }

    /** Annulus Ri &lt; r &lt; Ro centred at the origin, target edge length h; parts "inner", "outer". */
    public static TriangleMesh annulus(double inner, double outer, double size) {
        if (!(inner > 0) || !(outer > inner) || !Double.isFinite(outer)) {
            throw new IllegalArgumentException("annulus needs 0 < inner radius < outer radius (finite), got " + inner
                    + " and " + outer);
        }
        checkSize(size, outer - inner);
        int nr = Math.max(2, (int) Math.ceil((outer - inner) / size - 1e-9));
        double dr = (outer - inner) / nr;
        checkNodes(Math.PI * (outer + inner) / dr * (nr + 1.0));
        List<double[]> interior = new ArrayList<>();
        for (int k = 1; k < nr; k++) {
            interior.addAll(Arrays.asList(circle(inner + k * dr, dr, k)));
        }
        double[][] out = circle(outer, dr, nr);
        double[][] in = circle(inner, dr, 0);
        return PolygonMesher.mesh(List.of(new PolygonMesher.BoundaryLoop(out, names(out.length, "outer")),
                new PolygonMesher.BoundaryLoop(in, names(in.length, "inner"))), interior, 0.5 * dr);
    }

    /**
     * Points on a circle of radius r at arc spacing about h (at least 6), ring k rotated by the
     * fraction frac(0.381966 k) of a step (golden-ratio offsets), so that no three points of different
     * rings line up exactly — exactly collinear sites give the triangulator zero-area triangles.
     */
    private static double[][] circle(double r, double h, int ring) {
        int n = Math.max(6, (int) Math.round(2 * Math.PI * r / h));
        double[][] p = new double[n][];
        double frac = 0.381966 * ring - Math.floor(0.381966 * ring);
        double off = frac * 2 * Math.PI / n;
        for (int i = 0; i < n; i++) {
            double th = off + 2 * Math.PI * i / n;
            p[i] = new double[] {r * Math.cos(th), r * Math.sin(th)};
        }
        return p;
    }

    /**
     * L-shape: the rectangle [a, b] × [c, d] without its upper-right quarter
     * [(a+b)/2, b] × [(c+d)/2, d]; part "edge"; target edge length h.
     */
    public static TriangleMesh lShape(double a, double b, double c, double d, double size) {
        if (!(b > a) || !(d > c)) {
            throw new IllegalArgumentException("L-shape needs a < b and c < d, got [" + a + ", " + b + "] x [" + c + ", "
                    + d + "]");
        }
        double mx = 0.5 * (a + b);
        double my = 0.5 * (c + d);
        double[][] pts = {{a, c}, {b, c}, {b, my}, {mx, my}, {mx, d}, {a, d}};
        return polygon(pts, names(6, "edge"), List.of(), List.of(), size);
    }

    /**
     * A polygon with holes. Part naming: every side of every ring has its own part name (side i runs
     * from point i to point i+1, the last side closes the ring); give the same name to several sides
     * to make one part of them (a whole ring under one name is the common case).
     *
     * @param outer      outer ring points (either orientation, not repeated at the end)
     * @param outerParts part name of each outer side (length = outer.length)
     * @param holes      hole rings
     * @param holeParts  part names of each hole's sides
     * @param size       target edge length h
     */
    public static TriangleMesh polygon(double[][] outer, String[] outerParts, List<double[][]> holes,
                                       List<String[]> holeParts, double size) {
        return PolygonMesher.polygon(outer, outerParts, holes, holeParts, size);
    }

    /** n copies of one name. */
    public static String[] names(int n, String name) {
        String[] s = new String[n];
        Arrays.fill(s, name);
        return s;
    }

    static void checkSize(double size, double extent) {
        if (!(size > 0) || !Double.isFinite(size)) {
            throw new IllegalArgumentException("element size must be finite and > 0, got " + size);
        }
        double per = extent / size;
        if (per * per > MAX_NODES) {
            throw new IllegalArgumentException("element size " + size + " is too small for an extent of " + extent
                    + " (more than " + MAX_NODES + " nodes); choose a size of at least " + extent / Math.sqrt(MAX_NODES));
        }
    }

    private static void checkNodes(double n) {
        if (n > MAX_NODES) {
            throw new IllegalArgumentException("the mesh would have about " + (long) n + " nodes; at most " + MAX_NODES
                    + " are made: choose a larger size");
        }
    }
}
