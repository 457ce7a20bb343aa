package rdstab.mesh.fem;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.Map;

import org.ejml.data.DMatrixSparseCSC;

import rdstab.mesh.assembly.BlockSparsity;
import rdstab.mesh.assembly.NodalLayout;
import rdstab.mesh.assembly.PointKernel;
import rdstab.mesh.boundary.BoundaryCondition;

/**
 * Linear (P1) finite elements on a {@link TriangleMesh} for n coupled fields
 * ∂u_f/∂t = ∇·(k_f ∇u_f) + s_f(x, u), in the semi-discrete form M du/dt = F(u).
 *
 * <h2>Operators</h2>
 * With the hat functions φ_a and, per triangle T of area A_T, the local gradient matrix
 * G^T_ab = ∫_T ∇φ_a·∇φ_b dA = (b_a b_b + c_a c_b)/(4 A_T) (b, c the usual coordinate differences):
 * <pre>
 *   M_ab  = Σ_T A_T (1 + δ_ab)/12                           consistent mass (massIsDiagonal() = false)
 *   F_a,f = − Σ_T k̄_{T,f} Σ_b G^T_ab u_{b,f}                diffusion, k̄_T = (k_1 + k_2 + k_3)/3
 *           + Σ_b M_ab s_f(x_b, u_b)                        source: nodal interpolant of s, integrated exactly
 *           + boundary terms (below)
 * </pre>
 * Diffusivity: k̄_T is the element average of the nodal values k_f(x_i, u_i) (the element integral
 * of the P1 interpolant of k), second-order accurate for smooth k. Source: the integral of the P1
 * interpolant of s against φ_a ("product approximation"), second-order accurate; for a linear
 * s = λu it reproduces the Galerkin term exactly, so the eigenvalues of a linear problem shift by
 * exactly λ. The Jacobian is the exact derivative of these formulas, including
 * ∂k̄_T/∂u_{c,g} = (∂k_f/∂u_g)(x_c)/3 and M_ab ∂s_f/∂u_g(x_b).
 *
 * <h2>Boundary</h2>
 * Each boundary part has one condition per field. On an edge of length ℓ with ends a, b:
 * {@link BoundaryCondition.FixedFlux}(q) adds −q ℓ/2 to both rows;
 * {@link BoundaryCondition.Convective}(h, u∞) adds −h ∫_edge φ_a (u − u∞), i.e. the 1D edge mass
 * ℓ/6 [[2, 1], [1, 2]] times −h u plus h u∞ ℓ/2; {@link BoundaryCondition.FixedValue}(v) removes the
 * edge's nodes from the unknowns. A node on several parts with a fixed value is fixed (a fixed value
 * wins over flux and convective conditions); when several parts fix it, it takes the mean.
 * Drift and inlets are not available on triangle meshes (the constructor says so).
 */
public final class P1Triangles extends NodalLayout {

    private final TriangleMesh mesh;
    private final PointKernel kernel;
    private final BoundaryCondition[][] partBc; // [part][field]
    private final BlockSparsity jPattern;
    private final BlockSparsity mPattern;

    /**
     * @param mesh       the mesh
     * @param kernel     pointwise physics (no drift)
     * @param conditions per boundary part name, a condition per field; every part of the mesh needs one
     */
    public P1Triangles(TriangleMesh mesh, PointKernel kernel, Map<String, BoundaryCondition[]> conditions) {
        super(mesh.nodeCount(), kernel.fieldCount(), fixedValues(mesh, kernel, conditions));
        this.mesh = mesh;
        this.kernel = kernel;
        this.partBc = conditionsByPart(mesh, kernel.fieldCount(), conditions);
        int[][] g = mesh.nodeGraph();
        this.jPattern = new BlockSparsity(g[0], g[1], index, nf, unknowns(), true);
        this.mPattern = nf == 1 ? jPattern : new BlockSparsity(g[0], g[1], index, nf, unknowns(), false);
    }

    private static BoundaryCondition[][] conditionsByPart(TriangleMesh mesh, int nf, Map<String, BoundaryCondition[]> c) {
        if (c == null) {
            throw new IllegalArgumentException("boundary conditions must be given for the parts " + mesh.partNames());
        }
        for (String name : c.keySet()) {
            if (!mesh.partNames().contains(name)) {
                throw new IllegalArgumentException("boundary part '" + name + "' is not in the mesh; its parts are "
                        + String.join(", ", mesh.partNames()));
            }
        }
        BoundaryCondition[][] out = new BoundaryCondition[mesh.partNames().size()][];
        for (int p = 0; p < out.length; p++) {
            String name = mesh.partNames().get(p);
            BoundaryCondition[] b = c.get(name);
            if (b == null || b.length != nf) {
                throw new IllegalArgumentException("boundary part '" + name + "' has no condition"
                        + (b == null ? "" : " for every field (" + b.length + " given, " + nf + " fields)"));
            }
            for (int f = 0; f < nf; f++) {
                if (b[f] == null) {
                    throw new IllegalArgumentException("boundary part '" + name + "' has no condition for field " + f);
                }
                if (b[f] instanceof BoundaryCondition.Inlet) {
                    throw new IllegalArgumentException("inlet conditions are not available on triangle meshes (part '"
                            + name + "', field " + f + ")");
                }
            }
            out[p] = b.clone();
        }
        return out;
    }

