package rdstab.solver.eigen;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.util.List;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixSparseCSC;
import org.junit.jupiter.api.Test;
import rdstab.solver.linear.SparseOps;

/**
 * Cases every {@link EigenSolver} must pass. Sources: separation of variables for the discrete
 * Dirichlet Laplacian and the centred convection–diffusion operator (tridiagonal Toeplitz eigenvalues),
 * EJML's general dense QR of M⁻¹J as an independent oracle.
 */
abstract class EigenSolverContractTest {

    /** The solver under test. */
    abstract EigenSolver solver();

    /** False for solvers restricted to symmetric J. */
    boolean handlesNonsymmetric() {
        return true;
    }

    static final double RESIDUAL_LIMIT = 1e-8;

    List<EigenPair> solve(DMatrixSparseCSC j, DMatrixSparseCSC m, int k, boolean symmetric) {
        List<EigenPair> pairs = solver().rightmost(j, m, EigenOptions.rightmost(k, symmetric));
        assertResidualsSmall(pairs);
        return pairs;
    }

    static void assertResidualsSmall(List<EigenPair> pairs) {
        for (EigenPair p : pairs) {
            assertTrue(p.residual() < RESIDUAL_LIMIT, "residual " + p.residual() + " of λ = " + p.re() + " + " + p.im() + "i");
        }
    }

    static void assertRelative(double expected, double actual, double tol) {
        assertEquals(expected, actual, tol * Math.max(1.0, Math.abs(expected)), "expected " + expected + " got " + actual);
    }

    @Test
    void laplacian1dMatchesDiscreteAnalyticSpectrum() {
        int n = 200;
        List<EigenPair> pairs = solve(TestProblems.laplacian1d(n, 1.0), TestProblems.identity(n), 4, true);
        assertEquals(4, pairs.size());
        for (int p = 1; p <= 4; p++) {
            assertRelative(TestProblems.laplacian1dEigenvalue(p, n, 1.0), pairs.get(p - 1).re(), 1e-10);
            assertEquals(0.0, pairs.get(p - 1).im());
        }
    }

    @Test
    void laplacian1dConvergesAtSecondOrderToContinuousEigenvalue() {
        // continuous Dirichlet eigenvalue of u'' on (0, 2): −(π/2)²·p², p = 2
        double len = 2.0;
        double exact = -Math.pow(2 * Math.PI / len, 2);
        double[] err = new double[3];
        int[] sizes = {79, 159, 319};
        for (int g = 0; g < 3; g++) {
            List<EigenPair> pairs = solve(TestProblems.laplacian1d(sizes[g], len), TestProblems.identity(sizes[g]), 2, true);
            err[g] = Math.abs(pairs.get(1).re() - exact);
        }
        for (int g = 0; g < 2; g++) {
            double order = Math.log(err[g] / err[g + 1]) / Math.log(2.0);
            assertTrue(order > 1.9 && order < 2.1, "observed order " + order);
        }
    }

    @Test
    void laplacian2dKeepsTheDegeneratePair() {
        int nn = 12;
        double h = 1.0 / (nn + 1);
        List<EigenPair> pairs = solve(TestProblems.laplacian2d(nn), TestProblems.identity(nn * nn), 3, true);
        double s1 = Math.sin(Math.PI * h / 2);
        double s2 = Math.sin(2 * Math.PI * h / 2);
        double l11 = -4 / (h * h) * (2 * s1 * s1);
        double l12 = -4 / (h * h) * (s1 * s1 + s2 * s2);
        assertRelative(l11, pairs.get(0).re(), 1e-10);
        assertRelative(l12, pairs.get(1).re(), 1e-10);
        assertRelative(l12, pairs.get(2).re(), 1e-10);
        assertIndependent(pairs.get(1), pairs.get(2), TestProblems.identity(nn * nn));
    }

    @Test
    void generalizedProblemWithDiagonalWeightsMatchesOracle() {
        int n = 120;
        double[] w = new double[n];
        for (int i = 0; i < n; i++) {
            w[i] = 1.0 + 0.5 * Math.sin(0.37 * i); // uneven cell volumes
        }
        DMatrixSparseCSC j = TestProblems.laplacian1d(n, 1.0);
        DMatrixSparseCSC m = TestProblems.diagonal(w);
        List<EigenPair> pairs = solve(j, m, 5, true);
        List<Complex_F64> oracle = TestProblems.oracle(j, m);
        for (int i = 0; i < 5; i++) {
            assertRelative(oracle.get(i).real, pairs.get(i).re(), 1e-8);
        }
        for (EigenPair p : pairs) {
            double[] mx = new double[n];
            SparseOps.multiply(m, p.vectorRe(), mx);
            assertEquals(1.0, EigenChecks.dot(p.vectorRe(), mx), 1e-10, "unit M-norm");
        }
    }

