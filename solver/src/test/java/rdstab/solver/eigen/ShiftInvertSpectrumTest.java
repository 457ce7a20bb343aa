package rdstab.solver.eigen;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixSparseCSC;
import org.junit.jupiter.api.Test;
import rdstab.solver.error.ConvergenceException;

/** Evidence reported by the ARPACK-based solvers: method, shift, counts, certificate, errors. */
class ShiftInvertSpectrumTest {

    @Test
    void arnoldiOnLaplacianIsCertifiedAndUsesArpack() {
        int n = 300;
        Spectrum s = new ShiftInvertArnoldi().solve(TestProblems.laplacian1d(n, 1.0), TestProblems.identity(n),
                EigenOptions.rightmost(3, false));
        assertEquals("arnoldi", s.method());
        // Gershgorin bound of the Dirichlet Laplacian is 0, so the automatic shift is 0.01
        assertEquals(0.01, s.shift(), 1e-15);
        assertTrue(s.rightmostCertified());
        assertTrue(s.computed() >= 3);
        assertTrue(s.operatorApplications() > 0);
        assertTrue(s.worstResidual() < 1e-8, "worst residual " + s.worstResidual());
        assertEquals(TestProblems.laplacian1dEigenvalue(1, n, 1.0), s.rightmostRealPart(), 1e-10 * Math.PI * Math.PI);
    }

    @Test
    void certificateHoldsForBrusselatorAndMatchesOracle() {
        DMatrixSparseCSC j = TestProblems.twoSpecies(60, 10.0, 0.2, 1.0, 0.7, 1.0, -1.7, -1.0);
        DMatrixSparseCSC m = TestProblems.identity(120);
        Spectrum s = new ShiftInvertArnoldi().solve(j, m, EigenOptions.rightmost(4, false));
        List<Complex_F64> oracle = TestProblems.oracle(j, m);
        // Bendixson: |Im λ| is at most the skew-part bound; the oracle must respect it
        for (Complex_F64 z : oracle) {
            assertTrue(Math.abs(z.imaginary) <= s.imaginaryBound() + 1e-12);
        }
        if (s.rightmostCertified()) {
            for (int i = 0; i < 4; i++) {
                assertEquals(oracle.get(i).real, s.pairs().get(i).re(), 1e-8 * Math.max(1, Math.abs(oracle.get(i).real)));
            }
        }
        assertTrue(s.rightmostCertified(), "the enlarged set around σ should cover the strip |Im| <= "
                + s.imaginaryBound() + "; shift " + s.shift());
    }

    @Test
    void shiftInsideTheSpectrumIsNotCertified() {
        int n = 200;
        double inside = TestProblems.laplacian1dEigenvalue(20, n, 1.0) + 1.0;
        Spectrum s = new ShiftInvertArnoldi().solve(TestProblems.laplacian1d(n, 1.0), TestProblems.identity(n),
                EigenOptions.rightmost(3, false).withShift(inside));
        assertFalse(s.rightmostCertified());
        assertTrue(s.worstResidual() < 1e-8);
        // the three eigenvalues nearest the shift are modes 19..21 (or thereabouts), not the rightmost
        assertTrue(s.rightmostRealPart() < TestProblems.laplacian1dEigenvalue(5, n, 1.0));
    }

    /** Neumann-type matrix with exact zero row sums: 0 is an exact eigenvalue, so σ = 0 is singular. */
    private static DMatrixSparseCSC neumann(int n) {
        org.ejml.data.DMatrixSparseTriplet t = new org.ejml.data.DMatrixSparseTriplet(n, n, 3 * n);
        for (int i = 0; i < n; i++) {
            int nb = 0;
            if (i > 0) {
                t.addItem(i, i - 1, 1.0);
                nb++;
            }
            if (i + 1 < n) {
                t.addItem(i, i + 1, 1.0);
                nb++;
            }
            t.addItem(i, i, -nb);
        }
        return TestProblems.csc(t);
    }

    @Test
    void singularUserShiftIsPerturbedForBothKrylovSolvers() {
        int n = 100;
        DMatrixSparseCSC j = neumann(n);
        DMatrixSparseCSC m = TestProblems.identity(n);
        Spectrum a = new ShiftInvertArnoldi().solve(j, m, EigenOptions.rightmost(2, false).withShift(0.0));
        Spectrum l = new ShiftInvertLanczos().solve(j, m, EigenOptions.rightmost(2, true).withShift(0.0));
        for (Spectrum s : List.of(a, l)) {
            assertNotEquals(0.0, s.shift(), s.method() + " kept a singular shift");
            assertTrue(Math.abs(s.shift()) <= 1e-5, "perturbation is small: " + s.shift());
            assertEquals(0.0, s.pairs().get(0).re(), 1e-10);
            // second Neumann eigenvalue: −4 sin²(π/(2n)) (cosine modes)
            double second = -4 * Math.pow(Math.sin(Math.PI / (2 * n)), 2);
            assertEquals(second, s.pairs().get(1).re(), 1e-10 * Math.abs(second) + 1e-12);
            assertTrue(s.worstResidual() < 1e-8);
        }
    }

