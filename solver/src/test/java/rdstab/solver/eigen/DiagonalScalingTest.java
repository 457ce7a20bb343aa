package rdstab.solver.eigen;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.data.DMatrixSparseTriplet;
import org.junit.jupiter.api.Test;

/** The symmetrizing diagonal similarity: exact where a diagonal can symmetrize, harmless where it cannot. */
class DiagonalScalingTest {

    /** Largest |A_ij − A_ji| relative to the largest |A_ij|. */
    static double asymmetry(DMatrixSparseCSC a) {
        double worst = 0;
        double big = 0;
        for (int c = 0; c < a.numCols; c++) {
            for (int p = a.col_idx[c]; p < a.col_idx[c + 1]; p++) {
                big = Math.max(big, Math.abs(a.nz_values[p]));
                worst = Math.max(worst, Math.abs(a.nz_values[p] - a.get(c, a.nz_rows[p])));
            }
        }
        return worst / big;
    }

    @Test
    void convectionDiffusionBecomesSymmetric() {
        // a tridiagonal (b, a, c) with bc > 0 is similar to a symmetric one through a diagonal (common practice, no
        // source); on a grid with drift along x the same diagonal works row by row
        DMatrixSparseCSC j = TestProblems.convectionDiffusion2d(30, 0.5, -0.01);
        DiagonalScaling s = DiagonalScaling.symmetrizing(j, TestProblems.identity(900));
        assertFalse(s.isIdentity());
        // d_{i+1}/d_i = √(1.5/0.5) along x over 29 steps
        assertEquals(Math.pow(3.0, 29 / 2.0), s.span(), 1e-9 * s.span());
        assertTrue(asymmetry(s.scale(j)) < 1e-13, "asymmetry " + asymmetry(s.scale(j)));
    }

    @Test
    void symmetricOrMassCoupledProblemsAreLeftAlone() {
        assertTrue(DiagonalScaling.symmetrizing(TestProblems.laplacian2d(10), TestProblems.identity(100)).isIdentity());
        DMatrixSparseCSC j = TestProblems.convectionDiffusion2d(10, 0.5, -0.01);
        DMatrixSparseCSC consistentMass = TestProblems.tridiagonal(100, 1.0 / 6, 2.0 / 3, 1.0 / 6);
        assertTrue(DiagonalScaling.symmetrizing(j, consistentMass).isIdentity(), "D⁻¹MD would no longer be M");
        // a drift too weak to matter (span below 10) is not worth a scaling
        assertTrue(DiagonalScaling.symmetrizing(TestProblems.convectionDiffusion2d(10, 0.01, -0.01),
                TestProblems.identity(100)).isIdentity());
    }

    @Test
    void inconsistentCouplingsGetALeastSquaresScalingWithTheSameEigenvalues() {
        // a chain with strong drift plus a triangle of couplings whose ratios cannot all be balanced (the
        // logarithms around the cycle do not sum to zero): the least-squares path
        int n = 60;
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, 3 * n + 6);
        for (int i = 0; i < n; i++) {
            t.addItem(i, i, -2.0 - 0.1 * i);
            if (i > 0) {
                t.addItem(i, i - 1, 1.4);
            }
            if (i + 1 < n) {
                t.addItem(i, i + 1, 0.6);
            }
        }
        t.addItem(0, 2, 0.2);
        t.addItem(2, 0, 0.8);
        DMatrixSparseCSC j = TestProblems.csc(t);
        DMatrixSparseCSC m = TestProblems.identity(n);
        DiagonalScaling s = DiagonalScaling.symmetrizing(j, m);
        assertFalse(s.isIdentity());
        assertTrue(asymmetry(s.scale(j)) < asymmetry(j), "the scaled matrix should be closer to symmetric");
        List<Complex_F64> before = TestProblems.oracle(j, m);
        List<Complex_F64> after = TestProblems.oracle(s.scale(j), m);
        for (int i = 0; i < 5; i++) {
            assertEquals(before.get(i).real, after.get(i).real, 1e-8, "eigenvalue " + i);
            assertEquals(Math.abs(before.get(i).imaginary), Math.abs(after.get(i).imaginary), 1e-8);
        }
        // the vectors go back (D x̃ is an eigenvector of J): the residual in the original coordinates is larger than
        // the computation's own (D amplifies the rounding of x̃ where the mode has decayed) but still small
        Spectrum sp = EigenSolvers.solve(j, m, EigenOptions.rightmost(3, false));
        assertTrue(sp.worstResidual() < 1e-13, "residual of the computation " + sp.worstResidual());
        double scale = rdstab.solver.linear.SparseOps.norm1(j);
        for (EigenPair p : sp.pairs()) {
            EigenPair original = EigenChecks.check(p.re(), p.im(), p.vectorRe(), p.vectorIm(), j, m, scale);
            assertTrue(original.residual() < 1e-6, "residual in the original coordinates " + original.residual());
            assertEquals(before.get(0).real, sp.pairs().get(0).re(), 1e-10);
        }
    }
}
