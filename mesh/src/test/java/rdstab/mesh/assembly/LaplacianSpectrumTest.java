package rdstab.mesh.assembly;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.function.IntFunction;

import org.junit.jupiter.api.Test;

import rdstab.mesh.boundary.BoundaryCondition;
import rdstab.mesh.boundary.BoundaryCondition.FixedValue;
import rdstab.mesh.grid.Geometry1D;
import rdstab.mesh.grid.Grid1D;

/**
 * Spectrum of the 1D Laplacian (k = 1, s = 0) on (0, L) with u = 0 at both ends. By separation of
 * variables the eigenvalues of u'' = λu are λ_n = −(nπ/L)², n = 1, 2, … The discrete pencil
 * J x = λ M x is symmetric (lumped M), so EJML's dense symmetric eigen-decomposition of
 * M^{-1/2} J M^{-1/2} is the oracle.
 */
class LaplacianSpectrumTest {

    private static final double L = 2.0;
    private static final int MODES = 3;

    private static FiniteVolume1D laplacian(Grid1D g) {
        BoundaryCondition[] zero = {new FixedValue(0.0)};
        return new FiniteVolume1D(g, Kernels.linear(1.0, 0.0), zero, zero);
    }

    /** Errors |λ_n,h − λ_n| for n = 1..MODES on the grid. */
    private static double[] errors(Grid1D g) {
        FiniteVolume1D d = laplacian(g);
        double[] lam = Spectra.symmetricPencil(d, new double[d.unknowns()]);
        double[] e = new double[MODES];
        for (int n = 1; n <= MODES; n++) {
            double exact = -Math.pow(n * Math.PI / L, 2);
            e[n - 1] = Math.abs(lam[n - 1] - exact);
            assertTrue(e[n - 1] < 0.05 * Math.abs(exact), "mode " + n + ": " + lam[n - 1] + " vs " + exact);
        }
        return e;
    }

    private static void checkOrder(IntFunction<Grid1D> gridOf, double lo, double hi) {
        double[] e20 = errors(gridOf.apply(20));
        double[] e40 = errors(gridOf.apply(40));
        double[] e80 = errors(gridOf.apply(80));
        for (int n = 0; n < MODES; n++) {
            double p1 = Spectra.order(e20[n], e40[n], 2);
            double p2 = Spectra.order(e40[n], e80[n], 2);
            assertTrue(p1 >= lo && p1 <= hi, "mode " + (n + 1) + " order 20->40 = " + p1);
            assertTrue(p2 >= lo && p2 <= hi, "mode " + (n + 1) + " order 40->80 = " + p2);
        }
    }

    @Test
    void uniformGridConvergesAtSecondOrder() {
        checkOrder(n -> Grid1D.uniform(Geometry1D.SLAB, 0, L, n), 1.9, 2.1);
    }

    /**
     * tanh clustering at both ends, strength 2 (cell ratio ≈ 3.6 between centre and ends): the map
     * is smooth, so second order is expected; the band is wider (1.8–2.2) because the error
     * constant changes between the coarse, pre-asymptotic grids.
     */
    @Test
    void stretchedGridConvergesAtSecondOrder() {
        checkOrder(n -> Grid1D.tanh(Geometry1D.SLAB, 0, L, n, 2.0, Grid1D.Cluster.BOTH), 1.8, 2.2);
    }

    /** Lumped M and no drift make J symmetric (the self-adjoint case), also on a stretched grid. */
    @Test
    void jacobianIsSymmetric() {
        FiniteVolume1D d = laplacian(Grid1D.geometric(Geometry1D.SLAB, 0, L, 15, 1.2));
        assertEquals(0.0, Spectra.asymmetry(d.jacobian(new double[d.unknowns()])), 1e-14);
    }
}
