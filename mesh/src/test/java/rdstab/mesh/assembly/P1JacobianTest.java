package rdstab.mesh.assembly;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Random;

import org.ejml.data.DMatrixSparseCSC;
import org.ejml.sparse.csc.CommonOps_DSCC;
import org.junit.jupiter.api.Test;

import rdstab.mesh.boundary.BoundaryCondition;
import rdstab.mesh.boundary.BoundaryCondition.Convective;
import rdstab.mesh.boundary.BoundaryCondition.FixedFlux;
import rdstab.mesh.boundary.BoundaryCondition.FixedValue;
import rdstab.mesh.fem.MeshGenerators;
import rdstab.mesh.fem.P1Triangles;
import rdstab.mesh.fem.TriangleMesh;

/**
 * {@link P1Triangles}: exact Jacobian against central differences (common practice, no single
 * source; tolerance rationale in {@link JacobianFiniteDifferenceTest}) with two coupled fields,
 * field-dependent diffusivity and Robin / flux / fixed parts; mass matrix facts.
 */
class P1JacobianTest {

    private static final BoundaryCondition[] BCS = {new FixedValue(0.3), new FixedFlux(0.4), new Convective(2.0, 0.5)};

    @Test
    void exactJacobianMatchesFiniteDifferences() {
        TriangleMesh annulus = MeshGenerators.annulus(0.4, 1.0, 0.25);
        TriangleMesh rect = MeshGenerators.rectangle(0, 1, 0, 0.7, 4, 3);
        Random rnd = new Random(17);
        for (int p = 0; p < 3; p++) {
            for (int q = 0; q < 3; q++) {
                Map<String, BoundaryCondition[]> bc = new LinkedHashMap<>();
                bc.put("inner", new BoundaryCondition[] {BCS[p], BCS[(p + 1) % 3]});
                bc.put("outer", new BoundaryCondition[] {BCS[q], BCS[(q + 2) % 3]});
                P1Triangles d = new P1Triangles(annulus, Kernels.coupled(0.0), bc);
                double err = JacobianFiniteDifferenceTest.maxJacobianError(d, JacobianFiniteDifferenceTest.randomState(d, rnd));
                assertTrue(err <= 1e-6, "annulus " + p + "," + q + ": max |J - J_fd| / scale = " + err);
            }
            Map<String, BoundaryCondition[]> bc = new LinkedHashMap<>();
            bc.put("left", new BoundaryCondition[] {BCS[p], BCS[2]});
            bc.put("right", new BoundaryCondition[] {BCS[2], BCS[p]});
            bc.put("bottom", new BoundaryCondition[] {BCS[(p + 1) % 3], BCS[1]});
            bc.put("top", new BoundaryCondition[] {BCS[2], BCS[2]});
            P1Triangles d = new P1Triangles(rect, Kernels.coupled(0.0), bc);
            double err = JacobianFiniteDifferenceTest.maxJacobianError(d, JacobianFiniteDifferenceTest.randomState(d, rnd));
            assertTrue(err <= 1e-6, "rectangle " + p + ": max |J - J_fd| / scale = " + err);
        }
    }

    /** A kernel whose ∂s/∂u is off by 10 % is caught (the comparison can fail). */
    @Test
    void detectsAWrongSourceDerivative() {
        PointKernel honest = Kernels.coupled(0.0);
        PointKernel lying = new PointKernel() {
            @Override public int fieldCount() { return 2; }
            @Override public void source(double[] x, double[] u, double[] s, double[][] d) {
                honest.source(x, u, s, d);
                d[1][0] *= 1.1;
            }
            @Override public void diffusivity(double[] x, double[] u, double[] k, double[][] d) { honest.diffusivity(x, u, k, d); }
            @Override public boolean diffusivityDependsOnFields() { return true; }
        };
        TriangleMesh mesh = MeshGenerators.disk(1, 0.4);
        P1Triangles d = new P1Triangles(mesh, lying, Map.of("edge", new BoundaryCondition[] {BCS[2], BCS[2]}));
        double err = JacobianFiniteDifferenceTest.maxJacobianError(d, JacobianFiniteDifferenceTest.randomState(d, new Random(1)));
        assertTrue(err > 1e-4, "the FD comparison must see the wrong ds/du, error " + err);
    }

    /** Consistent mass: symmetric, sums to the area (per field); constant k: J symmetric. */
    @Test
    void massAndSymmetry() {
        TriangleMesh mesh = MeshGenerators.disk(1, 0.3);
        BoundaryCondition[] conv = {new Convective(1.5, 0.2)};
        P1Triangles d = new P1Triangles(mesh, Kernels.linear(0.8, -0.3), Map.of("edge", conv));
        DMatrixSparseCSC m = d.mass();
        double sum = 0;
        for (int i = 0; i < m.nz_length; i++) {
            sum += m.nz_values[i];
        }
        assertEquals(mesh.totalArea(), sum, 1e-12, "1ᵀ M 1 = area");
        assertEquals(0.0, Spectra.asymmetry(m), 1e-15);
        assertEquals(0.0, Spectra.asymmetry(d.jacobian(new double[d.unknowns()])), 1e-14);
        assertTrue(!d.massIsDiagonal());
        assertTrue(CommonOps_DSCC.checkStructure(d.jacobian(new double[d.unknowns()])));
    }

    @Test
    void refusesDriftMissingPartsAndUnknownParts() {
        TriangleMesh mesh = MeshGenerators.annulus(0.5, 1, 0.3);
        BoundaryCondition[] one = {new FixedValue(0)};
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new P1Triangles(mesh, Kernels.linear(1, 0), Map.of("outer", one)));
        assertTrue(e.getMessage().contains("'inner' has no condition"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> new P1Triangles(mesh, Kernels.linear(1, 0), Map.of("outer", one, "inner", one, "rim", one)));
        assertTrue(e.getMessage().contains("'rim' is not in the mesh"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> new P1Triangles(mesh, Kernels.coupled(1.0), Map.of("outer", new BoundaryCondition[] {BCS[0], BCS[0]},
                        "inner", new BoundaryCondition[] {BCS[0], BCS[0]})));
        assertTrue(e.getMessage().contains("drift"), e.getMessage());
    }
}
