package rdstab.mesh.assembly;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;

import org.ejml.data.DMatrixSparseCSC;
import org.ejml.sparse.csc.CommonOps_DSCC;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import rdstab.mesh.boundary.BoundaryCondition;
import rdstab.mesh.boundary.BoundaryCondition.Convective;
import rdstab.mesh.boundary.BoundaryCondition.FixedFlux;
import rdstab.mesh.boundary.BoundaryCondition.FixedValue;
import rdstab.mesh.grid.Geometry1D;
import rdstab.mesh.grid.Grid1D;

/**
 * Exact Jacobian against central finite differences of residual() (common practice, no single
 * source): (F(u + δe_c) − F(u − δe_c))/(2δ) with δ = 1e-6.
 *
 * <p>Tolerance 1e-6·max(1, max|J|): the truncation error δ²|F'''|/6 is ~1e-12 times the entry
 * scale and the rounding error ε|F|/δ ~ 1e-16·10/1e-6 = 1e-9, so the tolerance leaves about three
 * orders of margin, while a missing or wrong term (e.g. ∂k/∂u, checked below) gives errors of order
 * 0.1·max|J|.
 */
class JacobianFiniteDifferenceTest {

    private static final double DELTA = 1e-6;
    private static final double TOL = 1e-6;
    private static final BoundaryCondition[] BCS = {
        new FixedValue(0.3), new FixedFlux(0.4), new Convective(2.0, 0.5)};

    static List<Arguments> cases() {
        List<Grid1D> grids = List.of(
                Grid1D.geometric(Geometry1D.SLAB, 0.2, 1.3, 8, 1.1),
                Grid1D.uniform(Geometry1D.CYLINDER, 0.0, 1.0, 8),
                Grid1D.tanh(Geometry1D.CYLINDER, 0.5, 1.5, 8, 1.5, Grid1D.Cluster.BOTH),
                Grid1D.uniform(Geometry1D.SPHERE, 0.0, 1.0, 8),
                Grid1D.geometric(Geometry1D.SPHERE, 0.5, 1.5, 8, 0.9));
        List<Arguments> out = new ArrayList<>();
        for (Grid1D g : grids) {
            out.add(Arguments.of(g, 0.0, FaceAverage.ARITHMETIC, DriftScheme.CENTRED));
            out.add(Arguments.of(g, 1.5, FaceAverage.HARMONIC, DriftScheme.CENTRED));
            out.add(Arguments.of(g, 1.5, FaceAverage.ARITHMETIC, DriftScheme.UPWIND));
        }
        return out;
    }

    @ParameterizedTest(name = "{0} drift={1} {2} {3}")
    @MethodSource("cases")
    void exactJacobianMatchesFiniteDifferences(Grid1D grid, double drift, FaceAverage avg, DriftScheme scheme) {
        Random rnd = new Random(42);
        for (int p = 0; p < 3; p++) {
            for (int q = 0; q < 3; q++) {
                BoundaryCondition[] left = grid.hasCentre() ? null : new BoundaryCondition[] {BCS[p], BCS[(p + 1) % 3]};
                BoundaryCondition[] right = {BCS[q], BCS[(q + 2) % 3]};
                FiniteVolume1D d = new FiniteVolume1D(grid, Kernels.coupled(drift), left, right, avg, scheme);
                double[] u = randomState(d, rnd);
                double err = maxJacobianError(d, u);
                assertTrue(err <= TOL, "left " + p + " right " + q + ": max |J - J_fd| / scale = " + err);
            }
        }
    }

    /** Danckwerts inlet (Robin with h = inflow speed) on the drifting field, at either end, both schemes. */
    @ParameterizedTest(name = "{0}")
    @MethodSource("inletSchemes")
    void inletJacobianMatchesFiniteDifferences(DriftScheme scheme) {
        Random rnd = new Random(11);
        // coupled(1.5): c0 = 1.5 (0.7 - x) is > 0 at x = 0.2 and < 0 at x = 1.3: flow enters at both ends
        Grid1D g = Grid1D.geometric(Geometry1D.SLAB, 0.2, 1.3, 8, 1.1);
        BoundaryCondition[][] choices = {
            {new BoundaryCondition.Inlet(0.8), BCS[1]}, {new BoundaryCondition.Inlet(-0.2), BCS[2]}};
        for (BoundaryCondition[] left : choices) {
            for (BoundaryCondition[] right : choices) {
                FiniteVolume1D d = new FiniteVolume1D(g, Kernels.coupled(1.5), left, right, FaceAverage.ARITHMETIC, scheme);
                double err = maxJacobianError(d, randomState(d, rnd));
                assertTrue(err <= TOL, "inlet " + scheme + ": max |J - J_fd| / scale = " + err);
            }
        }
    }