    @Test
    void convectionDiffusionMatchesClosedFormAndContinuousLimit() {
        assumeTrue(handlesNonsymmetric());
        // u_t = D u'' − c u' on (0, L), Dirichlet, centred differences: tridiagonal Toeplitz with
        // sub = D/h² + c/(2h), diag = −2D/h², sup = D/h² − c/(2h). A tridiagonal Toeplitz matrix has
        // eigenvalues diag + 2√(sub·sup) cos(pπ/(N+1)); sub·sup = (D/h²)²(1 − P²), P = ch/(2D) < 1, so
        // λ_p = −2D/h² + 2(D/h²)√(1−P²) cos(pπ/(N+1)). Continuous limit (substitute u = e^{cx/2D} w):
        // −D(pπ/L)² − c²/(4D).
        double d = 0.5;
        double c = 1.2;
        double len = 3.0;
        int[] sizes = {99, 199, 399};
        double[] err = new double[3];
        for (int g = 0; g < 3; g++) {
            int n = sizes[g];
            double h = len / (n + 1);
            double pe = c * h / (2 * d);
            DMatrixSparseCSC j = TestProblems.tridiagonal(n, d / (h * h) + c / (2 * h), -2 * d / (h * h), d / (h * h) - c / (2 * h));
            List<EigenPair> pairs = solve(j, TestProblems.identity(n), 3, false);
            for (int p = 1; p <= 3; p++) {
                double discrete = -2 * d / (h * h) + 2 * (d / (h * h)) * Math.sqrt(1 - pe * pe) * Math.cos(p * Math.PI / (n + 1));
                assertRelative(discrete, pairs.get(p - 1).re(), 1e-9);
                assertEquals(0.0, pairs.get(p - 1).im(), 1e-9 * Math.abs(discrete));
            }
            err[g] = Math.abs(pairs.get(0).re() - (-d * Math.pow(Math.PI / len, 2) - c * c / (4 * d)));
        }
        for (int g = 0; g < 2; g++) {
            double order = Math.log(err[g] / err[g + 1]) / Math.log((sizes[g + 1] + 1.0) / (sizes[g] + 1.0));
            assertTrue(order > 1.9 && order < 2.1, "observed order " + order);
        }
    }

    @Test
    void rotationalCouplingHasAnalyticComplexSpectrum() {
        assumeTrue(handlesNonsymmetric());
        // K = [[a, −b], [b, a]] with equal diffusion D: J = K ⊗ I + D I ⊗ Δ_h, so λ = a + D·μ_p ± i b
        // with μ_p the discrete Dirichlet eigenvalues (K and Δ_h commute).
        int nodes = 60;
        double a = 0.3;
        double b = 2.0;
        double dif = 0.01;
        DMatrixSparseCSC j = TestProblems.twoSpecies(nodes, 1.0, dif, dif, a, -b, b, a);
        List<EigenPair> pairs = solve(j, TestProblems.identity(2 * nodes), 4, false);
        assertEquals(4, pairs.size());
        for (int p = 1; p <= 2; p++) {
            double re = a + dif * TestProblems.laplacian1dEigenvalue(p, nodes, 1.0);
            EigenPair up = pairs.get(2 * p - 2);
            EigenPair down = pairs.get(2 * p - 1);
            assertRelative(re, up.re(), 1e-9);
            assertRelative(b, up.im(), 1e-9);
            assertEquals(up.re(), down.re(), 0.0, "conjugate pair adjacent");
            assertEquals(-up.im(), down.im(), 0.0, "conjugate pair adjacent");
        }
    }

    @Test
    void brusselatorLinearisationMatchesDenseOracle() {
        assumeTrue(handlesNonsymmetric());
        // Brusselator kinetics linearised at (A, B/A): K = [[B−1, A²], [−B, −A²]], A = 1, B = 1.7,
        // unequal diffusion; the spectrum mixes complex pairs (low modes) and real eigenvalues.
        double aa = 1.0;
        double bb = 1.7;
        DMatrixSparseCSC j = TestProblems.twoSpecies(60, 10.0, 0.2, 1.0, bb - 1, aa * aa, -bb, -aa * aa);
        DMatrixSparseCSC m = TestProblems.identity(120);
        List<EigenPair> pairs = solve(j, m, 6, false);
        List<Complex_F64> oracle = TestProblems.oracle(j, m);
        assertTrue(pairs.size() >= 6);
        for (int i = 0; i < pairs.size(); i++) {
            Complex_F64 z = oracle.get(i);
            double scale = Math.max(1.0, Math.hypot(z.real, z.imaginary));
            assertEquals(z.real, pairs.get(i).re(), 1e-8 * scale, "Re of #" + i);
            assertEquals(z.imaginary, pairs.get(i).im(), 1e-8 * scale, "Im of #" + i);
        }
        assertTrue(pairs.get(0).im() > 0, "rightmost is a complex pair with positive Im first");
        assertEquals(-pairs.get(0).im(), pairs.get(1).im(), 0.0);
    }

