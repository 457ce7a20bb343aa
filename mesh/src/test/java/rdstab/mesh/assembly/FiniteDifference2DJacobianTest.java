package rdstab.mesh.assembly;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;

import org.ejml.data.DMatrixSparseCSC;
import org.ejml.sparse.csc.CommonOps_DSCC;
import org.junit.jupiter.api.Test;

import rdstab.mesh.boundary.BoundaryCondition;
import rdstab.mesh.boundary.BoundaryCondition.Convective;
import rdstab.mesh.boundary.BoundaryCondition.FixedFlux;
import rdstab.mesh.boundary.BoundaryCondition.FixedValue;
import rdstab.mesh.grid.Grid1D;
import rdstab.mesh.grid.RectangleGrid;

/**
 * {@link FiniteDifference2D}: exact Jacobian against central differences (common practice, no
 * single source; tolerance rationale as in {@link JacobianFiniteDifferenceTest}), with two coupled
 * fields, field-dependent diffusivity, drift in x and y, and every combination of fixed, flux and
 * convective edges; the corner rule; the pattern.
 */
class FiniteDifference2DJacobianTest {

    private static final BoundaryCondition[] BCS = {new FixedValue(0.3), new FixedFlux(0.4), new Convective(2.0, 0.5)};
    private static final double TOL = 1e-6;

    private static BoundaryCondition[] pair(int p) {
        return new BoundaryCondition[] {BCS[p % 3], BCS[(p + 1) % 3]};
    }

    @Test
    void exactJacobianMatchesFiniteDifferences() {
        RectangleGrid g = RectangleGrid.tanh(0.1, 1.2, 5, 1.2, Grid1D.Cluster.BOTH, 0, 0.8, 4, 0.8, Grid1D.Cluster.LEFT);
        Random rnd = new Random(11);
        for (int p = 0; p < 3; p++) {
            for (int q = 0; q < 3; q++) {
                for (DriftScheme scheme : DriftScheme.values()) {
                    FaceAverage avg = q == 1 ? FaceAverage.HARMONIC : FaceAverage.ARITHMETIC;
                    FiniteDifference2D d = new FiniteDifference2D(g, Kernels.coupled(p == 1 ? 0 : 1.3), pair(p), pair(q),
                            pair(p + q), pair(p + 2 * q), avg, scheme);
                    double err = JacobianFiniteDifferenceTest.maxJacobianError(d, JacobianFiniteDifferenceTest.randomState(d, rnd));
                    assertTrue(err <= TOL, "edges " + p + "," + q + " " + scheme + ": max |J - J_fd| / scale = " + err);
                }
            }
        }
    }

    /** Breaking the kernel's ∂k/∂u is caught by the same comparison (the check can fail). */
    @Test
    void detectsAWrongDiffusivityDerivative() {
        PointKernel honest = Kernels.coupled(0.0);
        PointKernel lying = new PointKernel() {
            @Override public int fieldCount() { return 2; }
            @Override public void source(double[] x, double[] u, double[] s, double[][] d) { honest.source(x, u, s, d); }
            @Override public void diffusivity(double[] x, double[] u, double[] k, double[][] d) {
                honest.diffusivity(x, u, k, d);
                d[0][0] *= 0.5;
            }
            @Override public boolean diffusivityDependsOnFields() { return true; }
        };
        RectangleGrid g = RectangleGrid.uniform(0, 1, 4, 0, 1, 4);
        FiniteDifference2D d = new FiniteDifference2D(g, lying, pair(2), pair(2), pair(2), pair(2));
        double err = JacobianFiniteDifferenceTest.maxJacobianError(d, JacobianFiniteDifferenceTest.randomState(d, new Random(5)));
        assertTrue(err > 100 * TOL, "the FD comparison must see the wrong dk/du, error " + err);
    }

    /** Corner rule: a fixed value wins over other conditions; two fixed values meet at their mean. */
    @Test
    void cornerRule() {
        RectangleGrid g = RectangleGrid.uniform(0, 1, 3, 0, 1, 3);
        BoundaryCondition[] left = {new FixedValue(1.0)};
        BoundaryCondition[] bottom = {new FixedValue(3.0)};
        BoundaryCondition[] conv = {new Convective(1, 0)};
        FiniteDifference2D d = new FiniteDifference2D(g, Kernels.linear(1, 0), left, conv, bottom, conv);
        double[][] v = d.nodalValues(new double[d.unknowns()]);
        assertEquals(2.0, v[0][g.node(0, 0)], 0.0, "fixed meets fixed: mean");
        assertEquals(1.0, v[0][g.node(0, 3)], 0.0, "fixed (left) meets convective (top): fixed");
        assertEquals(3.0, v[0][g.node(3, 0)], 0.0, "fixed (bottom) meets convective (right): fixed");
        assertEquals(-1, d.unknownIndex(0, g.node(0, 2)));
        assertTrue(d.unknownIndex(0, g.node(3, 3)) >= 0, "convective corner is an unknown");
        // 16 nodes, 4 on the left edge and 3 more on the bottom are fixed
        assertEquals(16 - 7, d.unknowns());
    }

    @Test
    void patternIsValidSortedAndFixed() {
        RectangleGrid g = RectangleGrid.uniform(0, 1, 5, 0, 2, 3);
        FiniteDifference2D d = new FiniteDifference2D(g, Kernels.coupled(0.7), pair(0), pair(1), pair(2), pair(0));
        Random rnd = new Random(2);
        DMatrixSparseCSC j = d.jacobian(JacobianFiniteDifferenceTest.randomState(d, rnd));
        assertTrue(CommonOps_DSCC.checkStructure(j) && CommonOps_DSCC.checkSortedFlag(j));
        assertEquals(d.jacobianNonZeros(), j.nz_length);
    }

    @Test
    void rejectsMissingConditionsAndInlets() {
        RectangleGrid g = RectangleGrid.uniform(0, 1, 3, 0, 1, 3);
        BoundaryCondition[] ok = {new FixedValue(0)};
        assertThrows(IllegalArgumentException.class,
                () -> new FiniteDifference2D(g, Kernels.linear(1, 0), ok, ok, new BoundaryCondition[] {null}, ok));
        assertThrows(IllegalArgumentException.class,
                () -> new FiniteDifference2D(g, Kernels.linear(1, 0), ok, ok, new BoundaryCondition[] {new BoundaryCondition.Inlet(1)}, ok));
        assertThrows(IllegalArgumentException.class, () -> new FiniteDifference2D(g, Kernels.linear(1, 0), ok, ok, ok, null));
    }
}
