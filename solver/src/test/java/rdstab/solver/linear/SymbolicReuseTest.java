package rdstab.solver.linear;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.Random;
import org.ejml.data.DMatrixSparseCSC;
import org.junit.jupiter.api.Test;
import rdstab.solver.error.ConvergenceException;

/** A symbolic analysis reused for new values gives exactly what a fresh analysis gives. */
class SymbolicReuseTest {

    private static DMatrixSparseCSC withNewValues(DMatrixSparseCSC a, Random rnd, boolean symmetric) {
        DMatrixSparseCSC b = a.copy();
        // scale rows and columns by the same positive factors: keeps symmetry and definiteness, changes every value
        double[] s = new double[a.numCols];
        for (int i = 0; i < s.length; i++) {
            s[i] = 0.5 + rnd.nextDouble();
        }
        for (int j = 0; j < b.numCols; j++) {
            for (int q = b.col_idx[j]; q < b.col_idx[j + 1]; q++) {
                b.nz_values[q] *= s[b.nz_rows[q]] * (symmetric ? s[j] : 1.0 + 0.3 * rnd.nextDouble());
            }
        }
        return b;
    }

    @Test
    void reusedAnalysisGivesIdenticalSolutions() {
        Random rnd = new Random(4242);
        for (boolean spd : new boolean[] {true, false}) {
            DMatrixSparseCSC a0 = OrderingTest.grid(30, 0.2, spd ? 0.0 : 0.4);
            SymbolicAnalysis analysis = SymbolicAnalysis.of(a0, spd, Ordering.nestedDissection());
            for (int step = 0; step < 4; step++) {
                DMatrixSparseCSC a = withNewValues(a0, rnd, spd);
                SparseFactorization reused = analysis.factor(a);
                SparseFactorization fresh = SymbolicAnalysis.of(a, spd, Ordering.nestedDissection()).factor(a);
                double[] b = new double[a.numCols];
                for (int i = 0; i < b.length; i++) {
                    b[i] = rnd.nextGaussian();
                }
                double[] x1 = new double[b.length];
                double[] x2 = new double[b.length];
                reused.solve(b, x1);
                fresh.solve(b, x2);
                assertArrayEquals(x2, x1, 0.0, "reuse must not change a single bit");
                assertEquals(fresh.nonZerosOfFactors(), reused.nonZerosOfFactors());
                OrderingTest.assertSolvesLikeDense(reused, a, rnd, "reused");
            }
        }
    }

    @Test
    void cacheIsKeyedByPatternAndKind() {
        Factorizations.clearCache();
        DMatrixSparseCSC a = OrderingTest.grid(20, 0.1, 0.0);
        DMatrixSparseCSC b = withNewValues(a, new Random(1), true);
        SymbolicAnalysis first = Factorizations.analysis(a, true, Ordering.nestedDissection());
        assertSame(first, Factorizations.analysis(b, true, Ordering.nestedDissection()));
        assertNotSame(first, Factorizations.analysis(a, false, Ordering.nestedDissection()));
        assertNotSame(first, Factorizations.analysis(a, true, Ordering.approximateMinimumDegree()));
        assertNotSame(first, Factorizations.analysis(OrderingTest.grid(21, 0.1, 0.0), true, Ordering.nestedDissection()));
    }

    @Test
    void aDifferentPatternIsRefused() {
        SymbolicAnalysis analysis = SymbolicAnalysis.of(OrderingTest.grid(10, 0.1, 0.0), true, Ordering.nestedDissection());
        assertThrows(IllegalArgumentException.class, () -> analysis.factor(OrderingTest.grid(11, 0.1, 0.0)));
    }

    @Test
    void indefiniteMatrixIsASingularShift() {
        // 4 + shift − 4 cos(...)·... : the five-point matrix with diagonal 4 − 9 has negative eigenvalues
        DMatrixSparseCSC a = OrderingTest.grid(10, -9.0, 0.0);
        ConvergenceException e = assertThrows(ConvergenceException.class,
                () -> Factorizations.factor(a, true, Ordering.nestedDissection()));
        assertEquals(ConvergenceException.Reason.SINGULAR_SHIFT, e.reason());
    }
}
