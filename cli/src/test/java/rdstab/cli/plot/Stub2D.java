package rdstab.cli.plot;

import org.ejml.data.DMatrixSparseCSC;
import rdstab.mesh.assembly.Discretization;

/**
 * A hand-made 2D mesh for writer and plot tests: only geometry (coordinates and cells) is real; the operators are
 * not needed by pictures and files and throw.
 */
public final class Stub2D implements Discretization {

    private final double[] x;
    private final double[] y;
    private final int[][] cells;

    public Stub2D(double[] x, double[] y, int[][] cells) {
        this.x = x;
        this.y = y;
        this.cells = cells;
    }

    /**
     * A structured (nx+1) × (ny+1) grid on [0, w] × [0, h], node (i, j) numbered i·(ny+1) + j, interior nodes moved
     * by up to {@code jitter} of a spacing (seeded), split into quadrilaterals, or into two triangles each.
     */
    public static Stub2D grid(int nx, int ny, double w, double h, double jitter, boolean triangles, long seed) {
        java.util.Random rnd = new java.util.Random(seed);
        int n = (nx + 1) * (ny + 1);
        double[] x = new double[n];
        double[] y = new double[n];
        for (int i = 0; i <= nx; i++) {
            for (int j = 0; j <= ny; j++) {
                int k = i * (ny + 1) + j;
                boolean inner = i > 0 && i < nx && j > 0 && j < ny;
                x[k] = w * (i + (inner ? jitter * (2 * rnd.nextDouble() - 1) : 0)) / nx;
                y[k] = h * (j + (inner ? jitter * (2 * rnd.nextDouble() - 1) : 0)) / ny;
            }
        }
        int[][] c = new int[nx * ny * (triangles ? 2 : 1)][];
        int m = 0;
        for (int i = 0; i < nx; i++) {
            for (int j = 0; j < ny; j++) {
                int a = i * (ny + 1) + j;
                int b = (i + 1) * (ny + 1) + j;
                if (triangles) {
                    c[m++] = new int[] {a, b, b + 1};
                    c[m++] = new int[] {a, b + 1, a + 1};
                } else {
                    c[m++] = new int[] {a, b, b + 1, a + 1};
                }
            }
        }
        return new Stub2D(x, y, c);
    }

    public double[] xs() {
        return x;
    }

    public double[] ys() {
        return y;
    }

    @Override
    public int[][] cells() {
        return cells;
    }

    @Override
    public int unknowns() {
        return x.length;
    }

    @Override
    public int nodes() {
        return x.length;
    }

    @Override
    public int fieldCount() {
        return 1;
    }

    @Override
    public int dimension() {
        return 2;
    }

    @Override
    public double coordinate(int node, int dir) {
        return dir == 0 ? x[node] : y[node];
    }

    @Override
    public int unknownIndex(int field, int node) {
        return node;
    }

    @Override
    public void residual(double[] u, double[] f) {
        throw new UnsupportedOperationException("geometry-only stub");
    }

    @Override
    public DMatrixSparseCSC jacobian(double[] u) {
        throw new UnsupportedOperationException("geometry-only stub");
    }

    @Override
    public DMatrixSparseCSC mass() {
        throw new UnsupportedOperationException("geometry-only stub");
    }

    @Override
    public boolean massIsDiagonal() {
        return true;
    }

    @Override
    public double[][] nodalValues(double[] u) {
        return new double[][] {u.clone()};
    }

    @Override
    public double[][] nodalPerturbation(double[] v) {
        return new double[][] {v.clone()};
    }

    @Override
    public double[] unknownsFromNodal(double[][] nodal) {
        return nodal[0].clone();
    }

    @Override
    public double[] nodeWeights() {
        throw new UnsupportedOperationException("geometry-only stub");
    }
}
