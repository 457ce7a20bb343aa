package rdstab.mesh.assembly;

import java.util.Arrays;

import org.ejml.data.DMatrixSparseCSC;
import org.ejml.data.DMatrixSparseTriplet;
import org.ejml.ops.DConvertMatrixStruct;
import org.ejml.sparse.csc.CommonOps_DSCC;

import rdstab.mesh.boundary.BoundaryCondition;
import rdstab.mesh.grid.Grid1D;

/**
 * Vertex-centred finite volumes (second order) for n coupled fields on a {@link Grid1D}.
 *
 * <h2>Equations</h2>
 * For field f and every node i whose value is not fixed, with the control-volume weight
 * w_i = ∫_{cv_i} r^j dr and face area factors A_{i±1/2} = m_{i±1/2}^j of {@link Grid1D}:
 * <pre>
 *   w_i du_f/dt = F_{f,i}(u)
 *   F_{f,i} = Φ_{i+1/2} − Φ_{i−1/2} + B_{f,i} + w_i s_f(x_i, u_i) − w_i c_f(x_i) (D u_f)_i
 *   Φ_{i+1/2} = A_{i+1/2} k_{f,i+1/2} (u_{f,i+1} − u_{f,i}) / (x_{i+1} − x_i)
 * </pre>
 * The face diffusivity k_{f,i+1/2} comes from the nodal values k_f(x_i, u_i) by a {@link FaceAverage}
 * (arithmetic mean by default). Φ at the outer sides of the end nodes is replaced by the boundary
 * term B at the end node, with the end area factor A_b = r_b^j (outward normal n):
 * <ul>
 *   <li>{@link BoundaryCondition.FixedFlux}(q): B = −A_b q;</li>
 *   <li>{@link BoundaryCondition.Convective}(h, u∞): B = −A_b h (u − u∞);</li>
 *   <li>{@link BoundaryCondition.FixedValue}(v): the end node is not an unknown; v enters the flux
 *   of its neighbour;</li>
 *   <li>absent ({@code null}): allowed only at a symmetry centre (a = 0, cylinder or sphere), where
 *   A_b = 0 closes the flux;</li>
 *   <li>{@link BoundaryCondition.Inlet}(u_in), the Danckwerts inlet of a flow reactor: with the inflow
 *   speed c_in = c·(−n) &gt; 0 (c(x_0) at the left end, −c(x_N) at the right end) the condition
 *   c_in (u − u_in) = −k ∂u/∂n, i.e. c(u − u_in) = k u_x at a left inlet (scaled: u − u_x/Pe = u_in),
 *   is a Robin condition with h = c_in: B = −A_b c_in (u − u_in), ∂B/∂u = −A_b c_in. It needs a drift
 *   pointing into the body at that end (else {@link IllegalArgumentException}). The outlet condition
 *   u_x = 0 is {@link BoundaryCondition.FixedFlux}(0).</li>
 * </ul>
 * (D u)_i is the drift derivative of the chosen {@link DriftScheme}. The weight matrix is lumped,
 * M = diag(w_i) per field, so without drift and with a constant or field-independent k the
 * Jacobian J is symmetric. Unknowns are numbered node-major (all fields of node 0, then node 1,
 * …), skipping fixed values.
 *
 * <h2>Errors</h2>
 * Non-finite values coming out of the kernel throw {@link ArithmeticException} naming the node,
 * x and the field values; a diffusivity ≤ 0 throws {@link IllegalArgumentException} likewise.
 *
 * <h2>Pure-diffusion variant</h2>
 * {@link #pureDiffusion(double[])} freezes the nodal diffusivities at a state, drops sources and
 * drift and makes every boundary condition homogeneous. Its −J is symmetric positive
 * (semi-)definite; the smallest μ of −J x = μ M x is the discrete Poincaré constant used by
 * energy-stability bounds.
 */
public final class FiniteVolume1D extends NodalLayout {

    private final Grid1D grid;
    private final PointKernel kernel;
    private final BoundaryCondition[] left;
    private final BoundaryCondition[] right;
    private final FaceAverage faceAverage;
    private final DriftScheme driftScheme;
    private final double[][] driftVelocity; // [node][field], null without drift

    /** Same as the full constructor with {@link FaceAverage#ARITHMETIC} and {@link DriftScheme#CENTRED}. */
    public FiniteVolume1D(Grid1D grid, PointKernel kernel, BoundaryCondition[] left, BoundaryCondition[] right) {
        this(grid, kernel, left, right, FaceAverage.ARITHMETIC, DriftScheme.CENTRED);
    }

