package rdstab.mesh.grid;

/**
 * An immutable tensor-product grid on the rectangle [a, b] × [c, d]: the nodes are (x_i, y_j) with
 * x from a 1D grid along x and y from a 1D grid along y, each uniform or tanh-stretched exactly as
 * {@link Grid1D} (the 1D grids are plane, {@link Geometry1D#SLAB}).
 *
 * <p>Node numbering: node = j·(nx + 1) + i (x runs fastest), i = 0..nx, j = 0..ny.
 *
 * <p>Control volumes (vertex-centred): node (i, j) owns the tensor product of the 1D control
 * intervals, so its area is w_ij = w^x_i · w^y_j — a full cell area in the interior, half at an
 * edge and a quarter at a corner; Σ w_ij = (b − a)(d − c) exactly.
 */
public final class RectangleGrid {

    private final Grid1D gx;
    private final Grid1D gy;

    private RectangleGrid(Grid1D gx, Grid1D gy) {
        if (gx == null || gy == null) {
            throw new IllegalArgumentException("both 1D grids must be given, got " + gx + ", " + gy);
        }
        if (gx.geometry() != Geometry1D.SLAB || gy.geometry() != Geometry1D.SLAB) {
            throw new IllegalArgumentException("rectangle grids are built from plane (slab) 1D grids, got "
                    + gx.geometry() + " and " + gy.geometry());
        }
        this.gx = gx;
        this.gy = gy;
    }

    /** The tensor product of two plane 1D grids (x along the first, y along the second). */
    public static RectangleGrid of(Grid1D x, Grid1D y) {
        return new RectangleGrid(x, y);
    }

    /** Uniform grid with nx × ny cells on [a, b] × [c, d]. */
    public static RectangleGrid uniform(double a, double b, int nx, double c, double d, int ny) {
        return new RectangleGrid(Grid1D.uniform(Geometry1D.SLAB, a, b, nx), Grid1D.uniform(Geometry1D.SLAB, c, d, ny));
    }

    /**
     * Grid with tanh clustering per direction (see {@link Grid1D#tanh}); a strength of 0 or a null
     * cluster end gives a uniform direction.
     */
    public static RectangleGrid tanh(double a, double b, int nx, double sx, Grid1D.Cluster ex,
                                     double c, double d, int ny, double sy, Grid1D.Cluster ey) {
        return new RectangleGrid(direction(a, b, nx, sx, ex), direction(c, d, ny, sy, ey));
    }

    private static Grid1D direction(double a, double b, int n, double s, Grid1D.Cluster e) {
        return s == 0 || e == null ? Grid1D.uniform(Geometry1D.SLAB, a, b, n) : Grid1D.tanh(Geometry1D.SLAB, a, b, n, s, e);
    }

    /** The 1D grid along x. */
    public Grid1D x() {
        return gx;
    }

    /** The 1D grid along y. */
    public Grid1D y() {
        return gy;
    }

    /** Cells along x. */
    public int nx() {
        return gx.cells();
    }

    /** Cells along y. */
    public int ny() {
        return gy.cells();
    }

    /** Number of nodes (nx + 1)(ny + 1). */
    public int nodeCount() {
        return gx.nodeCount() * gy.nodeCount();
    }

    /** Node number of (i, j). */
    public int node(int i, int j) {
        return j * gx.nodeCount() + i;
    }

    /** Control-volume area of node (i, j): w^x_i w^y_j. */
    public double area(int i, int j) {
        return gx.weight(i) * gy.weight(j);
    }

    @Override
    public String toString() {
        return "RectangleGrid[" + nx() + " x " + ny() + " cells on [" + gx.a() + ", " + gx.b() + "] x ["
                + gy.a() + ", " + gy.b() + "]]";
    }
}
