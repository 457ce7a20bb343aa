package rdstab.solver.eigen;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.data.DMatrixSparseTriplet;
import org.junit.jupiter.api.Test;
import rdstab.solver.error.ConvergenceException;

/**
 * {@link ThickRestartLanczos} against ARPACK's dsaupd ({@link ShiftInvertLanczos}, an independent
 * implementation of the same mathematics), analytic spectra, and itself (determinism, threads).
 */
class ThickRestartLanczosTest {

    /** Agreement with ARPACK: both converge to ~1e-15 relative residuals, 1e-10 leaves room for rounding. */
    static final double AGREEMENT = 1e-10;
    /** Residual limit, as in the contract test. */
    static final double RESIDUAL_LIMIT = EigenSolverContractTest.RESIDUAL_LIMIT;

    private static Spectrum solveNew(DMatrixSparseCSC j, DMatrixSparseCSC m, int k) {
        Spectrum s = new ThickRestartLanczos().solve(j, m, EigenOptions.rightmost(k, true));
        assertTrue(s.worstResidual() < RESIDUAL_LIMIT, "worst residual " + s.worstResidual());
        return s;
    }

    private static void assertAgreesWithArpack(DMatrixSparseCSC j, DMatrixSparseCSC m, int k) {
        Spectrum ours = solveNew(j, m, k);
        Spectrum arpack = new ShiftInvertLanczos().solve(j, m, EigenOptions.rightmost(k, true));
        assertTrue(arpack.worstResidual() < RESIDUAL_LIMIT, "ARPACK residual " + arpack.worstResidual());
        assertEquals("lanczos-java", ours.method());
        assertEquals("lanczos", arpack.method());
        assertEquals(k, ours.pairs().size());
        for (int i = 0; i < k; i++) {
            double a = arpack.pairs().get(i).re();
            assertEquals(a, ours.pairs().get(i).re(), AGREEMENT * Math.abs(a), "eigenvalue #" + i);
            assertEquals(0.0, ours.pairs().get(i).im());
        }
    }

    @Test
    void agreesWithArpackOn1dLaplacian() {
        int n = 800;
        assertAgreesWithArpack(TestProblems.laplacian1d(n, 1.0), TestProblems.identity(n), 6);
    }

    @Test
    void agreesWithArpackOn2dLaplacian() {
        int nn = 40;
        assertAgreesWithArpack(TestProblems.laplacian2d(nn), TestProblems.identity(nn * nn), 6);
    }