    private static double[] fixedValues(TriangleMesh mesh, PointKernel kernel, Map<String, BoundaryCondition[]> c) {
        if (mesh == null || kernel == null) {
            throw new IllegalArgumentException("mesh and kernel must be given, got " + mesh + ", " + kernel);
        }
        if (kernel.hasDrift()) {
            throw new IllegalArgumentException("drift is not available on triangle meshes; use a rectangle (finite "
                    + "differences) for a field with drift");
        }
        int nf = kernel.fieldCount();
        BoundaryCondition[][] bc = conditionsByPart(mesh, nf, c);
        double[] sum = new double[mesh.nodeCount() * nf];
        int[] count = new int[sum.length];
        for (int e = 0; e < mesh.edgeCount(); e++) {
            for (int f = 0; f < nf; f++) {
                if (bc[mesh.edgePart(e)][f] instanceof BoundaryCondition.FixedValue fv) {
                    for (int k = 0; k < 2; k++) {
                        int p = mesh.edgeEnd(e, k);
                        // each node is met by two edges of a part: count it once per part and edge end
                        sum[p * nf + f] += fv.value();
                        count[p * nf + f]++;
                    }
                }
            }
        }
        double[] fixed = new double[sum.length];
        for (int i = 0; i < fixed.length; i++) {
            fixed[i] = count[i] == 0 ? Double.NaN : sum[i] / count[i];
        }
        return fixed;
    }

    // ------------------------------------------------------------------ layout

    @Override
    public int dimension() {
        return 2;
    }

    @Override
    public double coordinate(int node, int dir) {
        if (dir == 0) {
            return mesh.x(node);
        }
        if (dir == 1) {
            return mesh.y(node);
        }
        throw new IllegalArgumentException("direction must be 0 or 1 on a 2D mesh, got " + dir);
    }

    /** The mesh. */
    public TriangleMesh mesh() {
        return mesh;
    }

    /** Conditions per part name (a copy). */
    public Map<String, BoundaryCondition[]> conditions() {
        Map<String, BoundaryCondition[]> out = new LinkedHashMap<>();
        for (int p = 0; p < partBc.length; p++) {
            out.put(mesh.partNames().get(p), partBc[p].clone());
        }
        return out;
    }

    /** Number of stored Jacobian entries. */
    public int jacobianNonZeros() {
        return jPattern.nonZeros();
    }

    @Override
    public double[] nodeWeights() {
        double[] w = new double[nn];
        for (int t = 0; t < mesh.triangleCount(); t++) {
            double a3 = mesh.area(t) / 3;
            for (int k = 0; k < 3; k++) {
                w[mesh.corner(t, k)] += a3;
            }
        }
        return w;
    }

    @Override
    public int[][] cells() {
        int[][] c = new int[mesh.triangleCount()][];
        for (int t = 0; t < c.length; t++) {
            c[t] = new int[] {mesh.corner(t, 0), mesh.corner(t, 1), mesh.corner(t, 2)};
        }
        return c;
    }

    @Override
    public DMatrixSparseCSC mass() {
        DMatrixSparseCSC m = mPattern.newMatrix();
        for (int t = 0; t < mesh.triangleCount(); t++) {
            double a12 = mesh.area(t) / 12;
            for (int p = 0; p < 3; p++) {
                for (int q = 0; q < 3; q++) {
                    for (int f = 0; f < nf; f++) {
                        mPattern.add(m, mesh.corner(t, p), f, mesh.corner(t, q), f, p == q ? 2 * a12 : a12);
                    }
                }
            }
        }
        return m;
    }

    @Override
    public boolean massIsDiagonal() {
        return false;
    }

    // ------------------------------------------------------------------ operators

    @Override
    public void residual(double[] u, double[] f) {
        checkLength(f, "f");
        assemble(u, f, null);
    }

    @Override
    public DMatrixSparseCSC jacobian(double[] u) {
        DMatrixSparseCSC j = jPattern.newMatrix();
        assemble(u, new double[unknowns()], j);
        return j;
    }