    /**
     * @param grid        the grid
     * @param kernel      the pointwise physics, n = kernel.fieldCount() fields
     * @param left        condition per field at x_0 (length n); the array or entries may be null only
     *                    when the grid has a symmetry centre
     * @param right       condition per field at x_N (length n, no nulls)
     * @param faceAverage face diffusivity rule
     * @param driftScheme drift discretisation (used only when kernel.hasDrift())
     */
    public FiniteVolume1D(Grid1D grid, PointKernel kernel, BoundaryCondition[] left, BoundaryCondition[] right,
                          FaceAverage faceAverage, DriftScheme driftScheme) {
        this(prepare(grid, kernel, left, right, faceAverage, driftScheme), grid, kernel, faceAverage, driftScheme);
    }

    /** Checked conditions and the fixed values of the layout, computed before the layout is built. */
    private record Prepared(BoundaryCondition[] left, BoundaryCondition[] right, double[] fixed) {
    }

    private FiniteVolume1D(Prepared p, Grid1D grid, PointKernel kernel, FaceAverage faceAverage, DriftScheme driftScheme) {
        super(grid.nodeCount(), kernel.fieldCount(), p.fixed());
        this.grid = grid;
        this.kernel = kernel;
        this.left = p.left();
        this.right = p.right();
        this.faceAverage = faceAverage;
        this.driftScheme = driftScheme;
        this.driftVelocity = kernel.hasDrift() ? tabulateDrift() : null;
        checkInlets();
    }

    private static Prepared prepare(Grid1D grid, PointKernel kernel, BoundaryCondition[] left, BoundaryCondition[] right,
                                    FaceAverage faceAverage, DriftScheme driftScheme) {
        if (grid == null || kernel == null || faceAverage == null || driftScheme == null) {
            throw new IllegalArgumentException("grid, kernel, face average and drift scheme must be given, got "
                    + grid + ", " + kernel + ", " + faceAverage + ", " + driftScheme);
        }
        int nf = kernel.fieldCount();
        if (nf < 1) {
            throw new IllegalArgumentException("kernel must have >= 1 field, got " + nf);
        }
        int nn = grid.nodeCount();
        BoundaryCondition[] l = checkConditions(left, "left", grid.hasCentre(), nf, grid);
        BoundaryCondition[] r = checkConditions(right, "right", false, nf, grid);
        double[] fixed = new double[nn * nf];
        for (int i = 0; i < nn; i++) {
            for (int f = 0; f < nf; f++) {
                BoundaryCondition bc = i == 0 ? l[f] : i == nn - 1 ? r[f] : null;
                fixed[i * nf + f] = bc instanceof BoundaryCondition.FixedValue fv ? fv.value() : Double.NaN;
            }
        }
        return new Prepared(l, r, fixed);
    }

    /** Every inlet needs a drift that enters the body at its end. */
    private void checkInlets() {
        for (int f = 0; f < nf; f++) {
            for (int side = 0; side < 2; side++) {
                BoundaryCondition bc = side == 0 ? left[f] : right[f];
                if (!(bc instanceof BoundaryCondition.Inlet)) {
                    continue;
                }
                double cin = inflowSpeed(side == 0 ? 0 : nn - 1, f);
                if (!(cin > 0)) {
                    throw new IllegalArgumentException("the inlet condition of field " + f + " at the "
                            + (side == 0 ? "left" : "right") + " end needs a drift into the body there ("
                            + (side == 0 ? "c > 0" : "c < 0") + "), got c = "
                            + (driftVelocity == null ? 0.0 : driftVelocity[side == 0 ? 0 : nn - 1][f]));
                }
            }
        }
    }

    /** Inflow speed c·(−n) of field f at an end node (0 without drift). */
    private double inflowSpeed(int node, int f) {
        if (driftVelocity == null) {
            return 0.0;
        }
        return node == 0 ? driftVelocity[0][f] : -driftVelocity[nn - 1][f];
    }

