package rdstab.mesh.grid;

import java.util.Arrays;

/**
 * An immutable 1D grid: node coordinates x_0 &lt; x_1 &lt; … &lt; x_N on [a, b] = [x_0, x_N] in one
 * of the {@link Geometry1D geometries}.
 *
 * <p>For the cylinder and the sphere a ≥ 0 is required; a = 0 is the symmetry centre (no boundary
 * condition is needed there, the metric r^j closes the flux), a &gt; 0 is a hollow body with an
 * inner surface.
 *
 * <h2>Control volumes (vertex-centred)</h2>
 * Node i owns the control volume cv_i = [m_{i−1/2}, m_{i+1/2}] where m_{i+1/2} = (x_i + x_{i+1})/2
 * is the midpoint of cell i, and m_{−1/2} = a, m_{N+1/2} = b (half cells at the ends). Its
 * weight is the exact integral
 * <pre>
 *   w_i = ∫_{cv_i} r^j dr = (m_{i+1/2}^{j+1} − m_{i−1/2}^{j+1}) / (j+1),
 * </pre>
 * so Σ w_i equals the exact body volume (b^{j+1} − a^{j+1})/(j+1) for every grid. The face between
 * nodes i and i+1 sits at m_{i+1/2} and its area factor is m_{i+1/2}^j — exactly the area of the
 * surface that bounds the two control volumes, so the discrete divergence theorem holds exactly.
 *
 * <h2>Construction</h2>
 * <ul>
 *   <li>{@link #uniform} — equal cells.</li>
 *   <li>{@link #geometric} — cell widths h_{i+1} = ratio·h_i (ratio &gt; 1 clusters nodes at a).</li>
 *   <li>{@link #tanh} — smooth tanh clustering toward one or both ends, strength β &gt; 0.</li>
 *   <li>{@link #of} — explicit coordinates (validated).</li>
 * </ul>
 * All factories throw {@link IllegalArgumentException} with actual and expected values.
 */
public final class Grid1D {

    /** Where {@link #tanh} clusters the nodes. */
    public enum Cluster { LEFT, RIGHT, BOTH }

    private final Geometry1D geometry;
    private final double[] x;
    private final double[] weights;
    private final double[] faceMetric;

    private Grid1D(Geometry1D geometry, double[] x) {
        if (geometry == null) {
            throw new IllegalArgumentException("geometry must be given, got null");
        }
        validate(geometry, x);
        this.geometry = geometry;
        this.x = x;
        int n = x.length;
        this.faceMetric = new double[n - 1];
        this.weights = new double[n];
        double left = x[0];
        for (int i = 0; i < n; i++) {
            double right = i < n - 1 ? 0.5 * (x[i] + x[i + 1]) : x[n - 1];
            weights[i] = geometry.volume(left, right);
            if (i < n - 1) {
                faceMetric[i] = geometry.metric(right);
            }
            left = right;
        }
    }

    private static void validate(Geometry1D g, double[] x) {
        if (x == null || x.length < 3) {
            int cells = x == null ? 0 : Math.max(0, x.length - 1);
            throw new IllegalArgumentException("cells must be >= 2, got " + cells);
        }
        for (int i = 0; i < x.length; i++) {
            if (!Double.isFinite(x[i])) {
                throw new IllegalArgumentException("node coordinate x_" + i + " must be finite, got " + x[i]);
            }
            if (i > 0 && !(x[i] > x[i - 1])) {
                throw new IllegalArgumentException("node coordinates must be strictly increasing, got x_"
                        + (i - 1) + " = " + x[i - 1] + " and x_" + i + " = " + x[i]);
            }
        }
        if (g != Geometry1D.SLAB && x[0] < 0) {
            throw new IllegalArgumentException(g.name().toLowerCase() + " grid must have a >= 0 "
                    + "(a = 0 is the centre), got a = " + x[0]);
        }
    }

    private static void checkInterval(double a, double b, int cells) {
        if (cells < 2) {
            throw new IllegalArgumentException("cells must be >= 2, got " + cells);
        }
        if (!Double.isFinite(a) || !Double.isFinite(b) || !(b > a)) {
            throw new IllegalArgumentException("interval must be finite with a < b, got a = " + a + ", b = " + b);
        }
    }

    /** Uniform grid: x_i = a + i (b − a)/cells, with x_N = b exactly. */
    public static Grid1D uniform(Geometry1D geometry, double a, double b, int cells) {
        checkInterval(a, b, cells);
        double[] x = new double[cells + 1];
        for (int i = 0; i <= cells; i++) {
            x[i] = a + (b - a) * i / cells;
        }
        x[cells] = b;
        return new Grid1D(geometry, x);
    }

