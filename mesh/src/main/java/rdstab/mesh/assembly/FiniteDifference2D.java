package rdstab.mesh.assembly;

import java.util.Arrays;

import org.ejml.data.DMatrixSparseCSC;

import rdstab.mesh.boundary.BoundaryCondition;
import rdstab.mesh.grid.RectangleGrid;

/**
 * Vertex-centred finite volumes (second order, 5-point) for n coupled fields on a
 * {@link RectangleGrid} — the 2D counterpart of {@link FiniteVolume1D}.
 *
 * <h2>Equations</h2>
 * Node (i, j) owns the control volume of area w_ij = w^x_i w^y_j (half at an edge, a quarter at a
 * corner). For field f and every node whose value is not fixed:
 * <pre>
 *   w_ij du_f/dt = F_{f,ij}(u)
 *   F_{f,ij} = Φ_{i+1/2,j} − Φ_{i−1/2,j} + Ψ_{i,j+1/2} − Ψ_{i,j−1/2} + B_{f,ij} + w_ij s_f(x_ij, u_ij) − w_ij (c·D u_f)_ij
 *   Φ_{i+1/2,j} = w^y_j k_{f,i+1/2,j} (u_{f,i+1,j} − u_{f,ij}) / (x_{i+1} − x_i)     (x-face of length w^y_j)
 *   Ψ_{i,j+1/2} = w^x_i k_{f,i,j+1/2} (u_{f,i,j+1} − u_{f,ij}) / (y_{j+1} − y_j)     (y-face of length w^x_i)
 * </pre>
 * Face diffusivities are the {@link FaceAverage} of the two nodal values k_f(x, u) (field-dependent
 * k allowed; its derivative is in the Jacobian). The lumped weight matrix is M = diag(w_ij) per field.
 *
 * <h2>Boundary conditions and corners</h2>
 * Each edge (left x = a, right x = b, bottom y = c, top y = d) has a condition per field. The
 * boundary term of a node is the sum over the edges it lies on of (edge length of its control
 * volume) × (condition): −ℓ q for {@link BoundaryCondition.FixedFlux}(q), −ℓ h (u − u∞) for
 * {@link BoundaryCondition.Convective}(h, u∞), with ℓ = w^y_j on the left and right edges and
 * ℓ = w^x_i on the bottom and top ones. <b>Corner rule:</b> a corner node carries the terms of both
 * its edges, each over its half-segment; when either edge fixes the value the node is fixed (a fixed
 * value wins over flux and convective conditions), and when both fix it, the node takes the mean
 * of the two values. {@link BoundaryCondition.Inlet} is not available in 2D (constructor throws).
 *
 * <h2>Drift</h2>
 * −c·∇u_f is discretised per direction with the {@link DriftScheme} stencils of {@link FiniteVolume1D}
 * along the grid line through the node (one-sided first order at the ends of the line), velocity
 * components c_x = kernel.drift(f, x, 0) and c_y = kernel.drift(f, x, 1) tabulated once.
 *
 * <h2>Assembly</h2>
 * The Jacobian is written straight into a preallocated compressed-column pattern
 * ({@link BlockSparsity}): memory O(nnz), no triplet list; 10^6 unknowns assemble in seconds.
 */
public final class FiniteDifference2D extends NodalLayout {

    /** Edge numbers used by {@link #condition}. */
    public static final int LEFT = 0;
    /** Right edge x = b. */
    public static final int RIGHT = 1;
    /** Bottom edge y = c. */
    public static final int BOTTOM = 2;
    /** Top edge y = d. */
    public static final int TOP = 3;
    private static final String[] EDGE = {"left", "right", "bottom", "top"};

    private final RectangleGrid grid;
    private final PointKernel kernel;
    private final BoundaryCondition[][] bc;
    private final FaceAverage faceAverage;
    private final DriftScheme driftScheme;
    private final int nxn;
    private final int nyn;
    private final double[] drift; // [(node·nf + f)·2 + dir], null without drift
    private final BlockSparsity pattern;

    /** Arithmetic face average and centred drift. */
    public FiniteDifference2D(RectangleGrid grid, PointKernel kernel, BoundaryCondition[] left, BoundaryCondition[] right,
                              BoundaryCondition[] bottom, BoundaryCondition[] top) {
        this(grid, kernel, left, right, bottom, top, FaceAverage.ARITHMETIC, DriftScheme.CENTRED);
    }