    private static BoundaryCondition[] checkConditions(BoundaryCondition[] bcs, String side, boolean centre, int nf,
                                                       Grid1D grid) {
        if (bcs == null && centre) {
            return new BoundaryCondition[nf];
        }
        if (bcs == null || bcs.length != nf) {
            throw new IllegalArgumentException(side + " boundary conditions must be given for all " + nf
                    + " fields, got " + (bcs == null ? "none" : bcs.length));
        }
        BoundaryCondition[] out = bcs.clone();
        for (int f = 0; f < nf; f++) {
            BoundaryCondition bc = out[f];
            if (centre) {
                if (bc != null && !(bc instanceof BoundaryCondition.FixedFlux ff && ff.outflux() == 0.0)) {
                    throw new IllegalArgumentException("at the symmetry centre r = 0 the left condition of field " + f
                            + " must be absent or FixedFlux(0), got " + bc);
                }
            } else if (bc == null) {
                throw new IllegalArgumentException(side + " boundary condition of field " + f
                        + " is missing; it may be absent only at a symmetry centre (cylinder/sphere with a = 0), got "
                        + grid);
            }
        }
        return out;
    }

    private double[][] tabulateDrift() {
        double[][] c = new double[nn][nf];
        double[] xi = new double[1];
        for (int i = 0; i < nn; i++) {
            xi[0] = grid.x(i);
            for (int f = 0; f < nf; f++) {
                c[i][f] = kernel.drift(f, xi, 0);
                if (!Double.isFinite(c[i][f])) {
                    throw new ArithmeticException("kernel returned non-finite drift c_" + f + " = " + c[i][f]
                            + " at node " + i + " (x = " + xi[0] + ")");
                }
            }
        }
        return c;
    }

    // ------------------------------------------------------------------ layout

    @Override public int dimension() { return 1; }

    @Override
    public double coordinate(int node, int dir) {
        if (dir != 0) {
            throw new IllegalArgumentException("direction must be 0 on a 1D grid, got " + dir);
        }
        return grid.x(node);
    }

    /** The grid. */
    public Grid1D grid() { return grid; }

    /** The kernel. */
    public PointKernel kernel() { return kernel; }

    /** Left condition of field f (null at a centre when absent). */
    public BoundaryCondition leftCondition(int f) { return left[f]; }

    /** Right condition of field f. */
    public BoundaryCondition rightCondition(int f) { return right[f]; }

    /** The face-diffusivity rule. */
    public FaceAverage faceAverage() { return faceAverage; }

    /** The drift scheme. */
    public DriftScheme driftScheme() { return driftScheme; }

    // ------------------------------------------------------------------ operators

    @Override
    public void residual(double[] u, double[] f) {
        checkLength(u, "u");
        checkLength(f, "f");
        assemble(u, new Sink(f, null));
    }

    @Override
    public DMatrixSparseCSC jacobian(double[] u) {
        checkLength(u, "u");
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(unknowns(), unknowns(), 3 * unknowns() * (nf + 2));
        assemble(u, new Sink(new double[unknowns()], t));
        DMatrixSparseCSC j = DConvertMatrixStruct.convert(t, (DMatrixSparseCSC) null);
        j.sortIndices(null);
        CommonOps_DSCC.duplicatesAdd(j, null);
        return j;
    }

    @Override
    public DMatrixSparseCSC mass() {
        DMatrixSparseCSC m = new DMatrixSparseCSC(unknowns(), unknowns(), unknowns());
        for (int i = 0; i < nn; i++) {
            for (int f = 0; f < nf; f++) {
                if (index[i * nf + f] >= 0) {
                    m.set(index[i * nf + f], index[i * nf + f], grid.weight(i));
                }
            }
        }
        m.indicesSorted = true;
        return m;
    }

    @Override
    public boolean massIsDiagonal() {
        return true;
    }

    @Override
    public double[] nodeWeights() {
        return grid.weights();
    }

    /**
     * The pure-diffusion variant at state u: same grid and scheme, nodal diffusivities frozen at
     * k_f(x_i, u_i), no source, no drift, homogeneous boundary conditions (fixed values, fluxes and
     * ambients set to 0, h kept). Intended use: the smallest μ of −J x = μ M x of the result is the
     * discrete Poincaré constant for energy bounds.
     */
    public FiniteVolume1D pureDiffusion(double[] u) {
        checkLength(u, "u");
        double[][] nodal = nodalValues(u);
        double[][] kFrozen = new double[nn][nf];
        NodeState st = new NodeState(nf);
        for (int i = 0; i < nn; i++) {
            st.evaluate(i, nodal, false);
            System.arraycopy(st.k, 0, kFrozen[i], 0, nf);
        }
        return new FiniteVolume1D(grid, new FrozenDiffusionKernel(grid.nodes(), kFrozen),
                homogeneous(left, 0), homogeneous(right, nn - 1), faceAverage, driftScheme);
    }

