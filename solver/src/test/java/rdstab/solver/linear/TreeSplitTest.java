package rdstab.solver.linear;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.data.DMatrixSparseTriplet;
import org.ejml.ops.DConvertMatrixStruct;
import org.junit.jupiter.api.Test;

/**
 * The two-thread split of the supernodal tree ({@link TreeSplit}) and the factorizations and solves that
 * use it: the split must be a partition into closed subtrees plus their ancestors, and factor and solve
 * must still solve the system (residual checked against the matrix itself, common practice, no source).
 * Grids of 160² unknowns are large enough to be split.
 */
class TreeSplitTest {

    /** 5-point operator on an nn×nn grid: symmetric (shift·I − Laplacian) or with a one-sided drift term. */
    private static DMatrixSparseCSC grid(int nn, double drift) {
        int n = nn * nn;
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, 5 * n);
        for (int iy = 0; iy < nn; iy++) {
            for (int ix = 0; ix < nn; ix++) {
                int row = iy * nn + ix;
                t.addItem(row, row, 4.1);
                if (ix > 0) {
                    t.addItem(row, row - 1, -1.0 - drift);
                }
                if (ix + 1 < nn) {
                    t.addItem(row, row + 1, -1.0 + drift);
                }
                if (iy > 0) {
                    t.addItem(row, row - nn, -1.0);
                }
                if (iy + 1 < nn) {
                    t.addItem(row, row + nn, -1.0);
                }
            }
        }
        return DConvertMatrixStruct.convert(t, (DMatrixSparseCSC) null);
    }

    @Test
    void splitIsAPartitionIntoClosedSubtreesAndTheirAncestors() {
        DMatrixSparseCSC a = grid(160, 0.0);
        CholeskySymbolic s = CholeskySymbolic.analyse(a, Factorizations.defaultOrdering().permutation(a));
        TreeSplit split = s.split();
        assertFalse(split.trivial(), "a 160x160 grid is large enough to split");
        int[] owner = new int[s.supernodes];
        java.util.Arrays.fill(owner, -1);
        long[] weight = new long[2];
        int[][][] groups = {split.group0, split.group1};
        for (int g = 0; g < 2; g++) {
            for (int[] r : groups[g]) {
                for (int t = r[0]; t < r[1]; t++) {
                    assertEquals(-1, owner[t], "panel " + t + " in two places");
                    owner[t] = g;
                    weight[g] += (long) (s.rowStart[t + 1] - s.rowStart[t]) * (s.first[t + 1] - s.first[t]);
                }
            }
        }
        for (int t : split.top) {
            assertEquals(-1, owner[t], "top panel " + t + " also in a group");
            owner[t] = 2;
        }
        for (int t = 0; t < s.supernodes; t++) {
            assertTrue(owner[t] >= 0, "panel " + t + " not assigned");
            int w = s.first[t + 1] - s.first[t];
            int m = s.rowStart[t + 1] - s.rowStart[t];
            if (m > w) {
                int parent = s.superOf[s.rows[s.rowStart[t] + w]];
                // a group panel's parent is in the same group or on top; a top panel's parent is on top
                assertTrue(owner[parent] == owner[t] || owner[parent] == 2, "panel " + t + " -> " + parent);
            }
        }
        assertTrue(Math.abs(weight[0] - weight[1]) <= 0.2 * Math.max(weight[0], weight[1]),
                "groups balanced: " + weight[0] + " vs " + weight[1]);
    }

    @Test
    void splitCholeskyAndLuSolveTheirSystems() {
        for (double drift : new double[] {0.0, 0.3}) {
            DMatrixSparseCSC a = grid(160, drift);
            SparseFactorization f = Factorizations.factor(a, drift == 0.0, Factorizations.defaultOrdering());
            assertTrue(drift == 0.0 ? f instanceof SupernodalCholesky : f instanceof SupernodalLU, f.getClass().getName());
            int n = a.numCols;
            double[] b = random(n, 11);
            double[] x = new double[n];
            f.solve(b, x);
            double[] ax = new double[n];
            SparseOps.multiply(a, x, ax);
            double r = 0;
            double xs = 0;
            for (int i = 0; i < n; i++) {
                r = Math.max(r, Math.abs(ax[i] - b[i]));
                xs = Math.max(xs, Math.abs(x[i]));
            }
            // ‖A‖∞ ≤ 8.7 here; a backward-stable solve leaves a residual of a few hundred ulps of ‖A‖‖x‖
            assertTrue(r <= 1e-12 * 8.7 * xs, "drift " + drift + ": residual " + r + ", |x| " + xs);
        }
    }

    @Test
    void twoRightHandSidesGiveTheBitsOfTwoSingleSolves() {
        for (double drift : new double[] {0.0, 0.3}) {
            DMatrixSparseCSC a = grid(160, drift);
            SparseFactorization f = Factorizations.factor(a, drift == 0.0, Factorizations.defaultOrdering());
            int n = a.numCols;
            double[][] b = {random(n, 1), random(n, 2), random(n, 3)};
            double[][] together = new double[3][n];
            f.solve(b, together, 3);
            for (int i = 0; i < 3; i++) {
                double[] alone = new double[n];
                f.solve(b[i], alone);
                assertArrayEquals(alone, together[i], 0.0, "right-hand side " + i + ", drift " + drift);
            }
        }
    }

    @Test
    void interruptedCallerStillGetsTheWholeResultAndKeepsTheInterrupt() throws Exception {
        // the split solve must not return half-done work when its thread is interrupted (sweeps can be
        // cancelled): same bits as an undisturbed solve, and the interrupt flag still set afterwards
        DMatrixSparseCSC a = grid(160, 0.0);
        SparseFactorization f = Factorizations.factor(a, true, Factorizations.defaultOrdering());
        int n = a.numCols;
        double[] b = random(n, 4);
        double[] quiet = new double[n];
        f.solve(b, quiet);
        double[] disturbed = new double[n];
        boolean[] flag = new boolean[1];
        Thread t = new Thread(() -> {
            Thread.currentThread().interrupt();
            f.solve(b, disturbed);
            flag[0] = Thread.currentThread().isInterrupted();
        });
        t.start();
        t.join();
        assertArrayEquals(quiet, disturbed, 0.0);
        assertTrue(flag[0], "interrupt flag kept");
    }

    private static double[] random(int n, long seed) {
        SplittableRandom r = new SplittableRandom(seed);
        double[] b = new double[n];
        for (int i = 0; i < n; i++) {
            b[i] = r.nextDouble(-1, 1);
        }
        return b;
    }
}
