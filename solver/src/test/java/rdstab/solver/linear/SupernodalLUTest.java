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

/**
 * The LU path of {@link Factorizations}: supernodal LU without row interchanges where it is stable,
 * pivoted LU where it is refused; solutions checked against EJML's dense LU with partial pivoting
 * (independent oracle).
 */
class SupernodalLUTest {

    /** Random non-symmetric grid operator (5-point pattern plus a few one-sided couplings), randomly renumbered. */
    private static DMatrixSparseCSC randomGrid(int nn, SplittableRandom r) {
        int n = nn * nn;
        int[] label = shuffled(n, r);
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, 6 * n);
        java.util.Set<Long> used = new java.util.HashSet<>();
        for (int iy = 0; iy < nn; iy++) {
            for (int ix = 0; ix < nn; ix++) {
                int row = label[iy * nn + ix];
                t.addItem(row, row, 4.0 + r.nextDouble(0.0, 2.0));
                int[][] nb = {{ix - 1, iy}, {ix + 1, iy}, {ix, iy - 1}, {ix, iy + 1}};
                for (int[] q : nb) {
                    if (q[0] >= 0 && q[0] < nn && q[1] >= 0 && q[1] < nn) {
                        int col = label[q[1] * nn + q[0]];
                        used.add((long) row * n + col);
                        t.addItem(row, col, r.nextDouble(-1.6, 0.4));
                    }
                }
                if (r.nextInt(5) == 0) { // structurally non-symmetric entry (not on a grid neighbour: no duplicates)
                    int other = r.nextInt(n);
                    if (other != row && used.add((long) row * n + other)) {
                        t.addItem(row, other, r.nextDouble(-0.5, 0.5));
                    }
                }
            }
        }
        return DConvertMatrixStruct.convert(t, (DMatrixSparseCSC) null);
    }

    private static int[] shuffled(int n, SplittableRandom r) {
        int[] p = new int[n];
        for (int i = 0; i < n; i++) {
            p[i] = i;
        }
        for (int i = n - 1; i > 0; i--) {
            int k = r.nextInt(i + 1);
            int tmp = p[i];
            p[i] = p[k];
            p[k] = tmp;
        }
        return p;
    }

    /** Max-norm error of F⁻¹b against EJML's dense LU with partial pivoting, relative to ‖x‖∞. */
    private static double relativeError(SparseFactorization f, DMatrixSparseCSC a, long seed) {
        int n = a.numCols;
        double[] b = new double[n];
        SplittableRandom r = new SplittableRandom(seed);
        for (int i = 0; i < n; i++) {
            b[i] = r.nextDouble(-1, 1);
        }
        double[] x = new double[n];
        f.solve(b, x);
        DMatrixRMaj d = DConvertMatrixStruct.convert(a, (DMatrixRMaj) null);
        DMatrixRMaj ref = new DMatrixRMaj(n, 1);
        assertTrue(CommonOps_DDRM.solve(d, DMatrixRMaj.wrap(n, 1, b.clone()), ref));
        double err = 0;
        double scale = 0;
        for (int i = 0; i < n; i++) {
            err = Math.max(err, Math.abs(ref.data[i] - x[i]));
            scale = Math.max(scale, Math.abs(ref.data[i]));
        }
        return err / scale;
    }

    @Test
    void randomNonSymmetricMatricesUseSupernodalLUAndAgreeWithDenseLU() {
        // property loop (common practice, no source): diagonally dominant by construction, so LU without
        // interchanges is stable and must be accepted; agreement to 1e-11 is round-off for these sizes
        SplittableRandom r = new SplittableRandom(2026);
        for (int trial = 0; trial < 12; trial++) {
            int nn = 3 + r.nextInt(14);
            DMatrixSparseCSC a = randomGrid(nn, r);
            Ordering ordering = trial % 2 == 0 ? Factorizations.defaultOrdering() : Ordering.reverseCuthillMcKee();
            SparseFactorization f = Factorizations.analysis(a, false, ordering).factor(a);
            assertTrue(f instanceof SupernodalLU, "trial " + trial + " fell back to " + f.getClass().getSimpleName());
            double err = relativeError(f, a, trial);
            assertTrue(err < 1e-11, "trial " + trial + " (n = " + a.numCols + "): relative error " + err);
        }
    }

    @Test
    void zeroDiagonalFallsBackToPivotedLU() {
        // rows of a dominant grid matrix swapped in pairs: the diagonal of many columns is structurally zero
        DMatrixSparseCSC g = randomGrid(10, new SplittableRandom(5));
        int n = g.numCols;
        int[] rowPerm = new int[n];
        for (int i = 0; i < n; i++) {
            rowPerm[i] = (i ^ 1) < n ? (i ^ 1) : i;
        }
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, g.nz_length);
        for (int col = 0; col < n; col++) {
            for (int q = g.col_idx[col]; q < g.col_idx[col + 1]; q++) {
                t.addItem(rowPerm[g.nz_rows[q]], col, g.nz_values[q]);
            }
        }
        DMatrixSparseCSC a = DConvertMatrixStruct.convert(t, (DMatrixSparseCSC) null);
        SparseFactorization f = Factorizations.analysis(a, false, Factorizations.defaultOrdering()).factor(a);
        assertTrue(f instanceof SparseLU, "expected the pivoted fallback, got " + f.getClass().getSimpleName());
        double err = relativeError(f, a, 1);
        assertTrue(err < 1e-11, "relative error " + err);
    }

    @Test
    void tinyPivotWithGrowthFallsBackToPivotedLU() {
        // 2×2 blocks [[δ, 1], [1, 1]] coupled weakly along a chain: without interchanges the multiplier 1/δ makes
        // element growth of order 1/δ = 1e12 (textbook growth example, from memory), which the backward-error
        // test must catch; the matrix itself is well conditioned
        int blocks = 60;
        int n = 2 * blocks;
        double delta = 1e-12;
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, 6 * n);
        for (int b = 0; b < blocks; b++) {
            int i = 2 * b;
            t.addItem(i, i, delta);
            t.addItem(i, i + 1, 1.0);
            t.addItem(i + 1, i, 1.0);
            t.addItem(i + 1, i + 1, 1.0);
            if (b + 1 < blocks) {
                t.addItem(i + 1, i + 2, 0.01);
                t.addItem(i + 2, i + 1, 0.01);
            }
        }
        DMatrixSparseCSC a = DConvertMatrixStruct.convert(t, (DMatrixSparseCSC) null);
        SparseFactorization f = Factorizations.analysis(a, false, Ordering.identity()).factor(a);
        assertTrue(f instanceof SparseLU, "expected the pivoted fallback, got " + f.getClass().getSimpleName());
        double err = relativeError(f, a, 2);
        assertTrue(err < 1e-11, "relative error " + err);
    }

    @Test
    void singularMatrixStillReported() {
        // zero row sums (graph Laplacian of a chain): the constant vector is in the kernel
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(50, 50, 150);
        for (int i = 0; i < 50; i++) {
            double diag = 0;
            if (i > 0) {
                t.addItem(i, i - 1, -1.0);
                diag += 1.0;
            }
            if (i + 1 < 50) {
                t.addItem(i, i + 1, -1.0);
                diag += 1.0;
            }
            t.addItem(i, i, diag);
        }
        DMatrixSparseCSC a = DConvertMatrixStruct.convert(t, (DMatrixSparseCSC) null);
        ConvergenceException e = assertThrows(ConvergenceException.class,
                () -> Factorizations.analysis(a, false, Ordering.identity()).factor(a));
        assertEquals(ConvergenceException.Reason.SINGULAR_SHIFT, e.reason());
    }

    @Test
    void tridiagonalFactorCountMatchesPivotedLU() {
        // no fill: L and U each hold 2n − 1 entries with the diagonal, as EJML's LU counts them
        int n = 200;
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, 3 * n);
        for (int i = 0; i < n; i++) {
            t.addItem(i, i, 3.0);
            if (i > 0) {
                t.addItem(i, i - 1, -1.0);
                t.addItem(i - 1, i, -1.5);
            }
        }
        DMatrixSparseCSC a = DConvertMatrixStruct.convert(t, (DMatrixSparseCSC) null);
        SparseFactorization f = Factorizations.analysis(a, false, Ordering.identity()).factor(a);
        assertTrue(f instanceof SupernodalLU);
        assertEquals(4L * n - 2, f.nonZerosOfFactors());
        assertTrue(relativeError(f, a, 3) < 1e-12);
    }
}