    /** Homogeneous copies; an inlet becomes the Robin condition it is, Convective(c_in, 0). */
    private BoundaryCondition[] homogeneous(BoundaryCondition[] bcs, int node) {
        BoundaryCondition[] out = new BoundaryCondition[bcs.length];
        for (int f = 0; f < bcs.length; f++) {
            BoundaryCondition bc = bcs[f];
            if (bc instanceof BoundaryCondition.Inlet) {
                out[f] = new BoundaryCondition.Convective(inflowSpeed(node, f), 0.0);
            } else if (bc instanceof BoundaryCondition.FixedValue) {
                out[f] = new BoundaryCondition.FixedValue(0.0);
            } else if (bc instanceof BoundaryCondition.FixedFlux) {
                out[f] = new BoundaryCondition.FixedFlux(0.0);
            } else if (bc instanceof BoundaryCondition.Convective cv) {
                out[f] = new BoundaryCondition.Convective(cv.h(), 0.0);
            } else {
                out[f] = bc;
            }
        }
        return out;
    }


    // ------------------------------------------------------------------ assembly

    /** Residual and (optionally) Jacobian accumulator addressed by (node, field). */
    private final class Sink {
        final double[] f;
        final DMatrixSparseTriplet t;

        Sink(double[] f, DMatrixSparseTriplet t) {
            this.f = f;
            this.t = t;
            Arrays.fill(f, 0.0);
        }

        void addF(int node, int field, double v) {
            int r = index[node * nf + field];
            if (r >= 0) {
                f[r] += v;
            }
        }

        void addJ(int rowNode, int rowField, int colNode, int colField, double v) {
            if (t == null) {
                return;
            }
            int r = index[rowNode * nf + rowField];
            int c = index[colNode * nf + colField];
            if (r >= 0 && c >= 0) {
                t.addItem(r, c, v);
            }
        }
    }

    /** Kernel values at one node: s, ∂s/∂u, k, ∂k/∂u, with the finiteness and positivity checks. */
    private final class NodeState {
        final double[] xi = new double[1];
        final double[] ui;
        final double[] s;
        final double[][] dsdu;
        final double[] k;
        final double[][] dkdu;

        NodeState(int n) {
            ui = new double[n];
            s = new double[n];
            dsdu = new double[n][n];
            k = new double[n];
            dkdu = new double[n][n];
        }

        void evaluate(int node, double[][] nodal, boolean withSource) {
            xi[0] = grid.x(node);
            for (int f = 0; f < nf; f++) {
                ui[f] = nodal[f][node];
                Arrays.fill(dkdu[f], 0.0);
                Arrays.fill(dsdu[f], 0.0);
            }
            kernel.diffusivity(xi, ui, k, dkdu);
            check(node, "diffusivity k", k, dkdu, "dk/du");
            for (int f = 0; f < nf; f++) {
                if (!(k[f] > 0)) {
                    throw new IllegalArgumentException("diffusivity k_" + f + " must be > 0, got " + k[f]
                            + " at node " + node + " (x = " + xi[0] + "), field values " + Arrays.toString(ui));
                }
            }
            if (withSource) {
                kernel.source(xi, ui, s, dsdu);
                check(node, "source s", s, dsdu, "ds/du");
            }
        }

        private void check(int node, String what, double[] v, double[][] dv, String dwhat) {
            for (int f = 0; f < nf; f++) {
                boolean bad = !Double.isFinite(v[f]);
                for (int g = 0; g < nf && !bad; g++) {
                    bad = !Double.isFinite(dv[f][g]);
                }
                if (bad) {
                    throw new ArithmeticException("kernel returned non-finite " + what + "_" + f + " = " + v[f]
                            + " (" + dwhat + " row " + Arrays.toString(dv[f]) + ") at node " + node
                            + " (x = " + xi[0] + "), field values " + Arrays.toString(ui));
                }
            }
        }
    }