    @Test
    void singleUnknown() {
        DMatrixSparseCSC j = TestProblems.diagonal(new double[] {-3.0});
        List<EigenPair> pairs = solve(j, TestProblems.diagonal(new double[] {2.0}), 1, true);
        assertEquals(1, pairs.size());
        assertRelative(-1.5, pairs.get(0).re(), 1e-14);
        assertRelative(1 / Math.sqrt(2.0), Math.abs(pairs.get(0).vectorRe()[0]), 1e-14);
    }

    @Test
    void askingForNearlyAllEigenvalues() {
        int n = 6;
        List<EigenPair> pairs = solve(TestProblems.laplacian1d(n, 1.0), TestProblems.identity(n), n - 1, true);
        assertEquals(n - 1, pairs.size());
        for (int p = 1; p < n; p++) {
            assertRelative(TestProblems.laplacian1dEigenvalue(p, n, 1.0), pairs.get(p - 1).re(), 1e-12);
        }
    }

    @Test
    void userShiftExactlyOnAnEigenvalue() {
        int n = 150;
        double top = TestProblems.laplacian1dEigenvalue(1, n, 1.0);
        EigenOptions o = EigenOptions.rightmost(3, true).withShift(top);
        List<EigenPair> pairs = solver().rightmost(TestProblems.laplacian1d(n, 1.0), TestProblems.identity(n), o);
        assertResidualsSmall(pairs);
        for (int p = 1; p <= 3; p++) {
            assertRelative(TestProblems.laplacian1dEigenvalue(p, n, 1.0), pairs.get(p - 1).re(), 1e-10);
        }
    }

    @Test
    void zeroOperatorHasOnlyZeroEigenvalues() {
        int n = 80;
        DMatrixSparseCSC j = new DMatrixSparseCSC(n, n, 0);
        List<EigenPair> pairs = solve(j, TestProblems.identity(n), 3, true);
        assertEquals(3, pairs.size());
        for (EigenPair p : pairs) {
            assertEquals(0.0, p.re(), 1e-12);
            assertEquals(0.0, p.im(), 1e-12);
        }
    }

    @Test
    void doubledSpectrumKeepsMultiplicity() {
        // block-diagonal J = diag(Δ_h, Δ_h): every eigenvalue twice
        int half = 70;
        DMatrixSparseCSC one = TestProblems.laplacian1d(half, 1.0);
        org.ejml.data.DMatrixSparseTriplet t = new org.ejml.data.DMatrixSparseTriplet(2 * half, 2 * half, 6 * half);
        for (int col = 0; col < half; col++) {
            for (int q = one.col_idx[col]; q < one.col_idx[col + 1]; q++) {
                t.addItem(one.nz_rows[q], col, one.nz_values[q]);
                t.addItem(one.nz_rows[q] + half, col + half, one.nz_values[q]);
            }
        }
        DMatrixSparseCSC m = TestProblems.identity(2 * half);
        List<EigenPair> pairs = solve(TestProblems.csc(t), m, 4, true);
        for (int i = 0; i < 4; i++) {
            assertRelative(TestProblems.laplacian1dEigenvalue(i / 2 + 1, half, 1.0), pairs.get(i).re(), 1e-10);
        }
        assertIndependent(pairs.get(0), pairs.get(1), m);
        assertIndependent(pairs.get(2), pairs.get(3), m);
    }

    /** Two unit M-norm real vectors of one eigenvalue must span a plane: |cos angle| &lt; 0.99. */
    static void assertIndependent(EigenPair p, EigenPair q, DMatrixSparseCSC m) {
        double[] mq = new double[q.vectorRe().length];
        SparseOps.multiply(m, q.vectorRe(), mq);
        double cos = Math.abs(EigenChecks.dot(p.vectorRe(), mq));
        assertTrue(cos < 0.99, "eigenvectors of a double eigenvalue are parallel (|cos| = " + cos + ")");
    }
}
