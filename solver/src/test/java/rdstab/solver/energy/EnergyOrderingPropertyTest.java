package rdstab.solver.energy;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Random;
import org.ejml.data.DMatrixSparseCSC;
import org.junit.jupiter.api.Test;
import rdstab.mesh.assembly.DriftScheme;
import rdstab.mesh.assembly.FaceAverage;
import rdstab.mesh.assembly.FiniteVolume1D;
import rdstab.mesh.assembly.PointKernel;
import rdstab.mesh.boundary.BoundaryCondition;
import rdstab.mesh.grid.Geometry1D;
import rdstab.mesh.grid.Grid1D;
import rdstab.solver.eigen.DenseEigenSolver;
import rdstab.solver.eigen.EigenOptions;
import rdstab.solver.eigen.EigenPair;

/**
 * spectral abscissa ≤ numerical abscissa ≤ a-priori bound (Rayleigh-quotient bound on the real part of an
 * eigenvalue, and Weyl's inequality; common practice, no source) over 200 random small linear problems:
 * one or two fields, random diffusivities, drift, reaction matrix R (x-dependent), conditions, drift
 * scheme and shape, each in unit weights, in weights chosen to minimise the bound and in random weights.
 * A seeded JUnit loop (no property-testing library).
 */
class EnergyOrderingPropertyTest {

    /** Linear kernel: s = R(x) u with R(x) = R0 + x R1, constant diffusivities, constant drift per field. */
    static PointKernel linear(double[][] r0, double[][] r1, double[] k, double[] c, boolean withSource) {
        int n = k.length;
        return new PointKernel() {
            @Override public int fieldCount() { return n; }

            @Override public void source(double[] x, double[] u, double[] s, double[][] d) {
                for (int f = 0; f < n; f++) {
                    s[f] = 0;
                    for (int g = 0; g < n; g++) {
                        d[f][g] = withSource ? r0[f][g] + x[0] * r1[f][g] : 0;
                        s[f] += d[f][g] * u[g];
                    }
                }
            }

            @Override public void diffusivity(double[] x, double[] u, double[] kk, double[][] d) {
                for (int f = 0; f < n; f++) {
                    kk[f] = k[f];
                    java.util.Arrays.fill(d[f], 0);
                }
            }

            @Override public double drift(int field, double[] x, int dir) { return c[field]; }

            @Override public boolean hasDrift() { return c[0] != 0 || c[n - 1] != 0; }
        };
    }

    static BoundaryCondition randomCondition(Random rnd) {
        return switch (rnd.nextInt(3)) {
            case 0 -> new BoundaryCondition.FixedValue(0);
            case 1 -> new BoundaryCondition.FixedFlux(0);
            default -> new BoundaryCondition.Convective(0.1 + 5 * rnd.nextDouble(), 0);
        };
    }