    private void assemble(double[] u, double[] out, DMatrixSparseCSC j) {
        double[] val = flatValues(u);
        Arrays.fill(out, 0.0);
        double[] k = new double[nn * nf];
        double[] s = new double[nn * nf];
        double[] dk = new double[nn * nf * nf];
        double[] ds = new double[nn * nf * nf];
        nodal(val, k, dk, s, ds);
        int[] c = new int[3];
        double[] bb = new double[3];
        double[] cc = new double[3];
        for (int t = 0; t < mesh.triangleCount(); t++) {
            for (int p = 0; p < 3; p++) {
                c[p] = mesh.corner(t, p);
            }
            double area = mesh.area(t);
            for (int p = 0; p < 3; p++) {
                int q = c[(p + 1) % 3];
                int r = c[(p + 2) % 3];
                bb[p] = mesh.y(q) - mesh.y(r);
                cc[p] = mesh.x(r) - mesh.x(q);
            }
            element(c, area, bb, cc, val, k, dk, s, ds, out, j);
        }
        for (int e = 0; e < mesh.edgeCount(); e++) {
            edge(e, val, out, j);
        }
    }

    private void nodal(double[] val, double[] k, double[] dk, double[] s, double[] ds) {
        double[] x = new double[2];
        double[] ui = new double[nf];
        double[] ki = new double[nf];
        double[] si = new double[nf];
        double[][] dki = new double[nf][nf];
        double[][] dsi = new double[nf][nf];
        for (int p = 0; p < nn; p++) {
            x[0] = mesh.x(p);
            x[1] = mesh.y(p);
            System.arraycopy(val, p * nf, ui, 0, nf);
            for (int f = 0; f < nf; f++) {
                Arrays.fill(dki[f], 0.0);
                Arrays.fill(dsi[f], 0.0);
            }
            kernel.diffusivity(x, ui, ki, dki);
            checkKernel("diffusivity k", ki, dki, true, p, x, ui);
            kernel.source(x, ui, si, dsi);
            checkKernel("source s", si, dsi, false, p, x, ui);
            System.arraycopy(ki, 0, k, p * nf, nf);
            System.arraycopy(si, 0, s, p * nf, nf);
            for (int f = 0; f < nf; f++) {
                System.arraycopy(dki[f], 0, dk, (p * nf + f) * nf, nf);
                System.arraycopy(dsi[f], 0, ds, (p * nf + f) * nf, nf);
            }
        }
    }

    /** Diffusion and source of one triangle (see the class comment), with exact derivatives. */
    private void element(int[] c, double area, double[] bb, double[] cc, double[] val, double[] k, double[] dk,
                         double[] s, double[] ds, double[] out, DMatrixSparseCSC j) {
        double inv4a = 1 / (4 * area);
        double a12 = area / 12;
        boolean kDep = kernel.diffusivityDependsOnFields();
        for (int f = 0; f < nf; f++) {
            double kbar = (k[c[0] * nf + f] + k[c[1] * nf + f] + k[c[2] * nf + f]) / 3;
            for (int p = 0; p < 3; p++) {
                double gu = 0;
                for (int q = 0; q < 3; q++) {
                    double g = (bb[p] * bb[q] + cc[p] * cc[q]) * inv4a;
                    gu += g * val[c[q] * nf + f];
                    double mpq = p == q ? 2 * a12 : a12;
                    addF(out, c[p], f, mpq * s[c[q] * nf + f]);
                    if (j != null) {
                        jPattern.add(j, c[p], f, c[q], f, -kbar * g);
                        for (int h = 0; h < nf; h++) {
                            jPattern.add(j, c[p], f, c[q], h, mpq * ds[(c[q] * nf + f) * nf + h]);
                        }
                    }
                }
                addF(out, c[p], f, -kbar * gu);
                if (j != null && kDep) {
                    for (int q = 0; q < 3; q++) {
                        for (int h = 0; h < nf; h++) {
                            jPattern.add(j, c[p], f, c[q], h, -gu * dk[(c[q] * nf + f) * nf + h] / 3);
                        }
                    }
                }
            }
        }
    }

    private void edge(int e, double[] val, double[] out, DMatrixSparseCSC j) {
        int a = mesh.edgeEnd(e, 0);
        int b = mesh.edgeEnd(e, 1);
        double len = Math.hypot(mesh.x(b) - mesh.x(a), mesh.y(b) - mesh.y(a));
        BoundaryCondition[] bc = partBc[mesh.edgePart(e)];
        for (int f = 0; f < nf; f++) {
            if (bc[f] instanceof BoundaryCondition.FixedFlux ff) {
                addF(out, a, f, -ff.outflux() * len / 2);
                addF(out, b, f, -ff.outflux() * len / 2);
            } else if (bc[f] instanceof BoundaryCondition.Convective cv) {
                double ua = val[a * nf + f];
                double ub = val[b * nf + f];
                double h = cv.h();
                addF(out, a, f, -h * (len / 6 * (2 * ua + ub) - cv.ambient() * len / 2));
                addF(out, b, f, -h * (len / 6 * (ua + 2 * ub) - cv.ambient() * len / 2));
                if (j != null) {
                    jPattern.add(j, a, f, a, f, -h * len / 3);
                    jPattern.add(j, a, f, b, f, -h * len / 6);
                    jPattern.add(j, b, f, a, f, -h * len / 6);
                    jPattern.add(j, b, f, b, f, -h * len / 3);
                }
            }
        }
    }
}