    /**
     * @param grid   the grid
     * @param kernel pointwise physics, n = kernel.fieldCount()
     * @param left   condition per field on x = a (length n, no nulls); likewise right, bottom, top
     */
    public FiniteDifference2D(RectangleGrid grid, PointKernel kernel, BoundaryCondition[] left, BoundaryCondition[] right,
                              BoundaryCondition[] bottom, BoundaryCondition[] top, FaceAverage faceAverage,
                              DriftScheme driftScheme) {
        super(checked(grid, kernel, faceAverage, driftScheme).nodeCount(), kernel.fieldCount(),
                fixedValues(grid, kernel.fieldCount(), new BoundaryCondition[][] {left, right, bottom, top}));
        this.grid = grid;
        this.kernel = kernel;
        this.bc = new BoundaryCondition[][] {left.clone(), right.clone(), bottom.clone(), top.clone()};
        this.faceAverage = faceAverage;
        this.driftScheme = driftScheme;
        this.nxn = grid.nx() + 1;
        this.nyn = grid.ny() + 1;
        this.drift = kernel.hasDrift() ? tabulateDrift() : null;
        int[][] g = graph();
        this.pattern = new BlockSparsity(g[0], g[1], index, nf, unknowns(), kernel.diffusivityDependsOnFields());
    }

    private static RectangleGrid checked(RectangleGrid grid, PointKernel kernel, FaceAverage fa, DriftScheme ds) {
        if (grid == null || kernel == null || fa == null || ds == null) {
            throw new IllegalArgumentException("grid, kernel, face average and drift scheme must be given, got "
                    + grid + ", " + kernel + ", " + fa + ", " + ds);
        }
        return grid;
    }

    /** Fixed values per (node, field) from the edge conditions, with the corner rule of the class comment. */
    private static double[] fixedValues(RectangleGrid grid, int nf, BoundaryCondition[][] edges) {
        for (int e = 0; e < 4; e++) {
            BoundaryCondition[] b = edges[e];
            if (b == null || b.length != nf) {
                throw new IllegalArgumentException(EDGE[e] + " boundary conditions must be given for all " + nf
                        + " fields, got " + (b == null ? "none" : b.length));
            }
            for (int f = 0; f < nf; f++) {
                if (b[f] == null) {
                    throw new IllegalArgumentException(EDGE[e] + " boundary condition of field " + f + " is missing");
                }
                if (b[f] instanceof BoundaryCondition.Inlet) {
                    throw new IllegalArgumentException("inlet conditions are not available on 2D grids (" + EDGE[e]
                            + " edge, field " + f + ")");
                }
            }
        }
        int nx = grid.nx();
        int ny = grid.ny();
        double[] fixed = new double[grid.nodeCount() * nf];
        Arrays.fill(fixed, Double.NaN);
        for (int j = 0; j <= ny; j++) {
            for (int i = 0; i <= nx; i++) {
                if (i > 0 && i < nx && j > 0 && j < ny) {
                    continue;
                }
                for (int f = 0; f < nf; f++) {
                    double sum = 0;
                    int count = 0;
                    int[] on = {i == 0 ? LEFT : -1, i == nx ? RIGHT : -1, j == 0 ? BOTTOM : -1, j == ny ? TOP : -1};
                    for (int e : on) {
                        if (e >= 0 && edges[e][f] instanceof BoundaryCondition.FixedValue fv) {
                            sum += fv.value();
                            count++;
                        }
                    }
                    if (count > 0) {
                        fixed[grid.node(i, j) * nf + f] = sum / count;
                    }
                }
            }
        }
        return fixed;
    }

    private int[][] graph() {
        int edges = (nxn - 1) * nyn + nxn * (nyn - 1);
        int[] a = new int[edges];
        int[] b = new int[edges];
        int e = 0;
        for (int j = 0; j < nyn; j++) {
            for (int i = 0; i < nxn; i++) {
                int p = j * nxn + i;
                if (i + 1 < nxn) {
                    a[e] = p;
                    b[e++] = p + 1;
                }
                if (j + 1 < nyn) {
                    a[e] = p;
                    b[e++] = p + nxn;
                }
            }
        }
        return BlockSparsity.graph(nn, a, b);
    }

    private double[] tabulateDrift() {
        double[] c = new double[nn * nf * 2];
        double[] x = new double[2];
        for (int p = 0; p < nn; p++) {
            x[0] = grid.x().x(p % nxn);
            x[1] = grid.y().x(p / nxn);
            for (int f = 0; f < nf; f++) {
                for (int dir = 0; dir < 2; dir++) {
                    double v = kernel.drift(f, x, dir);
                    if (!Double.isFinite(v)) {
                        throw new ArithmeticException("kernel returned non-finite drift component " + dir + " of field " + f
                                + " = " + v + " at node " + p + " (x, y = " + Arrays.toString(x) + ")");
                    }
                    c[(p * nf + f) * 2 + dir] = v;
                }
            }
        }
        return c;
    }

