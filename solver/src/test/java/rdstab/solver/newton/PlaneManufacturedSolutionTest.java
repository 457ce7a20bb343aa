package rdstab.solver.newton;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import java.util.function.ToDoubleFunction;
import org.junit.jupiter.api.Test;
import rdstab.mesh.assembly.Discretization;
import rdstab.mesh.assembly.FiniteDifference2D;
import rdstab.mesh.assembly.PointKernel;
import rdstab.mesh.boundary.BoundaryCondition;
import rdstab.mesh.fem.MeshGenerators;
import rdstab.mesh.fem.P1Triangles;
import rdstab.mesh.grid.RectangleGrid;

/**
 * Method of manufactured solutions (Roache, Verification and Validation in Computational Science
 * and Engineering; Salari &amp; Knupp, Sandia report 2000-1444) in 2D: choose u*, put the residual of
 * 0 = ∇·(k(u)∇u) + s into the source, and recover u* with {@link DampedNewton} at the scheme's
 * order. Both problems are nonlinear twice over: k = 1 + 0.2u and s = e^u + g(x, y).
 * <ul>
 *   <li>unit disk, P1 triangles: u* = c(1 − r²), c = 0.8, so u* = 0 on the circle (the boundary
 *   nodes lie on it); g = 4c(1 + 0.2u*) − 0.8c²r² − e^{u*};</li>
 *   <li>unit square, finite differences: u* = c sin πx sin πy, g = 2π²u*(1 + 0.2u*) − 0.2|∇u*|² − e^{u*}.</li>
 * </ul>
 * Error: the discrete L2 norm (Σ w_i (u_i − u*_i)² / Σ w_i)^{1/2}. Expected order 2; bands 1.9–2.1
 * for the uniform grid, 1.7–2.3 for the disk (each level is a new ring mesh).
 */
class PlaneManufacturedSolutionTest {

    private static final double C = 0.8;

    /** k = 1 + 0.2u, s = e^u + g(x, y). */
    private static PointKernel kernel(ToDoubleFunction<double[]> g) {
        return new PointKernel() {
            @Override public int fieldCount() { return 1; }

            @Override public void source(double[] x, double[] u, double[] s, double[][] d) {
                s[0] = Math.exp(u[0]) + g.applyAsDouble(x);
                d[0][0] = Math.exp(u[0]);
            }

            @Override public void diffusivity(double[] x, double[] u, double[] k, double[][] d) {
                k[0] = 1 + 0.2 * u[0];
                d[0][0] = 0.2;
            }

            @Override public boolean diffusivityDependsOnFields() { return true; }
        };
    }

    private static double error(Discretization d, ToDoubleFunction<double[]> exact) {
        BaseState base = new DampedNewton(1e-11, 30).solve(d, new double[d.unknowns()]);
        assertTrue(base.residual() <= base.tolerance() && base.residual() < 1e-8, "Newton residual " + base.residual());
        double[] u = d.nodalValues(base.u())[0];
        double[] w = d.nodeWeights();
        double sum = 0;
        double wsum = 0;
        for (int i = 0; i < u.length; i++) {
            double e = u[i] - exact.applyAsDouble(new double[] {d.coordinate(i, 0), d.coordinate(i, 1)});
            sum += w[i] * e * e;
            wsum += w[i];
        }
        return Math.sqrt(sum / wsum);
    }

    @Test
    void diskWithTrianglesConvergesAtSecondOrder() {
        ToDoubleFunction<double[]> exact = x -> C * (1 - x[0] * x[0] - x[1] * x[1]);
        ToDoubleFunction<double[]> g = x -> {
            double r2 = x[0] * x[0] + x[1] * x[1];
            double us = C * (1 - r2);
            return 4 * C * (1 + 0.2 * us) - 0.8 * C * C * r2 - Math.exp(us);
        };
        double[] h = {0.1, 0.05, 0.025};
        double[] e = new double[h.length];
        for (int i = 0; i < h.length; i++) {
            P1Triangles d = new P1Triangles(MeshGenerators.disk(1, h[i]), kernel(g),
                    Map.of("edge", new BoundaryCondition[] {new BoundaryCondition.FixedValue(0)}));
            e[i] = error(d, exact);
        }
        assertTrue(e[2] < 5e-4, "error at h = 0.025: " + e[2]);
        for (int i = 1; i < h.length; i++) {
            double p = Math.log(e[i - 1] / e[i]) / Math.log(2);
            assertTrue(p >= 1.7 && p <= 2.3, "order " + h[i - 1] + " -> " + h[i] + ": " + p + " " + java.util.Arrays.toString(e));
        }
    }

    @Test
    void squareWithFiniteDifferencesConvergesAtSecondOrder() {
        ToDoubleFunction<double[]> exact = x -> C * Math.sin(Math.PI * x[0]) * Math.sin(Math.PI * x[1]);
        ToDoubleFunction<double[]> g = x -> {
            double us = exact.applyAsDouble(x);
            double ux = C * Math.PI * Math.cos(Math.PI * x[0]) * Math.sin(Math.PI * x[1]);
            double uy = C * Math.PI * Math.sin(Math.PI * x[0]) * Math.cos(Math.PI * x[1]);
            return 2 * Math.PI * Math.PI * us * (1 + 0.2 * us) - 0.2 * (ux * ux + uy * uy) - Math.exp(us);
        };
        int[] n = {10, 20, 40};
        double[] e = new double[n.length];
        BoundaryCondition[] zero = {new BoundaryCondition.FixedValue(0)};
        for (int i = 0; i < n.length; i++) {
            FiniteDifference2D d = new FiniteDifference2D(RectangleGrid.uniform(0, 1, n[i], 0, 1, n[i]), kernel(g),
                    zero, zero, zero, zero);
            e[i] = error(d, exact);
        }
        for (int i = 1; i < n.length; i++) {
            double p = Math.log(e[i - 1] / e[i]) / Math.log(2);
            assertTrue(p >= 1.9 && p <= 2.1, "order " + n[i - 1] + " -> " + n[i] + ": " + p + " " + java.util.Arrays.toString(e));
        }
    }
}
