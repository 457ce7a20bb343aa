package rdstab.mesh.assembly;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;

import org.junit.jupiter.api.Test;

import rdstab.mesh.boundary.BoundaryCondition;
import rdstab.mesh.boundary.BoundaryCondition.FixedValue;
import rdstab.mesh.fem.MeshGenerators;
import rdstab.mesh.fem.P1Triangles;
import rdstab.mesh.fem.TriangleMesh;

/**
 * Spectra of the Laplacian with u = 0 on the boundary from {@link P1Triangles} (consistent mass):
 * the unit square, λ_mn = −π²(m² + n²) (separation of variables), and the unit disk,
 * λ₁ = −j₀₁² = −5.7831860 with j₀₁ = 2.4048256 (first zero of J₀, Abramowitz &amp; Stegun table 9.5).
 * P1 eigenvalues converge at second order; band 1.8–2.2 for the square (structured meshes, halved),
 * 1.7–2.3 for the disk (each level is a new ring mesh, so the error constant wobbles a little).
 */
class P1SpectrumTest {

    private static final int[] MN2 = {2, 5, 5, 8};
    private static final double J01_SQUARED = 2.4048256 * 2.4048256; // A&S table 9.5

    private static P1Triangles laplacian(TriangleMesh mesh) {
        BoundaryCondition[] zero = {new FixedValue(0.0)};
        Map<String, BoundaryCondition[]> bc = new java.util.LinkedHashMap<>();
        for (String p : mesh.partNames()) {
            bc.put(p, zero);
        }
        return new P1Triangles(mesh, Kernels.linear(1.0, 0.0), bc);
    }

    private static double[] squareErrors(int n) {
        P1Triangles d = laplacian(MeshGenerators.rectangle(0, 1, 0, 1, n, n));
        Pencil p = Pencil.of(d.jacobian(new double[d.unknowns()]), d.mass());
        assertTrue(p.maxResidual < 1e-10, "dense eigenpair residual " + p.maxResidual);
        double[] e = new double[MN2.length];
        for (int k = 0; k < MN2.length; k++) {
            double exact = -Math.PI * Math.PI * MN2[k]; // separation of variables
            e[k] = Math.abs(p.values[k] - exact);
            assertTrue(e[k] < 0.3 * Math.abs(exact), "mode " + k + ": " + p.values[k] + " vs " + exact);
        }
        // (1,2) and (2,1): both found; the alternating-diagonal mesh keeps the square's symmetries, so they coincide
        assertEquals(p.values[1], p.values[2], 1e-9 * Math.abs(p.values[1]), "degenerate pair");
        assertTrue(p.values[3] < p.values[2] - 1, "(2,2) is separate from the pair");
        return e;
    }

    @Test
    void unitSquareConvergesAtSecondOrder() {
        double[] e1 = squareErrors(6);
        double[] e2 = squareErrors(12);
        double[] e3 = squareErrors(24);
        for (int k = 0; k < MN2.length; k++) {
            double p1 = Pencil.order(e1[k], e2[k], 2);
            double p2 = Pencil.order(e2[k], e3[k], 2);
            assertTrue(p2 >= 1.8 && p2 <= 2.2, "mode " + k + " order 12->24 = " + p2 + " (6->12: " + p1 + ")");
        }
    }

    @Test
    void unitDiskFirstEigenvalueConvergesAtSecondOrder() {
        double[] h = {0.2, 0.1, 0.05, 0.025};
        double[] e = new double[h.length];
        for (int i = 0; i < h.length; i++) {
            TriangleMesh mesh = MeshGenerators.disk(1.0, h[i]);
            P1Triangles d = laplacian(mesh);
            double[] lr = InverseIteration.rightmost(d.jacobian(new double[d.unknowns()]), d.mass(), 80);
            assertTrue(lr[1] < 1e-10, "eigenpair residual " + lr[1] + " at h = " + h[i]);
            e[i] = Math.abs(lr[0] + J01_SQUARED);
        }
        assertTrue(e[3] < 2e-2, "error at h = 0.025: " + e[3]);
        for (int i = 1; i < h.length; i++) {
            double p = Pencil.order(e[i - 1], e[i], 2);
            assertTrue(p >= 1.7 && p <= 2.3, "order " + h[i - 1] + " -> " + h[i] + " = " + p + ", errors "
                    + java.util.Arrays.toString(e));
        }
    }
}