    @Test
    void orderingHoldsOnRandomProblems() {
        Random rnd = new Random(4242);
        int nonNormal = 0;
        for (int trial = 0; trial < 200; trial++) {
            int nf = 1 + rnd.nextInt(2);
            double[][] r0 = new double[nf][nf];
            double[][] r1 = new double[nf][nf];
            double[] k = new double[nf];
            double[] c = new double[nf];
            for (int f = 0; f < nf; f++) {
                k[f] = 0.05 + rnd.nextDouble();
                c[f] = rnd.nextBoolean() ? 0 : 4 * (rnd.nextDouble() - 0.5);
                for (int g = 0; g < nf; g++) {
                    r0[f][g] = 6 * (rnd.nextDouble() - 0.5);
                    r1[f][g] = 2 * (rnd.nextDouble() - 0.5);
                }
            }
            Geometry1D geo = Geometry1D.values()[rnd.nextInt(3)];
            double a = geo == Geometry1D.SLAB || rnd.nextBoolean() ? 0.0 : 0.3;
            Grid1D grid = Grid1D.uniform(geo, a, a + 0.5 + rnd.nextDouble(), 6 + rnd.nextInt(8));
            BoundaryCondition[] left = new BoundaryCondition[nf];
            BoundaryCondition[] right = new BoundaryCondition[nf];
            for (int f = 0; f < nf; f++) {
                left[f] = grid.hasCentre() ? new BoundaryCondition.FixedFlux(0) : randomCondition(rnd);
                right[f] = randomCondition(rnd);
            }
            DriftScheme scheme = rnd.nextBoolean() ? DriftScheme.CENTRED : DriftScheme.UPWIND;
            FiniteVolume1D full = new FiniteVolume1D(grid, linear(r0, r1, k, c, true), left, right, FaceAverage.ARITHMETIC, scheme);
            FiniteVolume1D transport = new FiniteVolume1D(grid, linear(r0, r1, k, c, false), left, right,
                    FaceAverage.ARITHMETIC, scheme);
            double[] u = new double[full.unknowns()];
            DMatrixSparseCSC j = full.jacobian(u);
            DMatrixSparseCSC t = transport.jacobian(u);
            DMatrixSparseCSC m = full.mass();
            List<EigenPair> pairs = new DenseEigenSolver().rightmost(j, m, EigenOptions.rightmost(1, false));
            assertTrue(pairs.get(0).residual() < 1e-10, "residual " + pairs.get(0).residual());
            double alpha = pairs.get(0).re();
            double[] random = new double[nf];
            for (int f = 0; f < nf; f++) {
                random[f] = Math.exp(4 * (rnd.nextDouble() - 0.5));
            }
            double[] ones = new double[nf];
            java.util.Arrays.fill(ones, 1.0);
            EnergyRates chosen = EnergyAnalysis.compute(full, j, t, m, null);
            for (double[] w : new double[][] {ones, random, chosen.weights()}) {
                EnergyRates e = EnergyAnalysis.compute(full, j, t, m, w);
                double tol = 1e-9 * Math.max(1, Math.abs(e.bound()));
                String at = "trial " + trial + " weights " + java.util.Arrays.toString(w);
                assertTrue(alpha <= e.numericalAbscissa() + tol, at + ": α " + alpha + " > ω " + e.numericalAbscissa());
                assertTrue(e.numericalAbscissa() <= e.bound() + tol, at + ": ω " + e.numericalAbscissa() + " > bound " + e.bound());
            }
            assertTrue(chosen.bound() <= chosen.unitWeightBound() + 1e-9 * Math.max(1, Math.abs(chosen.bound())),
                    "chosen weights never loosen the bound, trial " + trial);
            if (chosen.numericalAbscissa() > alpha + 1e-6) {
                nonNormal++;
            }
        }
        assertTrue(nonNormal > 50, "the sample exercises non-normal operators: " + nonNormal);
    }

    /**
     * Two fields with node-local coupling R = [[−1, 4], [−1, −1]] and equal diffusion, no drift: the symmetric
     * part of W^{1/2} R W^{−1/2} has off-diagonal (4 − w)/(2√w) for w = (1, w), which vanishes at w = 4
     * (analytic, 2×2): ρ_max drops from −1 + 1.5 = 0.5 (unit weights) to −1, and the bound to −μ₁ − 1.
     */
    @Test
    void weightSearchBalancesOppositeSignCoupling() {
        double[][] r0 = {{-1, 4}, {-1, -1}};
        double[][] r1 = {{0, 0}, {0, 0}};
        double[] k = {1, 1};
        double[] c = {0, 0};
        Grid1D grid = Grid1D.uniform(Geometry1D.SLAB, 0, 1, 20);
        BoundaryCondition[] bc = {new BoundaryCondition.FixedValue(0), new BoundaryCondition.FixedValue(0)};
        FiniteVolume1D full = new FiniteVolume1D(grid, linear(r0, r1, k, c, true), bc, bc);
        FiniteVolume1D transport = new FiniteVolume1D(grid, linear(r0, r1, k, c, false), bc, bc);
        double[] u = new double[full.unknowns()];
        EnergyRates e = EnergyAnalysis.compute(full, full.jacobian(u), transport.jacobian(u), full.mass(), null);
        assertEquals("chosen to minimise the bound", e.weightChoice());
        assertEquals(4.0, e.weights()[1] / e.weights()[0], 1e-6);
        assertEquals(-1.0, e.reactionRate(), 1e-9);
        assertEquals(0.5 - e.poincare(), e.unitWeightBound(), 1e-9);
        assertEquals(-1.0 - e.poincare(), e.bound(), 1e-9);
        // −μ₁ is the discrete −π² (fixed ends, k = 1), O(h²) (separation of variables)
        assertEquals(Math.PI * Math.PI, e.poincare(), 0.03);
    }
}
