package rdstab.mesh.assembly;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.function.DoubleUnaryOperator;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.ops.DConvertMatrixStruct;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

import rdstab.mesh.boundary.BoundaryCondition;
import rdstab.mesh.boundary.BoundaryCondition.Convective;
import rdstab.mesh.boundary.BoundaryCondition.FixedFlux;
import rdstab.mesh.boundary.BoundaryCondition.FixedValue;
import rdstab.mesh.grid.Geometry1D;
import rdstab.mesh.grid.Grid1D;

/**
 * Method of manufactured solutions (Roache, Verification and Validation in Computational Science
 * and Engineering): pick a smooth u*(r), use the field-dependent diffusivity k(u) = 1 + u/2 and the
 * source
 * <pre>
 *   s(r, u) = g(r) − (u − u*(r)),   g = −(1/r^j)(r^j k(u*) u*')' = −k(u*)(u*'' + j u*'/r) − u*'²/2
 * </pre>
 * (with u*'/r → u*''(0) at a centre), and boundary data consistent with u*. Then u* is steady and
 * <ul>
 *   <li>the truncation error τ = M⁻¹F(u*) at the nodes not on a flux/convective end decays at
 *   order 2; at a flux/convective end node (half cell) it decays at order 1 — a known property of
 *   vertex-centred half cells that does not spoil the global order;</li>
 *   <li>the discrete steady solution (Newton) differs from u* by O(h²) in the max norm.</li>
 * </ul>
 */
class ManufacturedSolutionTest {

    /** A case: geometry, interval, u* with two derivatives, and its boundary conditions. */
    enum Case {
        /** Slab [0, 1], u* = sin 2x + x², convective left end (h = 2), fixed value right. */
        SLAB(Geometry1D.SLAB, 0, 1,
                x -> Math.sin(2 * x) + x * x, x -> 2 * Math.cos(2 * x) + 2 * x, x -> -4 * Math.sin(2 * x) + 2),
        /** Hollow cylinder [0.5, 1.5], u* = cos r + r/2, fixed flux inside, convective outside (h = 3). */
        HOLLOW_CYLINDER(Geometry1D.CYLINDER, 0.5, 1.5,
                x -> Math.cos(x) + 0.5 * x, x -> -Math.sin(x) + 0.5, x -> -Math.cos(x)),
        /** Solid cylinder [0, 1], u* = cos(πr/2)(1 + r²), centre, convective outside (h = 1). */
        CYLINDER(Geometry1D.CYLINDER, 0, 1, ManufacturedSolutionTest::bump, ManufacturedSolutionTest::bump1,
                ManufacturedSolutionTest::bump2),
        /** Sphere [0, 1], u* = cos(πr/2)(1 + r²), centre, convective outside (h = 1). */
        SPHERE(Geometry1D.SPHERE, 0, 1, ManufacturedSolutionTest::bump, ManufacturedSolutionTest::bump1,
                ManufacturedSolutionTest::bump2);

        final Geometry1D geometry;
        final double a;
        final double b;
        final DoubleUnaryOperator u;
        final DoubleUnaryOperator du;
        final DoubleUnaryOperator d2u;

        Case(Geometry1D g, double a, double b, DoubleUnaryOperator u, DoubleUnaryOperator du, DoubleUnaryOperator d2u) {
            this.geometry = g;
            this.a = a;
            this.b = b;
            this.u = u;
            this.du = du;
            this.d2u = d2u;
        }

        static double k(double u) {
            return 1 + 0.5 * u;
        }

        BoundaryCondition[] left() {
            double ua = u.applyAsDouble(a);
            double fa = k(ua) * du.applyAsDouble(a);   // outward normal −x: −k ∂u/∂n = k u'
            switch (this) {
                case SLAB: return new BoundaryCondition[] {new Convective(2, ua - fa / 2)};
                case HOLLOW_CYLINDER: return new BoundaryCondition[] {new FixedFlux(fa)};
                default: return null;
            }
        }

        BoundaryCondition[] right() {
            double ub = u.applyAsDouble(b);
            double fb = -k(ub) * du.applyAsDouble(b);  // outward normal +x: −k u'
            switch (this) {
                case SLAB: return new BoundaryCondition[] {new FixedValue(ub)};
                case HOLLOW_CYLINDER: return new BoundaryCondition[] {new Convective(3, ub - fb / 3)};
                default: return new BoundaryCondition[] {new Convective(1, ub - fb)};
            }
        }

