package rdstab.cli.plot;

/**
 * A field given at mesh nodes, sampled on a regular pixel grid through its finite-element interpolant: linear
 * (P1) on triangles, bilinear on quadrilaterals. Pixel (i, j) has its centre at
 * (xmin + (i + ½)·dx, ymin + (j + ½)·dy); pixels whose centre lies in no cell hold NaN (outside the body).
 *
 * <p>Triangles use barycentric coordinates. Quadrilaterals (nodes counter-clockwise, reference corners
 * (0,0), (1,0), (1,1), (0,1)) invert the bilinear map by Newton's method from the centre; it is exact after one
 * step for parallelograms and converges quadratically for convex quadrilaterals; a point counts as inside when its
 * reference coordinates lie in [−1e-9, 1 + 1e-9] (round-off on shared edges) and the mapped point matches the
 * pixel centre to 1e-9 of the cell size (an unconverged Newton iteration never counts as inside). Both interpolants reproduce linear
 * functions exactly, which the tests use as the check.
 *
 * @param xmin  left edge of the pixel grid
 * @param xmax  right edge
 * @param ymin  bottom edge
 * @param ymax  top edge
 * @param value sampled values, value[i][j] for column i (x) and row j (y), NaN outside every cell
 */
public record Raster(double xmin, double xmax, double ymin, double ymax, double[][] value) {

    private static final double INSIDE_TOL = 1e-9;

    /** Number of pixel columns (along x). */
    public int columns() {
        return value.length;
    }

    /** Number of pixel rows (along y). */
    public int rows() {
        return value[0].length;
    }

    /** x of the centre of column i. */
    public double xCentre(int i) {
        return xmin + (i + 0.5) * (xmax - xmin) / columns();
    }

    /** y of the centre of row j. */
    public double yCentre(int j) {
        return ymin + (j + 0.5) * (ymax - ymin) / rows();
    }

    /**
     * Samples a nodal field.
     *
     * @param x      node x coordinates
     * @param y      node y coordinates
     * @param cells  triangles (3 node indices) and/or quadrilaterals (4, counter-clockwise)
     * @param values nodal values
     * @param longSide pixels along the longer side of the bounding box (the other side in proportion, at least 2)
     */
    public static Raster sample(double[] x, double[] y, int[][] cells, double[] values, int longSide) {
        double x0 = min(x);
        double x1 = max(x);
        double y0 = min(y);
        double y1 = max(y);
        double w = x1 - x0;
        double h = y1 - y0;
        if (!(w > 0) || !(h > 0)) {
            throw new IllegalArgumentException("a colour map needs a 2D body; the nodes span " + w + " × " + h);
        }
        int nx = w >= h ? longSide : Math.max(2, (int) Math.round(longSide * w / h));
        int ny = h >= w ? longSide : Math.max(2, (int) Math.round(longSide * h / w));
        return sample(x, y, cells, values, nx, ny);
    }

    /**
     * Samples a nodal field on nx × ny pixels over the bounding box of the nodes (for parameter maps, whose axes
     * have unrelated units).
     */
    public static Raster sample(double[] x, double[] y, int[][] cells, double[] values, int nx, int ny) {
        double x0 = min(x);
        double x1 = max(x);
        double y0 = min(y);
        double y1 = max(y);
        double w = x1 - x0;
        double h = y1 - y0;
        if (!(w > 0) || !(h > 0) || nx < 2 || ny < 2) {
            throw new IllegalArgumentException("a colour map needs a 2D body and at least 2 × 2 pixels");
        }
        double[][] v = new double[nx][ny];
        for (double[] col : v) {
            java.util.Arrays.fill(col, Double.NaN);
        }
        double dx = w / nx;
        double dy = h / ny;
        for (int[] c : cells) {
            double cx0 = Double.POSITIVE_INFINITY;
            double cx1 = Double.NEGATIVE_INFINITY;
            double cy0 = Double.POSITIVE_INFINITY;
            double cy1 = Double.NEGATIVE_INFINITY;
            for (int n : c) {
                cx0 = Math.min(cx0, x[n]);
                cx1 = Math.max(cx1, x[n]);
                cy0 = Math.min(cy0, y[n]);
                cy1 = Math.max(cy1, y[n]);
            }
            int i0 = Math.max(0, (int) Math.floor((cx0 - x0) / dx - 0.5));
            int i1 = Math.min(nx - 1, (int) Math.ceil((cx1 - x0) / dx - 0.5));
            int j0 = Math.max(0, (int) Math.floor((cy0 - y0) / dy - 0.5));
            int j1 = Math.min(ny - 1, (int) Math.ceil((cy1 - y0) / dy - 0.5));
            for (int i = i0; i <= i1; i++) {
                double px = x0 + (i + 0.5) * dx;
                for (int j = j0; j <= j1; j++) {
                    double py = y0 + (j + 0.5) * dy;
                    double s = c.length == 3 ? triangle(x, y, c, values, px, py) : quad(x, y, c, values, px, py);
                    if (!Double.isNaN(s)) {
                        v[i][j] = s;
                    }
                }
            }
        }
        return new Raster(x0, x1, y0, y1, v);
    }