    /**
     * Geometric stretching: cell widths h_i = h_0·ratio^i (i = 0..cells−1) summing to b − a,
     * so h_0 = (b − a)(ratio − 1)/(ratio^cells − 1). ratio &gt; 1 clusters the nodes at a,
     * ratio &lt; 1 at b, ratio = 1 is uniform. Note: at a fixed ratio, refinement keeps the
     * neighbouring-cell jump, so the local truncation error is only first order (the eigenvalues
     * usually still converge at second order); prefer {@link #tanh} for convergence studies.
     */
    public static Grid1D geometric(Geometry1D geometry, double a, double b, int cells, double ratio) {
        checkInterval(a, b, cells);
        if (!(ratio > 0) || !Double.isFinite(ratio)) {
            throw new IllegalArgumentException("geometric ratio must be finite and > 0, got " + ratio);
        }
        double[] x = new double[cells + 1];
        double h = ratio == 1.0 ? (b - a) / cells : (b - a) * (ratio - 1) / (Math.pow(ratio, cells) - 1);
        x[0] = a;
        for (int i = 1; i < cells; i++) {
            x[i] = x[i - 1] + h;
            h *= ratio;
        }
        x[cells] = b;
        return new Grid1D(geometry, x);
    }

    /**
     * Smooth tanh clustering with strength β &gt; 0 (larger = stronger; β → 0 tends to uniform).
     * With ξ = i/cells the maps are (each with x(0) = a, x(1) = b):
     * <ul>
     *   <li>LEFT  (small cells at a): x = a + (b − a)·(1 + tanh(β(ξ − 1))/tanh β)</li>
     *   <li>RIGHT (small cells at b): x = a + (b − a)·tanh(β ξ)/tanh β</li>
     *   <li>BOTH  (small cells at a and b): x = a + (b − a)·(1 + tanh(β(2ξ − 1))/tanh β)/2</li>
     * </ul>
     * The maps are smooth in ξ, so refinement gives second-order-consistent grids.
     */
    public static Grid1D tanh(Geometry1D geometry, double a, double b, int cells, double strength, Cluster end) {
        checkInterval(a, b, cells);
        if (!(strength > 0) || !Double.isFinite(strength)) {
            throw new IllegalArgumentException("tanh clustering strength must be finite and > 0, got " + strength);
        }
        if (end == null) {
            throw new IllegalArgumentException("cluster end must be LEFT, RIGHT or BOTH, got null");
        }
        double t = Math.tanh(strength);
        double[] x = new double[cells + 1];
        for (int i = 0; i <= cells; i++) {
            double xi = (double) i / cells;
            double s;
            switch (end) {
                case LEFT: s = 1 + Math.tanh(strength * (xi - 1)) / t; break;
                case RIGHT: s = Math.tanh(strength * xi) / t; break;
                default: s = 0.5 * (1 + Math.tanh(strength * (2 * xi - 1)) / t); break;
            }
            x[i] = a + (b - a) * s;
        }
        x[0] = a;
        x[cells] = b;
        return new Grid1D(geometry, x);
    }

    /** Grid from explicit coordinates (copied; strictly increasing, finite, at least 3 nodes). */
    public static Grid1D of(Geometry1D geometry, double... coordinates) {
        return new Grid1D(geometry, coordinates == null ? null : coordinates.clone());
    }

    /** A copy of the node coordinates x_0..x_N. */
    public double[] nodes() {
        return x.clone();
    }

    /** Coordinate of node i. */
    public double x(int i) {
        return x[i];
    }

    /** Number of nodes N + 1. */
    public int nodeCount() {
        return x.length;
    }

    /** Number of cells N. */
    public int cells() {
        return x.length - 1;
    }

    /** The geometry. */
    public Geometry1D geometry() {
        return geometry;
    }

    /** Left end a. */
    public double a() {
        return x[0];
    }

    /** Right end b. */
    public double b() {
        return x[x.length - 1];
    }

    /** True when the left end is a symmetry centre: a = 0 and the geometry is not the slab. */
    public boolean hasCentre() {
        return geometry != Geometry1D.SLAB && x[0] == 0.0;
    }

    /** Control-volume weight w_i = ∫_{cv_i} r^j dr (see the class comment). */
    public double weight(int i) {
        return weights[i];
    }

    /** A copy of all control-volume weights. */
    public double[] weights() {
        return weights.clone();
    }

    /** Coordinate m_{i+1/2} = (x_i + x_{i+1})/2 of the face between nodes i and i+1. */
    public double faceCoordinate(int i) {
        return 0.5 * (x[i] + x[i + 1]);
    }

    /** Area factor m_{i+1/2}^j of the face between nodes i and i+1 (i = 0..N−1). */
    public double faceMetric(int i) {
        return faceMetric[i];
    }

    /** Area factor of the left end surface, a^j (0 at a centre, 1 for the slab). */
    public double leftMetric() {
        return geometry.metric(x[0]);
    }

    /** Area factor of the right end surface, b^j. */
    public double rightMetric() {
        return geometry.metric(x[x.length - 1]);
    }

    @Override
    public String toString() {
        return "Grid1D[" + geometry + ", " + cells() + " cells on [" + a() + ", " + b() + "]]";
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Grid1D g && g.geometry == geometry && Arrays.equals(g.x, x);
    }

    @Override
    public int hashCode() {
        return 31 * geometry.hashCode() + Arrays.hashCode(x);
    }
}