    private void assemble(double[] u, Sink out) {
        double[][] nodal = nodalValues(u);
        double[][] kNode = new double[nn][];
        double[][][] dkNode = new double[nn][][];
        NodeState st = new NodeState(nf);
        for (int i = 0; i < nn; i++) {
            st.evaluate(i, nodal, true);
            kNode[i] = st.k.clone();
            dkNode[i] = new double[nf][];
            for (int f = 0; f < nf; f++) {
                dkNode[i][f] = st.dkdu[f].clone();
            }
            addSource(i, st, out);
        }
        for (int i = 0; i < nn - 1; i++) {
            for (int f = 0; f < nf; f++) {
                addFaceFlux(i, f, nodal, kNode, dkNode, out);
            }
        }
        for (int f = 0; f < nf; f++) {
            addBoundary(0, left[f], grid.leftMetric(), f, nodal, out);
            addBoundary(nn - 1, right[f], grid.rightMetric(), f, nodal, out);
        }
        if (driftVelocity != null) {
            for (int i = 0; i < nn; i++) {
                for (int f = 0; f < nf; f++) {
                    addDrift(i, f, nodal, out);
                }
            }
        }
    }

    /** w_i s_f(x_i, u_i) and its derivatives w_i ∂s_f/∂u_g (every g, so the pattern is fixed). */
    private void addSource(int i, NodeState st, Sink out) {
        double w = grid.weight(i);
        for (int f = 0; f < nf; f++) {
            out.addF(i, f, w * st.s[f]);
            for (int g = 0; g < nf; g++) {
                out.addJ(i, f, i, g, w * st.dsdu[f][g]);
            }
        }
    }

    /**
     * Face flux Φ = A k_face (u_{i+1} − u_i)/Δx of field f between nodes i and i+1, added to
     * row i and subtracted from row i+1, with ∂Φ/∂u including ∂k_face/∂u when k depends on fields.
     */
    private void addFaceFlux(int i, int f, double[][] nodal, double[][] kNode, double[][][] dkNode, Sink out) {
        double dx = grid.x(i + 1) - grid.x(i);
        double a = grid.faceMetric(i);
        double kl = kNode[i][f];
        double kr = kNode[i + 1][f];
        double kFace = faceAverage.value(kl, kr);
        double du = nodal[f][i + 1] - nodal[f][i];
        double phi = a * kFace * du / dx;
        out.addF(i, f, phi);
        out.addF(i + 1, f, -phi);
        double c = a * kFace / dx;
        addFluxDerivative(i, f, i + 1, f, c, out);
        addFluxDerivative(i, f, i, f, -c, out);
        if (kernel.diffusivityDependsOnFields()) {
            double gl = a * faceAverage.dLeft(kl, kr) * du / dx;
            double gr = a * faceAverage.dRight(kl, kr) * du / dx;
            for (int g = 0; g < nf; g++) {
                addFluxDerivative(i, f, i, g, gl * dkNode[i][f][g], out);
                addFluxDerivative(i, f, i + 1, g, gr * dkNode[i + 1][f][g], out);
            }
        }
    }

    private void addFluxDerivative(int i, int f, int colNode, int colField, double d, Sink out) {
        out.addJ(i, f, colNode, colField, d);
        out.addJ(i + 1, f, colNode, colField, -d);
    }

    /** Boundary term at an end node with area factor ab (see the class comment). */
    private void addBoundary(int node, BoundaryCondition bc, double ab, int f, double[][] nodal, Sink out) {
        if (bc instanceof BoundaryCondition.FixedFlux ff) {
            out.addF(node, f, -ab * ff.outflux());
        } else if (bc instanceof BoundaryCondition.Convective cv) {
            out.addF(node, f, -ab * cv.h() * (nodal[f][node] - cv.ambient()));
            out.addJ(node, f, node, f, -ab * cv.h());
        } else if (bc instanceof BoundaryCondition.Inlet in) {
            double cin = inflowSpeed(node, f);
            out.addF(node, f, -ab * cin * (nodal[f][node] - in.inletValue()));
            out.addJ(node, f, node, f, -ab * cin);
        }
        // FixedValue: not a row; null: centre, A_b = 0.
    }

    /** −w_i c_f(x_i) (D u_f)_i with the {@link DriftScheme} stencil (one-sided at the ends). */
    private void addDrift(int i, int f, double[][] nodal, Sink out) {
        double c = driftVelocity[i][f];
        double wc = grid.weight(i) * c;
        double[] coef = driftScheme.weights(grid, i, c); // weights of nodes i−1, i, i+1
        for (int m = 0; m < 3; m++) {
            int node = i - 1 + m;
            if (node < 0 || node >= nn || coef[m] == 0.0) {
                continue;
            }
            out.addF(i, f, -wc * coef[m] * nodal[f][node]);
            out.addJ(i, f, node, f, -wc * coef[m]);
        }
    }
}