    @Test
    void agreesWithArpackOnFrankKamenetskiiJacobian() {
        // Slab u'' + δ e^u = 0 on (−1, 1), u(±1) = 0: u = ln A − 2 ln cosh(b x) with δA = 2b² and
        // A = cosh² b (Frank-Kamenetskii's closed form, from memory; the lower branch exists for
        // δ < 0.878). Jacobian J = Δ_h + δ diag(e^u) at the nodes, with uneven cell weights M.
        double delta = 0.8;
        double b = lowerBranch(delta);
        int n = 600;
        double h = 2.0 / (n + 1);
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, 3 * n);
        double[] w = new double[n];
        for (int i = 0; i < n; i++) {
            double x = -1 + (i + 1) * h;
            double eu = Math.pow(Math.cosh(b) / Math.cosh(b * x), 2);
            t.addItem(i, i, -2 / (h * h) + delta * eu);
            if (i > 0) {
                t.addItem(i, i - 1, 1 / (h * h));
            }
            if (i + 1 < n) {
                t.addItem(i, i + 1, 1 / (h * h));
            }
            w[i] = 1.0 + 0.3 * Math.cos(7.0 * x);
        }
        DMatrixSparseCSC j = TestProblems.csc(t);
        DMatrixSparseCSC m = TestProblems.diagonal(w);
        assertAgreesWithArpack(j, m, 5);
        // stable lower branch: the rightmost eigenvalue is negative (δ below the fold)
        assertTrue(solveNew(j, m, 1).rightmostRealPart() < 0);
    }

    /** Smallest root b of b = √(δ/2) cosh b by bisection on [0, 1.19] (the fold is at b ≈ 1.1997). */
    private static double lowerBranch(double delta) {
        double lo = 0;
        double hi = 1.19;
        for (int it = 0; it < 200; it++) {
            double mid = 0.5 * (lo + hi);
            if (mid - Math.sqrt(delta / 2) * Math.cosh(mid) < 0) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        assertTrue(Math.abs(lo - Math.sqrt(delta / 2) * Math.cosh(lo)) < 1e-12, "lower branch found");
        return lo;
    }

    /**
     * The six rightmost modes of the nn×nn grid Laplacian against separation of variables:
     * λ_pq = −(4/h²)(sin²(pπh/2) + sin²(qπh/2)); (1,2)/(2,1) and (1,3)/(3,1) are double, and both copies
     * must be there as independent vectors.
     */
    private static void assertSquareModes(List<EigenPair> pairs, int nn, double relative) {
        double h = 1.0 / (nn + 1);
        int[][] pq = {{1, 1}, {1, 2}, {2, 1}, {2, 2}, {1, 3}, {3, 1}};
        for (int i = 0; i < 6; i++) {
            double sp = Math.sin(pq[i][0] * Math.PI * h / 2);
            double sq = Math.sin(pq[i][1] * Math.PI * h / 2);
            double exact = -4 / (h * h) * (sp * sp + sq * sq);
            assertEquals(exact, pairs.get(i).re(), relative * Math.abs(exact), "mode " + pq[i][0] + "," + pq[i][1]);
        }
        EigenSolverContractTest.assertIndependent(pairs.get(1), pairs.get(2), TestProblems.identity(nn * nn));
        EigenSolverContractTest.assertIndependent(pairs.get(4), pairs.get(5), TestProblems.identity(nn * nn));
    }

    @Test
    void returnsBothModesOfDegenerateSquareEigenvalues() {
        int nn = 50;
        assertSquareModes(solveNew(TestProblems.laplacian2d(nn), TestProblems.identity(nn * nn), 6).pairs(), nn, 1e-10);
    }

    @Test
    void blockIterationKeepsBothCopiesWithASmallBasisAndLooseTolerance() {
        // Same analytic spectrum, under the settings where a single-vector Krylov space (one direction per
        // multiple eigenvalue until rounding supplies the second) can stop early: the smallest basis allowed
        // (k + 2 pairs, two blocks more) and a residual tolerance of 1e-8 (Ritz value error ≤ ‖r‖²/gap, so
        // 1e-9 relative is generous). 190² unknowns: long enough for the two-thread paths of the
        // factorization, the solves and the basis products.
        int nn = 190;
        EigenOptions loose = new EigenOptions(6, Double.NaN, true, 1e-8, 3000, 12);
        assertSquareModes(new ThickRestartLanczos().solve(TestProblems.laplacian2d(nn), TestProblems.identity(nn * nn),
                loose).pairs(), nn, 1e-9);
    }

    @Test
    void manyModesOfASmallProblemStillSolve() {
        // 52 of 59 modes: too many for a basis of nev + 2 blocks, so the dense solver answers; the 1D
        // Laplacian's eigenvalues are known in closed form (TestProblems.laplacian1dEigenvalue)
        int n = 59;
        List<EigenPair> pairs = new ThickRestartLanczos().solve(TestProblems.laplacian1d(n, 1.0), TestProblems.identity(n),
                EigenOptions.rightmost(52, true)).pairs();
        assertEquals(52, pairs.size());
        for (int p = 1; p <= 52; p++) {
            double exact = TestProblems.laplacian1dEigenvalue(p, n, 1.0);
            assertEquals(exact, pairs.get(p - 1).re(), 1e-9 * Math.abs(exact), "mode " + p);
        }
    }

    @Test
    void certifiedWithTheAutomaticShift() {
        int n = 300;
        Spectrum s = solveNew(TestProblems.laplacian1d(n, 1.0), TestProblems.identity(n), 3);
        assertTrue(s.rightmostCertified());
        assertTrue(s.shift() > s.pairs().get(0).re());
        assertTrue(s.computed() >= 3 && s.operatorApplications() > 0);
    }

    @Test
    void rejectsAShiftBelowTheSpectrum() {
        int n = 100;
        ConvergenceException e = assertThrows(ConvergenceException.class, () -> new ThickRestartLanczos().solve(
                TestProblems.laplacian1d(n, 1.0), TestProblems.identity(n), EigenOptions.rightmost(2, true).withShift(-500.0)));
        assertEquals(ConvergenceException.Reason.SINGULAR_SHIFT, e.reason());
    }

    @Test
    void restartCapReportsConvergedCount() {
        // a shift far right clusters all ν = 1/(σ − λ) near 1/σ: a small basis and one restart cannot separate them
        int n = 2000;
        EigenOptions o = new EigenOptions(6, 1.0e9, true, 0.0, 1, 10);
        ConvergenceException e = assertThrows(ConvergenceException.class, () -> new ThickRestartLanczos().solve(
                TestProblems.laplacian1d(n, 1.0), TestProblems.identity(n), o));
        assertEquals(ConvergenceException.Reason.EIGEN_NOT_CONVERGED, e.reason());
        assertTrue(e.getMessage().matches(".*converged \\d+ of 8 eigenvalues.*"), e.getMessage());
    }

    @Test
    void twoRunsAreBitIdentical() {
        int nn = 30;
        DMatrixSparseCSC j = TestProblems.laplacian2d(nn);
        DMatrixSparseCSC m = TestProblems.identity(nn * nn);
        assertBitIdentical(solveNew(j, m, 4), solveNew(j, m, 4));
    }

    @Test
    void concurrentSolvesGiveTheSequentialBits() throws Exception {
        DMatrixSparseCSC j1 = TestProblems.laplacian2d(32);
        DMatrixSparseCSC m1 = TestProblems.identity(32 * 32);
        int n2 = 3000;
        double[] w = new double[n2];
        for (int i = 0; i < n2; i++) {
            w[i] = 1.0 + 0.5 * Math.sin(0.37 * i);
        }
        DMatrixSparseCSC j2 = TestProblems.laplacian1d(n2, 1.0);
        DMatrixSparseCSC m2 = TestProblems.diagonal(w);
        Spectrum seq1 = solveNew(j1, m1, 4);
        Spectrum seq2 = solveNew(j2, m2, 5);
        ExecutorService pool = Executors.newFixedThreadPool(2);
        try {
            List<Future<Spectrum>> futures = new ArrayList<>();
            for (int r = 0; r < 6; r++) {
                futures.add(pool.submit(() -> solveNew(j1, m1, 4)));
                futures.add(pool.submit(() -> solveNew(j2, m2, 5)));
            }
            for (int r = 0; r < futures.size(); r++) {
                assertBitIdentical(r % 2 == 0 ? seq1 : seq2, futures.get(r).get());
            }
        } finally {
            pool.shutdownNow();
        }
    }

    private static void assertBitIdentical(Spectrum a, Spectrum b) {
        assertEquals(a.pairs().size(), b.pairs().size());
        assertEquals(a.shift(), b.shift(), 0.0);
        assertEquals(a.operatorApplications(), b.operatorApplications());
        for (int i = 0; i < a.pairs().size(); i++) {
            EigenPair p = a.pairs().get(i);
            EigenPair q = b.pairs().get(i);
            assertEquals(Double.doubleToRawLongBits(p.re()), Double.doubleToRawLongBits(q.re()), "eigenvalue #" + i);
            assertEquals(Double.doubleToRawLongBits(p.residual()), Double.doubleToRawLongBits(q.residual()));
            assertArrayEquals(p.vectorRe(), q.vectorRe(), 0.0, "eigenvector #" + i);
        }
    }
}
