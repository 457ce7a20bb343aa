package rdstab.mesh.assembly;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

import rdstab.mesh.boundary.BoundaryCondition;
import rdstab.mesh.boundary.BoundaryCondition.Convective;
import rdstab.mesh.boundary.BoundaryCondition.FixedFlux;
import rdstab.mesh.boundary.BoundaryCondition.FixedValue;
import rdstab.mesh.boundary.BoundaryCondition.Inlet;
import rdstab.mesh.grid.Geometry1D;
import rdstab.mesh.grid.Grid1D;

/** Input validation, kernel error reporting, layout and the pure-diffusion variant. */
class FiniteVolume1DValidationTest {

    private static final BoundaryCondition[] ZERO = {new FixedValue(0)};
    private static final Grid1D SLAB = Grid1D.uniform(Geometry1D.SLAB, 0, 1, 4);

    @Test
    void missingLeftConditionOnSlabIsRejected() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new FiniteVolume1D(SLAB, Kernels.linear(1, 0), null, ZERO));
        assertTrue(e.getMessage().contains("left") && e.getMessage().contains("got none"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> new FiniteVolume1D(SLAB, Kernels.linear(1, 0), new BoundaryCondition[] {null}, ZERO));
        assertTrue(e.getMessage().contains("missing"), e.getMessage());
    }

    @Test
    void hollowBodyNeedsLeftConditionAndCentreRejectsOne() {
        Grid1D hollow = Grid1D.uniform(Geometry1D.CYLINDER, 0.2, 1, 4);
        assertThrows(IllegalArgumentException.class, () -> new FiniteVolume1D(hollow, Kernels.linear(1, 0), null, ZERO));
        Grid1D solid = Grid1D.uniform(Geometry1D.CYLINDER, 0, 1, 4);
        FiniteVolume1D ok = new FiniteVolume1D(solid, Kernels.linear(1, 0), null, ZERO);
        assertEquals(4, ok.unknowns());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new FiniteVolume1D(solid, Kernels.linear(1, 0), new BoundaryCondition[] {new Convective(1, 0)}, ZERO));
        assertTrue(e.getMessage().contains("symmetry centre"), e.getMessage());
    }

    @Test
    void inletWithoutDriftIsRefused() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new FiniteVolume1D(SLAB, Kernels.linear(1, 0), new BoundaryCondition[] {new Inlet(1)}, ZERO));
        assertTrue(e.getMessage().contains("inlet condition of field 0 at the left end needs a drift"), e.getMessage());
    }

    @Test
    void nonPositiveDiffusivityNamesNodeAndValue() {
        FiniteVolume1D d = new FiniteVolume1D(SLAB, Kernels.badAfter(0.6, -2.0, true), ZERO, ZERO);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> d.residual(new double[d.unknowns()], new double[d.unknowns()]));
        assertTrue(e.getMessage().contains("got -2.0") && e.getMessage().contains("node 3")
                && e.getMessage().contains("x = 0.75"), e.getMessage());
        FiniteVolume1D z = new FiniteVolume1D(SLAB, Kernels.badAfter(0.6, 0.0, true), ZERO, ZERO);
        assertThrows(IllegalArgumentException.class, () -> z.jacobian(new double[z.unknowns()]));
    }

    @Test
    void nonFiniteSourceThrowsArithmeticException() {
        FiniteVolume1D d = new FiniteVolume1D(SLAB, Kernels.badAfter(0.3, Double.NaN, false), ZERO, ZERO);
        ArithmeticException e = assertThrows(ArithmeticException.class,
                () -> d.jacobian(new double[d.unknowns()]));
        assertTrue(e.getMessage().contains("node 2") && e.getMessage().contains("x = 0.5")
                && e.getMessage().contains("field values [0.0]"), e.getMessage());
    }

    /** Node-major numbering skipping fixed values; nodal round trip. */
    @Test
    void layoutIsNodeMajorAndRoundTrips() {
        Grid1D g = Grid1D.uniform(Geometry1D.SLAB, 0, 1, 3);
        BoundaryCondition[] left = {new FixedValue(0.3), new FixedFlux(0)};
        BoundaryCondition[] right = {new Convective(1, 0), new FixedValue(0.7)};
        FiniteVolume1D d = new FiniteVolume1D(g, Kernels.coupled(0), left, right);
        assertEquals(6, d.unknowns());
        assertEquals(-1, d.unknownIndex(0, 0));
        assertEquals(0, d.unknownIndex(1, 0));
        assertEquals(1, d.unknownIndex(0, 1));
        assertEquals(2, d.unknownIndex(1, 1));
        assertEquals(5, d.unknownIndex(0, 3));
        assertEquals(-1, d.unknownIndex(1, 3));
        double[] u = {1, 2, 3, 4, 5, 6};
        double[][] nodal = d.nodalValues(u);
        assertArrayEquals(new double[] {0.3, 2, 4, 6}, nodal[0]);
        assertArrayEquals(new double[] {1, 3, 5, 0.7}, nodal[1]);
        assertArrayEquals(new double[] {0, 2, 4, 6}, d.nodalPerturbation(u)[0]);
        assertArrayEquals(u, d.unknownsFromNodal(nodal));
    }

    /**
     * Pure-diffusion variant of a Frank-Kamenetskii sphere with u = 0.2 at r = 1: homogeneous, so
     * F(0) = 0, and its slowest mode is the Dirichlet sphere mode sin(πr)/r with λ = −π²
     * (separation of variables; spherical Bessel j₀). Tolerance 2e-3 relative: the O(h²) error on
     * 80 cells, about π²h²/12 ≈ 1e-4 relative (from memory, constant not derived), with margin.
     */
    @Test
    void pureDiffusionGivesHomogeneousDirichletSphere() {
        Grid1D g = Grid1D.uniform(Geometry1D.SPHERE, 0, 1, 80);
        FiniteVolume1D fk = new FiniteVolume1D(g, Kernels.frankKamenetskii(0.5), null,
                new BoundaryCondition[] {new FixedValue(0.2)});
        double[] state = new double[fk.unknowns()];
        java.util.Arrays.fill(state, 1.0);
        FiniteVolume1D pd = fk.pureDiffusion(state);
        double[] f = new double[pd.unknowns()];
        pd.residual(new double[pd.unknowns()], f);
        for (double v : f) {
            assertEquals(0.0, v, 0.0);
        }
        double lambda1 = Spectra.symmetricPencil(pd, new double[pd.unknowns()])[0];
        double exact = -Math.PI * Math.PI;
        assertEquals(exact, lambda1, 2e-3 * Math.PI * Math.PI);
        double lambdaFk = Spectra.symmetricPencil(fk, state)[0];
        assertTrue(lambdaFk > lambda1 + 0.5, "the FK source shifts the spectrum up by about δe: " + lambdaFk);
    }
}
