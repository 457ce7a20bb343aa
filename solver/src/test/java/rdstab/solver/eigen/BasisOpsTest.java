package rdstab.solver.eigen;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The blocked (and, above {@link BasisOps#SPLIT_ABOVE}, two-thread) basis products against the plain
 * one-vector-at-a-time loops they replace (common practice, no source); lengths on both sides of the cut
 * and not multiples of the block length.
 */
class BasisOpsTest {

    @Test
    void agreesWithPlainLoops() {
        SplittableRandom r = new SplittableRandom(5);
        for (int n : new int[] {1, 1023, 5000, BasisOps.SPLIT_ABOVE + 1, 100_003}) {
            int count = 7;
            double[][] basis = new double[count][];
            for (int i = 0; i < count; i++) {
                basis[i] = random(n, r);
            }
            double[][] x = {random(n, r), random(n, r)};
            double[][] dots = new double[2][count];
            BasisOps.dots(basis, count, x, 2, dots);
            double[][] coef = new double[2][count];
            for (int c = 0; c < 2; c++) {
                for (int i = 0; i < count; i++) {
                    double plain = 0;
                    for (int k = 0; k < n; k++) {
                        plain += basis[i][k] * x[c][k];
                    }
                    assertEquals(plain, dots[c][i], 1e-12 * n, "dot, n = " + n);
                    coef[c][i] = r.nextDouble(-1, 1);
                }
            }
            double[][] expected = {x[0].clone(), x[1].clone()};
            for (int c = 0; c < 2; c++) {
                for (int i = 0; i < count; i++) {
                    for (int k = 0; k < n; k++) {
                        expected[c][k] -= coef[c][i] * basis[i][k];
                    }
                }
            }
            BasisOps.subtract(basis, count, coef, x, 2);
            for (int c = 0; c < 2; c++) {
                for (int k = 0; k < n; k++) {
                    assertEquals(expected[c][k], x[c][k], 1e-13, "subtract, n = " + n);
                }
            }
            double[][] s = new double[count][3];
            for (double[] row : s) {
                for (int i = 0; i < 3; i++) {
                    row[i] = r.nextDouble(-1, 1);
                }
            }
            double[][] out = new double[3][n];
            BasisOps.combine(basis, count, s, 3, out);
            for (int i = 0; i < 3; i++) {
                for (int k = 0; k < n; k++) {
                    double plain = 0;
                    for (int q = 0; q < count; q++) {
                        plain += s[q][i] * basis[q][k];
                    }
                    assertEquals(plain, out[i][k], 1e-13, "combine, n = " + n);
                }
            }
        }
    }

    private static double[] random(int n, SplittableRandom r) {
        double[] v = new double[n];
        for (int i = 0; i < n; i++) {
            v[i] = r.nextDouble(-1, 1);
        }
        return v;
    }
}
