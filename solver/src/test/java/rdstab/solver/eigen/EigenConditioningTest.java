package rdstab.solver.eigen;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.ejml.data.DMatrixSparseCSC;
import org.junit.jupiter.api.Test;

/** Eigenvalue condition numbers against closed forms, and error estimates against exact eigenvalues. */
class EigenConditioningTest {

    /**
     * Tridiagonal Toeplitz (b, a, c) of order N: right eigenvector x_i = (b/c)^{i/2} sin(ipπ/(N+1)), left
     * eigenvector y_i = (c/b)^{i/2} sin(ipπ/(N+1)) (the diagonal similarity to the symmetric matrix; G. D. Smith,
     * Numerical Solution of Partial Differential Equations, from memory), so κ_p = ‖x‖‖y‖/|yᵀx| in closed form.
     */
    static double toeplitzCondition(int p, int n, double sub, double sup) {
        double r = Math.sqrt(sub / sup);
        double xx = 0;
        double yy = 0;
        double yx = 0;
        for (int i = 1; i <= n; i++) {
            double s = Math.sin(i * p * Math.PI / (n + 1));
            double x = Math.pow(r, i) * s;
            double y = Math.pow(r, -i) * s;
            xx += x * x;
            yy += y * y;
            yx += y * x;
        }
        return Math.sqrt(xx) * Math.sqrt(yy) / Math.abs(yx);
    }

    @Test
    void conditionOfTridiagonalToeplitzMatchesClosedForm() {
        int n = 120;
        double sub = 1.1;
        double sup = 0.9;
        DMatrixSparseCSC j = TestProblems.tridiagonal(n, sub, -2.0, sup);
        EigenOptions o = EigenOptions.rightmost(3, false);
        Spectrum s = EigenSolvers.solve(j, TestProblems.identity(n), o);
        List<EigenConditioning.Estimate> est = EigenConditioning.of(j, TestProblems.identity(n), s.pairs(), s.scaling(), false,
                s.shift(), o);
        for (int p = 1; p <= 3; p++) {
            double exact = toeplitzCondition(p, n, sub, sup);
            assertTrue(exact > 100, "the test needs a visibly non-normal case, κ = " + exact);
            // the closed form is the sensitivity of the original operator (M = I: the energy norm is the 2-norm)
            assertEquals(exact, est.get(p - 1).sensitivity(), 1e-6 * exact, "κ of eigenvalue " + p);
            double lambda = -2.0 + 2 * Math.sqrt(sub * sup) * Math.cos(p * Math.PI / (n + 1));
            double error = Math.abs(s.pairs().get(p - 1).re() - lambda);
            assertTrue(error <= est.get(p - 1).errorEstimate(), "error " + error + " above its estimate "
                    + est.get(p - 1).errorEstimate());
        }
    }

    @Test
    void selfAdjointPencilHasConditionOne() {
        int n = 200;
        DMatrixSparseCSC j = TestProblems.laplacian1d(n, 1.0);
        EigenOptions o = EigenOptions.rightmost(3, true);
        Spectrum s = EigenSolvers.solve(j, TestProblems.identity(n), o);
        List<EigenConditioning.Estimate> est = EigenConditioning.of(j, TestProblems.identity(n), s.pairs(), s.scaling(), true,
                s.shift(), o);
        for (int p = 1; p <= 3; p++) {
            EigenConditioning.Estimate e = est.get(p - 1);
            assertEquals(1.0, e.condition());
            assertEquals(EigenChecks.errorBound(s.pairs().get(p - 1), j, TestProblems.identity(n)), e.errorEstimate());
            // the symmetric path through the general formula gives the same κ = 1 (to rounding)
        }
        List<EigenConditioning.Estimate> general = EigenConditioning.of(j, TestProblems.identity(n), s.pairs(), s.scaling(), false,
                s.shift(), o);
        for (EigenConditioning.Estimate e : general) {
            assertEquals(1.0, e.condition(), 1e-8);
        }
    }

    @Test
    void stronglyNonNormalOperatorIsComputedAccuratelyAndFlaggedAsSensitive() {
        // drift 0.5 on an 80 x 80 grid: similar to a symmetric operator through diag(3^(i/2)), so in the original
        // coordinates κ is near 3^40 and ARPACK alone returns eigenvalues 1e-4 to 1e-2 off the closed form
        // (TestProblems.convectionDiffusion2dEigenvalue) with residuals at round-off
        // (ShiftInvertSpectrumTest.moreConvergedValuesThanRequestedDoNotOverflow). Through the symmetrizing scaling
        // they must come out to rounding, with an honest error estimate and the sensitivity reported.
        int nn = 80;
        double drift = 0.5;
        double c = -0.01;
        DMatrixSparseCSC j = TestProblems.convectionDiffusion2d(nn, drift, c);
        DMatrixSparseCSC m = TestProblems.identity(nn * nn);
        EigenOptions o = EigenOptions.rightmost(3, false);
        Spectrum s = EigenSolvers.solve(j, m, o);
        assertTrue(s.scaling().span() > 1e10, "scaling span " + s.scaling().span());
        List<EigenConditioning.Estimate> est = EigenConditioning.of(j, m, s.pairs(), s.scaling(), false, s.shift(), o);
        double[] exact = TestProblems.convectionDiffusion2dRightmost(3, nn, drift, c);
        for (int i = 0; i < 3; i++) {
            EigenPair p = s.pairs().get(i);
            double error = Math.hypot(p.re() - exact[i], p.im());
            assertTrue(error < 1e-12, "eigenvalue " + i + " error " + error);
            assertTrue(p.residual() < 1e-12, "residual in the original coordinates " + p.residual());
            assertTrue(error <= est.get(i).errorEstimate() + 1e-14, "error " + error + " above " + est.get(i).errorEstimate());
            assertTrue(est.get(i).errorEstimate() < 1e-10, "estimate " + est.get(i).errorEstimate());
            assertTrue(est.get(i).sensitivity() > 1e8, "sensitivity " + est.get(i).sensitivity());
        }
    }

    @Test
    void wellConditionedNonSymmetricEstimateIsSmallAndHonest() {
        int nn = 40;
        double drift = 0.1;
        double c = -0.01;
        DMatrixSparseCSC j = TestProblems.convectionDiffusion2d(nn, drift, c);
        DMatrixSparseCSC m = TestProblems.identity(nn * nn);
        EigenOptions o = EigenOptions.rightmost(4, false);
        Spectrum s = EigenSolvers.solve(j, m, o);
        List<EigenConditioning.Estimate> est = EigenConditioning.of(j, m, s.pairs(), s.scaling(), false, s.shift(), o);
        double[] exact = TestProblems.convectionDiffusion2dRightmost(4, nn, drift, c);
        for (int i = 0; i < 4; i++) {
            double error = Math.abs(s.pairs().get(i).re() - exact[i]);
            assertTrue(est.get(i).errorEstimate() < 1e-10, "estimate " + est.get(i).errorEstimate());
            assertTrue(est.get(i).condition() < 1e3, "κ " + est.get(i).condition());
            assertTrue(est.get(i).sensitivity() < 1e3, "sensitivity " + est.get(i).sensitivity());
            // first order: allow the rounding of the comparison itself
            assertTrue(error <= est.get(i).errorEstimate() + 1e-14, "error " + error + " above " + est.get(i).errorEstimate());
        }
    }
}