    // ------------------------------------------------------------------ layout

    @Override
    public int dimension() {
        return 2;
    }

    @Override
    public double coordinate(int node, int dir) {
        if (dir == 0) {
            return grid.x().x(node % nxn);
        }
        if (dir == 1) {
            return grid.y().x(node / nxn);
        }
        throw new IllegalArgumentException("direction must be 0 or 1 on a 2D grid, got " + dir);
    }

    /** The grid. */
    public RectangleGrid grid() {
        return grid;
    }

    /** Condition of field f on an edge ({@link #LEFT}, {@link #RIGHT}, {@link #BOTTOM}, {@link #TOP}). */
    public BoundaryCondition condition(int edge, int f) {
        return bc[edge][f];
    }

    /** Number of stored Jacobian entries (the fixed pattern). */
    public int jacobianNonZeros() {
        return pattern.nonZeros();
    }

    @Override
    public double[] nodeWeights() {
        double[] w = new double[nn];
        for (int p = 0; p < nn; p++) {
            w[p] = grid.area(p % nxn, p / nxn);
        }
        return w;
    }

    @Override
    public int[][] cells() {
        int[][] c = new int[(nxn - 1) * (nyn - 1)][];
        int k = 0;
        for (int j = 0; j + 1 < nyn; j++) {
            for (int i = 0; i + 1 < nxn; i++) {
                int p = j * nxn + i;
                c[k++] = new int[] {p, p + 1, p + 1 + nxn, p + nxn};
            }
        }
        return c;
    }

    @Override
    public DMatrixSparseCSC mass() {
        int n = unknowns();
        DMatrixSparseCSC m = new DMatrixSparseCSC(n, n, n);
        int col = 0;
        for (int p = 0; p < nn; p++) {
            double w = grid.area(p % nxn, p / nxn);
            for (int f = 0; f < nf; f++) {
                if (index[p * nf + f] >= 0) {
                    m.nz_rows[col] = col;
                    m.nz_values[col] = w;
                    m.col_idx[col + 1] = col + 1;
                    col++;
                }
            }
        }
        m.nz_length = n;
        m.indicesSorted = true;
        return m;
    }

    @Override
    public boolean massIsDiagonal() {
        return true;
    }

    // ------------------------------------------------------------------ operators

    @Override
    public void residual(double[] u, double[] f) {
        checkLength(f, "f");
        assemble(u, f, null);
    }

    @Override
    public DMatrixSparseCSC jacobian(double[] u) {
        DMatrixSparseCSC j = pattern.newMatrix();
        assemble(u, new double[unknowns()], j);
        return j;
    }

    private void assemble(double[] u, double[] out, DMatrixSparseCSC j) {
        double[] val = flatValues(u);
        Arrays.fill(out, 0.0);
        double[] k = new double[nn * nf];
        double[] dk = kernel.diffusivityDependsOnFields() ? new double[nn * nf * nf] : null;
        nodeTerms(val, k, dk, out, j);
        for (int jj = 0; jj < nyn; jj++) {
            double len = grid.y().weight(jj);
            for (int i = 0; i + 1 < nxn; i++) {
                int p = jj * nxn + i;
                face(p, p + 1, len / (grid.x().x(i + 1) - grid.x().x(i)), val, k, dk, out, j);
            }
        }
        for (int jj = 0; jj + 1 < nyn; jj++) {
            double h = grid.y().x(jj + 1) - grid.y().x(jj);
            for (int i = 0; i < nxn; i++) {
                int p = jj * nxn + i;
                face(p, p + nxn, grid.x().weight(i) / h, val, k, dk, out, j);
            }
        }
        for (int jj = 0; jj < nyn; jj++) {
            boundary(jj * nxn, LEFT, grid.y().weight(jj), val, out, j);
            boundary(jj * nxn + nxn - 1, RIGHT, grid.y().weight(jj), val, out, j);
        }
        for (int i = 0; i < nxn; i++) {
            boundary(i, BOTTOM, grid.x().weight(i), val, out, j);
            boundary((nyn - 1) * nxn + i, TOP, grid.x().weight(i), val, out, j);
        }
        if (drift != null) {
            for (int p = 0; p < nn; p++) {
                for (int f = 0; f < nf; f++) {
                    driftTerm(p, f, 0, val, out, j);
                    driftTerm(p, f, 1, val, out, j);
                }
            }
        }
    }