    /** P1 interpolant at (px, py), NaN outside the triangle. */
    static double triangle(double[] x, double[] y, int[] c, double[] f, double px, double py) {
        double xa = x[c[0]];
        double ya = y[c[0]];
        double det = (x[c[1]] - xa) * (y[c[2]] - ya) - (x[c[2]] - xa) * (y[c[1]] - ya);
        double l1 = ((px - xa) * (y[c[2]] - ya) - (x[c[2]] - xa) * (py - ya)) / det;
        double l2 = ((x[c[1]] - xa) * (py - ya) - (px - xa) * (y[c[1]] - ya)) / det;
        double l0 = 1 - l1 - l2;
        if (l0 < -INSIDE_TOL || l1 < -INSIDE_TOL || l2 < -INSIDE_TOL) {
            return Double.NaN;
        }
        return l0 * f[c[0]] + l1 * f[c[1]] + l2 * f[c[2]];
    }

    /** Bilinear interpolant at (px, py), NaN outside the quadrilateral. */
    static double quad(double[] x, double[] y, int[] c, double[] f, double px, double py) {
        double xi = 0.5;
        double eta = 0.5;
        for (int it = 0; it < 20; it++) {
            double[] n = shape(xi, eta);
            double rx = -px;
            double ry = -py;
            for (int k = 0; k < 4; k++) {
                rx += n[k] * x[c[k]];
                ry += n[k] * y[c[k]];
            }
            // Jacobian of (xi, eta) -> (x, y)
            double[] dxi = {-(1 - eta), 1 - eta, eta, -eta};
            double[] deta = {-(1 - xi), -xi, xi, 1 - xi};
            double a = 0;
            double b = 0;
            double cc = 0;
            double d = 0;
            for (int k = 0; k < 4; k++) {
                a += dxi[k] * x[c[k]];
                b += deta[k] * x[c[k]];
                cc += dxi[k] * y[c[k]];
                d += deta[k] * y[c[k]];
            }
            double det = a * d - b * cc;
            double sx = (d * rx - b * ry) / det;
            double sy = (a * ry - cc * rx) / det;
            xi -= sx;
            eta -= sy;
            if (Math.abs(sx) + Math.abs(sy) < 1e-13) {
                break;
            }
        }
        if (xi < -INSIDE_TOL || xi > 1 + INSIDE_TOL || eta < -INSIDE_TOL || eta > 1 + INSIDE_TOL) {
            return Double.NaN;
        }
        double[] n = shape(xi, eta);
        double rx = -px;
        double ry = -py;
        double size = 0;
        for (int k = 0; k < 4; k++) {
            rx += n[k] * x[c[k]];
            ry += n[k] * y[c[k]];
            size = Math.max(size, Math.abs(x[c[k]] - x[c[0]]) + Math.abs(y[c[k]] - y[c[0]]));
        }
        if (Math.abs(rx) + Math.abs(ry) > 1e-9 * size) {
            return Double.NaN; // Newton did not converge: far outside this cell
        }
        return n[0] * f[c[0]] + n[1] * f[c[1]] + n[2] * f[c[2]] + n[3] * f[c[3]];
    }

    private static double[] shape(double xi, double eta) {
        return new double[] {(1 - xi) * (1 - eta), xi * (1 - eta), xi * eta, (1 - xi) * eta};
    }

    /** Smallest and largest finite sample, {NaN, NaN} when none. */
    public double[] range() {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (double[] col : value) {
            for (double v : col) {
                if (!Double.isNaN(v)) {
                    lo = Math.min(lo, v);
                    hi = Math.max(hi, v);
                }
            }
        }
        return lo <= hi ? new double[] {lo, hi} : new double[] {Double.NaN, Double.NaN};
    }

    private static double min(double[] a) {
        double m = Double.POSITIVE_INFINITY;
        for (double v : a) {
            m = Math.min(m, v);
        }
        return m;
    }

    private static double max(double[] a) {
        double m = Double.NEGATIVE_INFINITY;
        for (double v : a) {
            m = Math.max(m, v);
        }
        return m;
    }
}
