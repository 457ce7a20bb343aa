package rdstab.solver.linear;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.data.DMatrixSparseTriplet;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.ops.DConvertMatrixStruct;
import org.junit.jupiter.api.Test;

/** Fill-reducing orderings: permutation property, fill on 2D grids, and solves after permutation. */
class OrderingTest {

    /** Five-point matrix (4 + shift on the diagonal, −1 off it) on an N×N grid in row-major (natural) numbering. */
    static DMatrixSparseCSC grid(int nn, double shift, double convection) {
        int n = nn * nn;
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, 5 * n);
        for (int iy = 0; iy < nn; iy++) {
            for (int ix = 0; ix < nn; ix++) {
                int r = iy * nn + ix;
                t.addItem(r, r, 4.0 + shift);
                if (ix > 0) {
                    t.addItem(r, r - 1, -1.0 - convection);
                }
                if (ix + 1 < nn) {
                    t.addItem(r, r + 1, -1.0 + convection);
                }
                if (iy > 0) {
                    t.addItem(r, r - nn, -1.0);
                }
                if (iy + 1 < nn) {
                    t.addItem(r, r + nn, -1.0);
                }
            }
        }
        return DConvertMatrixStruct.convert(t, (DMatrixSparseCSC) null);
    }

    /** Random sparse symmetric diagonally dominant (hence SPD) matrix, possibly with several components. */
    static DMatrixSparseCSC randomSpd(int n, int edges, Random rnd) {
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, n + 2 * edges);
        double[] diag = new double[n];
        java.util.Set<Long> used = new java.util.HashSet<>(); // EJML's triplet conversion keeps duplicates apart
        for (int e = 0; e < edges; e++) {
            int i = rnd.nextInt(n);
            int j = rnd.nextInt(n);
            if (i == j || !used.add((long) Math.min(i, j) * n + Math.max(i, j))) {
                continue;
            }
            double v = rnd.nextDouble() * 2 - 1;
            t.addItem(i, j, v);
            t.addItem(j, i, v);
            diag[i] += Math.abs(v);
            diag[j] += Math.abs(v);
        }
        for (int i = 0; i < n; i++) {
            t.addItem(i, i, diag[i] + 0.5 + rnd.nextDouble());
        }
        return DConvertMatrixStruct.convert(t, (DMatrixSparseCSC) null);
    }

    private static List<Ordering> all(int n, Random rnd) {
        double[][] xy = new double[2][n];
        for (int i = 0; i < n; i++) {
            xy[0][i] = rnd.nextDouble();
            xy[1][i] = rnd.nextDouble();
        }
        return List.of(Ordering.identity(), Ordering.reverseCuthillMcKee(), Ordering.nestedDissection(),
                Ordering.nestedDissection(xy), Ordering.approximateMinimumDegree(), Ordering.automatic());
    }

    private static void assertPermutation(int[] p, int n, String what) {
        assertEquals(n, p.length, what);
        boolean[] seen = new boolean[n];
        for (int v : p) {
            assertTrue(v >= 0 && v < n && !seen[v], what + ": entry " + v + " repeated or out of range");
            seen[v] = true;
        }
    }

    @Test
    void everyOrderingReturnsAPermutation() {
        Random rnd = new Random(20240611L);
        for (int trial = 0; trial < 40; trial++) {
            int n = 1 + rnd.nextInt(trial < 10 ? 10 : 600);
            int edges = rnd.nextInt(3 * n + 1); // from many components (few edges) to well connected
            DMatrixSparseCSC a = randomSpd(n, edges, rnd);
            List<Ordering> orderings = all(n, rnd);
            for (int o = 0; o < orderings.size(); o++) {
                assertPermutation(orderings.get(o).permutation(a), n, "trial " + trial + ", ordering " + o);
            }
        }
    }

    @Test
    void nestedDissectionAndMinimumDegreeFillFarBelowNaturalOrderOnAGrid() {
        // George (1973): nested dissection of an N×N five-point grid gives O(N² log N) non-zeros in L,
        // the natural (banded) order about N³ (the band of half-width N fills completely). At N = 100 the
        // ratio c·log N / N is far below one; a third is a safe bound for any dissection with O(N) separators
        // (and for minimum degree, whose fill on grids is within a small factor of it — common practice, no source).
        int nn = 100;
        DMatrixSparseCSC a = grid(nn, 0.1, 0.0);
        long natural = SymbolicAnalysis.of(a, true, Ordering.identity()).predictedNonZeros();
        assertTrue(natural > (long) nn * nn * nn * 9 / 10, "natural order fills the band: " + natural);
        double[][] xy = new double[2][nn * nn];
        for (int i = 0; i < nn * nn; i++) {
            xy[0][i] = i % nn;
            xy[1][i] = i / nn;
        }
        for (Ordering o : List.of(Ordering.nestedDissection(), Ordering.nestedDissection(xy),
                Ordering.approximateMinimumDegree(), Ordering.automatic())) {
            long fill = SymbolicAnalysis.of(a, true, o).predictedNonZeros();
            assertTrue(3 * fill < natural, "fill " + fill + " vs natural " + natural);
            // the count is the real one: the numeric factor has it too
            assertEquals(fill, Factorizations.factor(a, true, o).nonZerosOfFactors());
        }
    }

    @Test
    void automaticKeepsNaturalOrderForNarrowBands() {
        DMatrixSparseCSC tri = OrderingTest.grid(1, 0, 0);
        assertArrayEquals(new int[] {0}, Ordering.automatic().permutation(tri));
        DMatrixSparseCSC band = randomBand(300, 3, new Random(5));
        int[] p = Ordering.automatic().permutation(band);
        for (int i = 0; i < p.length; i++) {
            assertEquals(i, p[i]);
        }
    }

    private static DMatrixSparseCSC randomBand(int n, int b, Random rnd) {
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, n * (2 * b + 1));
        for (int i = 0; i < n; i++) {
            t.addItem(i, i, 10.0);
            for (int d = 1; d <= b && i + d < n; d++) {
                double v = rnd.nextDouble() - 0.5;
                t.addItem(i, i + d, v);
                t.addItem(i + d, i, v);
            }
        }
        return DConvertMatrixStruct.convert(t, (DMatrixSparseCSC) null);
    }

    @Test
    void factorizationsSolveCorrectlyAfterEveryOrdering() {
        Random rnd = new Random(77);
        for (int trial = 0; trial < 12; trial++) {
            int n = 60 + rnd.nextInt(300);
            DMatrixSparseCSC spd = randomSpd(n, 2 * n, rnd);
            DMatrixSparseCSC general = grid(12 + trial % 5, 0.05, 0.3); // convection: non-symmetric
            List<Ordering> forSpd = all(n, rnd);
            for (int o = 0; o < forSpd.size(); o++) {
                assertSolvesLikeDense(Factorizations.factor(spd, true, forSpd.get(o)), spd, rnd, "SPD trial " + trial + " ordering " + o);
            }
            List<Ordering> forGeneral = all(general.numCols, rnd);
            for (int o = 0; o < forGeneral.size(); o++) {
                assertSolvesLikeDense(Factorizations.factor(general, false, forGeneral.get(o)), general, rnd,
                        "LU trial " + trial + " ordering " + o);
            }
        }
    }

    /** Compares with EJML's dense LU solve (independent oracle); relative 1e-10 for these well-conditioned matrices. */
    static void assertSolvesLikeDense(SparseFactorization f, DMatrixSparseCSC a, Random rnd, String what) {
        int n = a.numCols;
        double[] b = new double[n];
        for (int i = 0; i < n; i++) {
            b[i] = rnd.nextDouble() * 2 - 1;
        }
        double[] x = new double[n];
        f.solve(b, x);
        DMatrixRMaj d = DConvertMatrixStruct.convert(a, (DMatrixRMaj) null);
        DMatrixRMaj ref = new DMatrixRMaj(n, 1);
        assertTrue(CommonOps_DDRM.solve(d, DMatrixRMaj.wrap(n, 1, b.clone()), ref));
        double scale = 0;
        double err = 0;
        for (int i = 0; i < n; i++) {
            scale = Math.max(scale, Math.abs(ref.data[i]));
            err = Math.max(err, Math.abs(ref.data[i] - x[i]));
        }
        assertTrue(err <= 1e-10 * scale, what + ": max error " + err + " vs solution size " + scale);
    }
}