    @Test
    void lanczosRejectsAShiftBelowTheSpectrum() {
        int n = 100;
        ConvergenceException e = assertThrows(ConvergenceException.class, () -> new ShiftInvertLanczos().solve(
                TestProblems.laplacian1d(n, 1.0), TestProblems.identity(n), EigenOptions.rightmost(2, true).withShift(-500.0)));
        assertEquals(ConvergenceException.Reason.SINGULAR_SHIFT, e.reason());
    }

    @Test
    void restartCapReportsConvergedCount() {
        // a shift far right of the spectrum clusters all ν = 1/(λ − σ) near −1/σ (relative spread
        // ~1%): with a small subspace and one restart ARPACK cannot separate them
        int n = 2000;
        EigenOptions o = new EigenOptions(6, 1.0e9, false, 0.0, 1, 16);
        ConvergenceException e = assertThrows(ConvergenceException.class, () -> new ShiftInvertArnoldi().solve(
                TestProblems.laplacian1d(n, 1.0), TestProblems.identity(n), o));
        assertEquals(ConvergenceException.Reason.EIGEN_NOT_CONVERGED, e.reason());
        assertTrue(e.getMessage().matches(".*converged \\d+ of 14 eigenvalues.*"), e.getMessage());
    }

    @Test
    void arnoldiMatchesTheConvectionDiffusionEigenvalues() {
        // non-symmetric, real spectrum known in closed form (TestProblems.convectionDiffusion2dEigenvalue:
        // tridiagonal Toeplitz eigenvalues, G. D. Smith, from memory); drift 0.1 keeps it well conditioned
        int nn = 60;
        double drift = 0.1;
        double c = -0.01;
        Spectrum s = new ShiftInvertArnoldi().solve(TestProblems.convectionDiffusion2d(nn, drift, c),
                TestProblems.identity(nn * nn), EigenOptions.rightmost(6, false));
        double[] exact = TestProblems.convectionDiffusion2dRightmost(6, nn, drift, c);
        for (int i = 0; i < 6; i++) {
            assertEquals(exact[i], s.pairs().get(i).re(), 1e-12, "eigenvalue " + i);
            assertEquals(0.0, s.pairs().get(i).im(), 1e-12);
        }
        assertTrue(s.worstResidual() < 1e-13, "worst residual " + s.worstResidual());
    }

    @Test
    void moreConvergedValuesThanRequestedDoNotOverflow() {
        // strongly convective (drift 0.5 on an 80 x 80 grid, transposed): ARPACK reports more converged Ritz
        // values than the nev it was asked for, and its post-processing returned more than nev + 1 of them;
        // sized as documented, the arrays overflowed (ArrayIndexOutOfBoundsException inside dneupd)
        int nn = 80;
        double drift = 0.5;
        double c = -0.01;
        DMatrixSparseCSC j = org.ejml.sparse.csc.CommonOps_DSCC.transpose(
                TestProblems.convectionDiffusion2d(nn, drift, c), null, null);
        for (int k : new int[] {3, 6}) {
            Spectrum s = new ShiftInvertArnoldi().solve(j, TestProblems.identity(nn * nn), EigenOptions.rightmost(k, false));
            // at least k (a conjugate pair at the edge is kept whole)
            assertTrue(s.pairs().size() >= k, "pairs " + s.pairs().size());
            assertTrue(s.worstResidual() < 1e-13, "worst residual " + s.worstResidual());
            // the operator is similar to a symmetric one through diag(3^(i/2)), so its eigenvalues have condition
            // numbers near 3^80: a backward-stable answer (residual 1e-15) may still be 1e-3 off the exact value,
            // and a close pair may come out as a complex pair with a small imaginary part
            double[] exact = TestProblems.convectionDiffusion2dRightmost(k, nn, drift, c);
            for (int i = 0; i < k; i++) {
                assertEquals(exact[i], s.pairs().get(i).re(), 0.02, "k = " + k + ", eigenvalue " + i);
            }
        }
    }

    @Test
    void smallProblemsFallBackToDense() {
        Spectrum s = new ShiftInvertArnoldi().solve(TestProblems.laplacian1d(30, 1.0), TestProblems.identity(30),
                EigenOptions.rightmost(2, false));
        assertEquals("dense", s.method());
        assertTrue(s.worstResidual() < 1e-8);
    }

    @Test
    void factoryChoosesBySizeAndSymmetry() {
        assertInstanceOf(DenseEigenSolver.class, EigenSolvers.create(EigenOptions.rightmost(2, false), 10));
        assertInstanceOf(DenseEigenSolver.class, EigenSolvers.create(EigenOptions.rightmost(40, false), 60));
        assertInstanceOf(ThickRestartLanczos.class, EigenSolvers.create(EigenOptions.rightmost(2, true), 1000));
        assertInstanceOf(ShiftInvertArnoldi.class, EigenSolvers.create(EigenOptions.rightmost(2, false), 1000));
    }

    @Test
    void reportsWhichArpackLoaded() {
        String impl = EigenSolvers.arpackImplementation();
        assertTrue(impl.contains("ARPACK"), impl);
        System.out.println("ARPACK implementation: " + impl);
    }
}