    static List<DriftScheme> inletSchemes() {
        return List.of(DriftScheme.CENTRED, DriftScheme.UPWIND);
    }

    /** The check can fail: a kernel that hides ∂k/∂u gives a Jacobian the FD comparison rejects. */
    @Test
    void detectsMissingDiffusivityDerivative() {
        PointKernel honest = Kernels.coupled(0.0);
        PointKernel lying = new PointKernel() {
            @Override public int fieldCount() { return 2; }
            @Override public void source(double[] x, double[] u, double[] s, double[][] d) { honest.source(x, u, s, d); }
            @Override public void diffusivity(double[] x, double[] u, double[] k, double[][] d) {
                honest.diffusivity(x, u, k, d);
                for (double[] row : d) {
                    Arrays.fill(row, 0.0);
                }
            }
            @Override public boolean diffusivityDependsOnFields() { return true; }
        };
        Grid1D g = Grid1D.uniform(Geometry1D.SLAB, 0, 1, 8);
        BoundaryCondition[] bc = {BCS[2], BCS[2]};
        FiniteVolume1D d = new FiniteVolume1D(g, lying, bc, bc);
        double err = maxJacobianError(d, randomState(d, new Random(7)));
        assertTrue(err > 100 * TOL, "FD check should detect the missing dk/du term, error " + err);
    }

    @Test
    void patternIsFixedSortedAndFreeOfDuplicates() {
        Grid1D g = Grid1D.uniform(Geometry1D.SPHERE, 0, 1, 6);
        BoundaryCondition[] right = {BCS[2], BCS[0]};
        FiniteVolume1D d = new FiniteVolume1D(g, Kernels.coupled(1.0), null, right);
        Random rnd = new Random(3);
        DMatrixSparseCSC j1 = d.jacobian(randomState(d, rnd));
        DMatrixSparseCSC j2 = d.jacobian(randomState(d, rnd));
        assertTrue(CommonOps_DSCC.checkStructure(j1), "valid CSC structure");
        assertTrue(j1.indicesSorted && CommonOps_DSCC.checkSortedFlag(j1), "row indices sorted");
        assertArrayEquals(Arrays.copyOf(j1.col_idx, j1.numCols + 1), Arrays.copyOf(j2.col_idx, j2.numCols + 1));
        assertArrayEquals(Arrays.copyOf(j1.nz_rows, j1.nz_length), Arrays.copyOf(j2.nz_rows, j2.nz_length));
        for (int c = 0; c < j1.numCols; c++) {
            for (int k = j1.col_idx[c] + 1; k < j1.col_idx[c + 1]; k++) {
                assertTrue(j1.nz_rows[k] > j1.nz_rows[k - 1], "strictly increasing rows in column " + c);
            }
        }
        assertEquals(d.unknowns(), j1.numRows);
    }

    static double[] randomState(Discretization d, Random rnd) {
        double[] u = new double[d.unknowns()];
        for (int i = 0; i < u.length; i++) {
            u[i] = 0.1 + 0.8 * rnd.nextDouble();
        }
        return u;
    }

    /** max over entries of |J − J_fd| divided by max(1, max|J|). */
    static double maxJacobianError(Discretization d, double[] u) {
        int n = d.unknowns();
        DMatrixSparseCSC j = d.jacobian(u);
        double[] fp = new double[n];
        double[] fm = new double[n];
        double scale = 1;
        double err = 0;
        for (int c = 0; c < n; c++) {
            double[] up = u.clone();
            double[] um = u.clone();
            up[c] += DELTA;
            um[c] -= DELTA;
            d.residual(up, fp);
            d.residual(um, fm);
            for (int r = 0; r < n; r++) {
                double fd = (fp[r] - fm[r]) / (2 * DELTA);
                double ex = j.get(r, c);
                scale = Math.max(scale, Math.abs(ex));
                err = Math.max(err, Math.abs(fd - ex));
            }
        }
        return err / scale;
    }
}