    /** Kernel at every node: stores k (and ∂k/∂u), adds w s and w ∂s/∂u. */
    private void nodeTerms(double[] val, double[] k, double[] dk, double[] out, DMatrixSparseCSC j) {
        double[] x = new double[2];
        double[] ui = new double[nf];
        double[] s = new double[nf];
        double[] ki = new double[nf];
        double[][] ds = new double[nf][nf];
        double[][] dki = new double[nf][nf];
        for (int p = 0; p < nn; p++) {
            int i = p % nxn;
            int jj = p / nxn;
            x[0] = grid.x().x(i);
            x[1] = grid.y().x(jj);
            System.arraycopy(val, p * nf, ui, 0, nf);
            for (int f = 0; f < nf; f++) {
                Arrays.fill(ds[f], 0.0);
                Arrays.fill(dki[f], 0.0);
            }
            kernel.diffusivity(x, ui, ki, dki);
            checkKernel("diffusivity k", ki, dki, true, p, x, ui);
            System.arraycopy(ki, 0, k, p * nf, nf);
            if (dk != null) {
                for (int f = 0; f < nf; f++) {
                    System.arraycopy(dki[f], 0, dk, (p * nf + f) * nf, nf);
                }
            }
            kernel.source(x, ui, s, ds);
            checkKernel("source s", s, ds, false, p, x, ui);
            double w = grid.area(i, jj);
            for (int f = 0; f < nf; f++) {
                addF(out, p, f, w * s[f]);
                if (j != null) {
                    for (int g = 0; g < nf; g++) {
                        pattern.add(j, p, f, p, g, w * ds[f][g]);
                    }
                }
            }
        }
    }

    /** Flux g·k_face·(u_q − u_p) between nodes p and q (g = face length / distance), added to p, taken from q. */
    private void face(int p, int q, double g, double[] val, double[] k, double[] dk, double[] out, DMatrixSparseCSC j) {
        for (int f = 0; f < nf; f++) {
            double kl = k[p * nf + f];
            double kr = k[q * nf + f];
            double kFace = faceAverage.value(kl, kr);
            double du = val[q * nf + f] - val[p * nf + f];
            double phi = g * kFace * du;
            addF(out, p, f, phi);
            addF(out, q, f, -phi);
            if (j == null) {
                continue;
            }
            double c = g * kFace;
            fluxDerivative(j, p, q, f, q, f, c);
            fluxDerivative(j, p, q, f, p, f, -c);
            if (dk != null) {
                double gl = g * faceAverage.dLeft(kl, kr) * du;
                double gr = g * faceAverage.dRight(kl, kr) * du;
                for (int h = 0; h < nf; h++) {
                    fluxDerivative(j, p, q, f, p, h, gl * dk[(p * nf + f) * nf + h]);
                    fluxDerivative(j, p, q, f, q, h, gr * dk[(q * nf + f) * nf + h]);
                }
            }
        }
    }

    private void fluxDerivative(DMatrixSparseCSC j, int p, int q, int f, int colNode, int colField, double d) {
        pattern.add(j, p, f, colNode, colField, d);
        pattern.add(j, q, f, colNode, colField, -d);
    }

    private void boundary(int p, int edge, double len, double[] val, double[] out, DMatrixSparseCSC j) {
        for (int f = 0; f < nf; f++) {
            BoundaryCondition b = bc[edge][f];
            if (b instanceof BoundaryCondition.FixedFlux ff) {
                addF(out, p, f, -len * ff.outflux());
            } else if (b instanceof BoundaryCondition.Convective cv) {
                addF(out, p, f, -len * cv.h() * (val[p * nf + f] - cv.ambient()));
                if (j != null) {
                    pattern.add(j, p, f, p, f, -len * cv.h());
                }
            }
        }
    }

    /** −w c_dir (D_dir u_f) at node p with the drift scheme's stencil along grid line dir. */
    private void driftTerm(int p, int f, int dir, double[] val, double[] out, DMatrixSparseCSC j) {
        double c = drift[(p * nf + f) * 2 + dir];
        if (c == 0.0) {
            return;
        }
        int i = p % nxn;
        int jj = p / nxn;
        int pos = dir == 0 ? i : jj;
        int stride = dir == 0 ? 1 : nxn;
        double[] coef = driftScheme.weights(dir == 0 ? grid.x() : grid.y(), pos, c);
        double wc = grid.area(i, jj) * c;
        for (int m = 0; m < 3; m++) {
            if (coef[m] == 0.0) {
                continue;
            }
            int q = p + (m - 1) * stride;
            addF(out, p, f, -wc * coef[m] * val[q * nf + f]);
            if (j != null) {
                pattern.add(j, p, f, q, f, -wc * coef[m]);
            }
        }
    }
}
