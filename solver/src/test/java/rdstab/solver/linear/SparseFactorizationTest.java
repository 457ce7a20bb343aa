package rdstab.solver.linear;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.ejml.data.DMatrixRMaj;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.data.DMatrixSparseTriplet;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.ops.DConvertMatrixStruct;
import org.junit.jupiter.api.Test;
import rdstab.solver.error.ConvergenceException;

/** Sparse LU/Cholesky against EJML's dense solver (independent oracle) and singularity detection. */
class SparseFactorizationTest {

    /** 2D convection–diffusion-like matrix on an N×N grid, randomly renumbered. */
    private static DMatrixSparseCSC grid(int nn, double convection, double diagShift, long seed) {
        int n = nn * nn;
        int[] label = shuffled(n, seed);
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, 5 * n);
        for (int iy = 0; iy < nn; iy++) {
            for (int ix = 0; ix < nn; ix++) {
                int r = label[iy * nn + ix];
                t.addItem(r, r, 4.0 + diagShift);
                if (ix > 0) {
                    t.addItem(r, label[iy * nn + ix - 1], -1.0 - convection);
                }
                if (ix + 1 < nn) {
                    t.addItem(r, label[iy * nn + ix + 1], -1.0 + convection);
                }
                if (iy > 0) {
                    t.addItem(r, label[(iy - 1) * nn + ix], -1.0);
                }
                if (iy + 1 < nn) {
                    t.addItem(r, label[(iy + 1) * nn + ix], -1.0);
                }
            }
        }
        return DConvertMatrixStruct.convert(t, (DMatrixSparseCSC) null);
    }

    private static int[] shuffled(int n, long seed) {
        int[] p = new int[n];
        for (int i = 0; i < n; i++) {
            p[i] = i;
        }
        SplittableRandom r = new SplittableRandom(seed);
        for (int i = n - 1; i > 0; i--) {
            int k = r.nextInt(i + 1);
            int tmp = p[i];
            p[i] = p[k];
            p[k] = tmp;
        }
        return p;
    }

    private static double[] denseSolve(DMatrixSparseCSC a, double[] b) {
        DMatrixRMaj d = DConvertMatrixStruct.convert(a, (DMatrixRMaj) null);
        DMatrixRMaj x = new DMatrixRMaj(b.length, 1);
        assertTrue(CommonOps_DDRM.solve(d, DMatrixRMaj.wrap(b.length, 1, b.clone()), x));
        return x.data;
    }

    private static void assertSolves(SparseFactorization f, DMatrixSparseCSC a) {
        int n = a.numCols;
        double[] b = new double[n];
        SplittableRandom r = new SplittableRandom(3);
        for (int i = 0; i < n; i++) {
            b[i] = r.nextDouble(-1, 1);
        }
        double[] x = new double[n];
        f.solve(b, x);
        double[] ref = denseSolve(a, b);
        double scale = 0;
        for (double v : ref) {
            scale = Math.max(scale, Math.abs(v));
        }
        for (int i = 0; i < n; i++) {
            assertEquals(ref[i], x[i], 1e-11 * scale, "component " + i);
        }
    }

    @Test
    void luMatchesDenseSolveWithBothOrderings() {
        DMatrixSparseCSC a = grid(15, 0.4, 0.1, 11);
        assertSolves(SparseLU.factor(a, Ordering.identity()), a);
        assertSolves(SparseLU.factor(a, Ordering.reverseCuthillMcKee()), a);
    }

    @Test
    void choleskyMatchesDenseSolve() {
        DMatrixSparseCSC a = grid(15, 0.0, 0.1, 12);
        SparseFactorization f = Factorizations.factor(a, true, Factorizations.defaultOrdering());
        assertTrue(f instanceof SupernodalCholesky);
        assertSolves(f, a);
    }

    @Test
    void reverseCuthillMcKeeReducesBandwidthAndFill() {
        int nn = 20;
        DMatrixSparseCSC a = grid(nn, 0.0, 0.1, 13);
        int[] p = Ordering.reverseCuthillMcKee().permutation(a);
        int bw = bandwidth(SparseOps.permuteSymmetric(a, p));
        // the natural grid numbering has bandwidth N; RCM level sets of a grid have at most N+1 vertices
        assertTrue(bw <= 2 * nn, "RCM bandwidth " + bw);
        assertTrue(bandwidth(a) > 5 * nn, "the shuffled input is far from banded");
        long rcm = SparseCholesky.factor(a, Ordering.reverseCuthillMcKee()).nonZerosOfFactors();
        long natural = SparseCholesky.factor(a, Ordering.identity()).nonZerosOfFactors();
        assertTrue(rcm < natural / 2, "fill with RCM " + rcm + " vs shuffled " + natural);
    }

    @Test
    void tridiagonalHasNoFill() {
        int n = 500;
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, 3 * n);
        for (int i = 0; i < n; i++) {
            t.addItem(i, i, 2.0);
            if (i > 0) {
                t.addItem(i, i - 1, -1.0);
                t.addItem(i - 1, i, -1.0);
            }
        }
        DMatrixSparseCSC a = DConvertMatrixStruct.convert(t, (DMatrixSparseCSC) null);
        assertEquals(2L * n - 1, SparseCholesky.factor(a, Ordering.reverseCuthillMcKee()).nonZerosOfFactors());
        // EJML stores L with its unit diagonal: L and U both have 2n − 1 entries when nothing fills in
        assertEquals(4L * n - 2, SparseLU.factor(a, Ordering.identity()).nonZerosOfFactors());
    }

    @Test
    void singularMatrixIsReported() {
        // zero row sums: the constant vector is in the kernel
        DMatrixSparseCSC a = grid(8, 0.0, 0.0, 14);
        for (int col = 0; col < a.numCols; col++) {
            double s = 0;
            int diag = -1;
            for (int q = a.col_idx[col]; q < a.col_idx[col + 1]; q++) {
                if (a.nz_rows[q] == col) {
                    diag = q;
                } else {
                    s += a.nz_values[q];
                }
            }
            a.nz_values[diag] = -s;
        }
        ConvergenceException lu = assertThrows(ConvergenceException.class, () -> SparseLU.factor(a, Ordering.identity()));
        assertEquals(ConvergenceException.Reason.SINGULAR_SHIFT, lu.reason());
        ConvergenceException ch = assertThrows(ConvergenceException.class,
                () -> SparseCholesky.factor(a, Ordering.reverseCuthillMcKee()));
        assertEquals(ConvergenceException.Reason.SINGULAR_SHIFT, ch.reason());
    }

    @Test
    void indefiniteMatrixIsRejectedByCholesky() {
        DMatrixSparseCSC a = grid(6, 0.0, -4.5, 15); // diagonal −0.5: indefinite
        ConvergenceException e = assertThrows(ConvergenceException.class, () -> SparseCholesky.factor(a, Ordering.identity()));
        assertEquals(ConvergenceException.Reason.SINGULAR_SHIFT, e.reason());
    }

    private static int bandwidth(DMatrixSparseCSC a) {
        int bw = 0;
        for (int col = 0; col < a.numCols; col++) {
            for (int q = a.col_idx[col]; q < a.col_idx[col + 1]; q++) {
                bw = Math.max(bw, Math.abs(a.nz_rows[q] - col));
            }
        }
        return bw;
    }
}