        PointKernel kernel() {
            int j = geometry.metricPower();
            return new PointKernel() {
                @Override public int fieldCount() { return 1; }

                @Override public void source(double[] x, double[] uu, double[] s, double[][] d) {
                    double r = x[0];
                    double us = u.applyAsDouble(r);
                    double u1 = du.applyAsDouble(r);
                    double u2 = d2u.applyAsDouble(r);
                    double radial = r == 0 ? j * u2 : j * u1 / r;
                    double g = -k(us) * (u2 + radial) - 0.5 * u1 * u1;
                    s[0] = g - (uu[0] - us);
                    d[0][0] = -1;
                }

                @Override public void diffusivity(double[] x, double[] uu, double[] kk, double[][] d) {
                    kk[0] = k(uu[0]);
                    d[0][0] = 0.5;
                }

                @Override public boolean diffusivityDependsOnFields() { return true; }
            };
        }
    }

    static double bump(double r) {
        return Math.cos(Math.PI * r / 2) * (1 + r * r);
    }

    static double bump1(double r) {
        double w = Math.PI / 2;
        return -w * Math.sin(w * r) * (1 + r * r) + 2 * r * Math.cos(w * r);
    }

    static double bump2(double r) {
        double w = Math.PI / 2;
        return -w * w * Math.cos(w * r) * (1 + r * r) - 4 * w * r * Math.sin(w * r) + 2 * Math.cos(w * r);
    }

    /** [interior τ max, boundary τ max, solution error max] on a uniform grid of n cells. */
    static double[] errors(Case c, int n) {
        FiniteVolume1D d = new FiniteVolume1D(Grid1D.uniform(c.geometry, c.a, c.b, n), c.kernel(), c.left(), c.right());
        double[][] exactNodal = new double[1][n + 1];
        for (int i = 0; i <= n; i++) {
            exactNodal[0][i] = c.u.applyAsDouble(d.coordinate(i, 0));
        }
        double[] uStar = d.unknownsFromNodal(exactNodal);
        double[] f = new double[d.unknowns()];
        d.residual(uStar, f);
        double[] w = d.nodeWeights();
        double interior = 0;
        double boundary = 0;
        for (int i = 0; i <= n; i++) {
            int r = d.unknownIndex(0, i);
            if (r < 0) {
                continue;
            }
            double tau = Math.abs(f[r] / w[i]);
            boolean fluxEnd = (i == 0 && !d.grid().hasCentre()) || i == n;
            if (fluxEnd) {
                boundary = Math.max(boundary, tau);
            } else {
                interior = Math.max(interior, tau);
            }
        }
        double[] uh = newton(d, uStar);
        double sol = 0;
        for (int r = 0; r < uh.length; r++) {
            sol = Math.max(sol, Math.abs(uh[r] - uStar[r]));
        }
        return new double[] {interior, boundary, sol};
    }

    /** Newton's method with dense EJML solves, from u0, to |F| &lt; 1e-12. */
    private static double[] newton(Discretization d, double[] u0) {
        double[] u = u0.clone();
        double[] f = new double[u.length];
        for (int it = 0; it < 20; it++) {
            d.residual(u, f);
            double norm = 0;
            for (double v : f) {
                norm = Math.max(norm, Math.abs(v));
            }
            if (norm < 1e-12) {
                return u;
            }
            DMatrixRMaj j = DConvertMatrixStruct.convert(d.jacobian(u), (DMatrixRMaj) null);
            DMatrixRMaj rhs = new DMatrixRMaj(u.length, 1, true, f);
            DMatrixRMaj step = new DMatrixRMaj(u.length, 1);
            assertTrue(CommonOps_DDRM.solve(j, rhs, step), "singular Jacobian");
            for (int r = 0; r < u.length; r++) {
                u[r] -= step.get(r);
            }
        }
        throw new AssertionError("Newton did not converge");
    }

    @ParameterizedTest
    @EnumSource(Case.class)
    void truncationAndSolutionErrorsConvergeAtExpectedOrders(Case c) {
        double[] e1 = errors(c, 20);
        double[] e2 = errors(c, 40);
        double[] e3 = errors(c, 80);
        String msg = c + ": errors 20/40/80 interior " + e1[0] + " " + e2[0] + " " + e3[0]
                + ", boundary " + e1[1] + " " + e2[1] + " " + e3[1] + ", solution " + e1[2] + " " + e2[2] + " " + e3[2];
        double pInterior = Spectra.order(e2[0], e3[0], 2);
        double pBoundary = Spectra.order(e2[1], e3[1], 2);
        double pSolution = Spectra.order(e2[2], e3[2], 2);
        assertTrue(pInterior >= 1.9 && pInterior <= 2.1, "interior truncation order " + pInterior + "; " + msg);
        assertTrue(pBoundary >= 0.9 && pBoundary <= 1.1, "boundary truncation order " + pBoundary + "; " + msg);
        assertTrue(pSolution >= 1.9 && pSolution <= 2.1, "solution error order " + pSolution + "; " + msg);
    }
}
