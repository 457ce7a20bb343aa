package rdstab.solver.eigen;

import rdstab.solver.linear.ParallelPair;

/**
 * Products of a Krylov basis (an array of long vectors) with small coefficient arrays, blocked by rows:
 * each basis vector streams through memory once per operation while a short block of the result (or of the
 * vectors being orthogonalised) stays in cache. Done one vector at a time, a restart that forms k
 * combinations of an m-vector basis reads the basis k times, and orthogonalising a block of b vectors reads
 * it b times; here both read it once.
 *
 * <p>Vectors longer than {@link #SPLIT_ABOVE} are cut into two row halves done by two threads
 * ({@link ParallelPair}); the dot products add the two halves' partial sums. The cut depends only on the
 * length, so the results are the same bits with one core or two.
 */
final class BasisOps {

    /** Rows per block: 1024 doubles = 8 KiB per vector. */
    static final int BLOCK = 1024;
    /** Vectors longer than this are processed in two halves in parallel. */
    static final int SPLIT_ABOVE = 32_768;

    private BasisOps() {
    }

    /** out[c][i] = ⟨basis[i], x[c]⟩ for i &lt; count, c &lt; nx (Euclidean). */
    static void dots(double[][] basis, int count, double[][] x, int nx, double[][] out) {
        int n = x[0].length;
        if (n <= SPLIT_ABOVE) {
            dotsRows(basis, count, x, nx, out, 0, n);
            return;
        }
        int mid = half(n);
        double[][] upper = new double[nx][count];
        ParallelPair.run(() -> dotsRows(basis, count, x, nx, out, 0, mid),
                () -> dotsRows(basis, count, x, nx, upper, mid, n));
        for (int c = 0; c < nx; c++) {
            for (int i = 0; i < count; i++) {
                out[c][i] += upper[c][i];
            }
        }
    }

    /** x[c] −= Σ_{i &lt; count} coef[c][i]·basis[i] for c &lt; nx. */
    static void subtract(double[][] basis, int count, double[][] coef, double[][] x, int nx) {
        int n = x[0].length;
        if (n <= SPLIT_ABOVE) {
            subtractRows(basis, count, coef, x, nx, 0, n);
            return;
        }
        int mid = half(n);
        ParallelPair.run(() -> subtractRows(basis, count, coef, x, nx, 0, mid),
                () -> subtractRows(basis, count, coef, x, nx, mid, n));
    }

    /**
     * out[i] = Σ_{q &lt; count} s[q][i]·basis[q] for i &lt; columns (out[i] overwritten; none of them may be a
     * basis vector).
     */
    static void combine(double[][] basis, int count, double[][] s, int columns, double[][] out) {
        int n = out[0].length;
        if (n <= SPLIT_ABOVE) {
            combineRows(basis, count, s, columns, out, 0, n);
            return;
        }
        int mid = half(n);
        ParallelPair.run(() -> combineRows(basis, count, s, columns, out, 0, mid),
                () -> combineRows(basis, count, s, columns, out, mid, n));
    }

    /** The cut between the two halves: a multiple of the block length near n/2. */
    private static int half(int n) {
        return Math.max(BLOCK, (n / 2) / BLOCK * BLOCK);
    }

    private static void dotsRows(double[][] basis, int count, double[][] x, int nx, double[][] out, int from, int to) {
        for (int c = 0; c < nx; c++) {
            java.util.Arrays.fill(out[c], 0, count, 0.0);
        }
        for (int r0 = from; r0 < to; r0 += BLOCK) {
            int r1 = Math.min(to, r0 + BLOCK);
            int i = 0;
            // two basis vectors against two x at a time: four independent sums share each load
            for (; i + 1 < count; i += 2) {
                double[] b0 = basis[i];
                double[] b1 = basis[i + 1];
                int c = 0;
                for (; c + 1 < nx; c += 2) {
                    double[] x0 = x[c];
                    double[] x1 = x[c + 1];
                    double s00 = 0;
                    double s01 = 0;
                    double s10 = 0;
                    double s11 = 0;
                    for (int r = r0; r < r1; r++) {
                        double u = b0[r];
                        double w = b1[r];
                        double p = x0[r];
                        double q = x1[r];
                        s00 += u * p;
                        s01 += u * q;
                        s10 += w * p;
                        s11 += w * q;
                    }
                    out[c][i] += s00;
                    out[c + 1][i] += s01;
                    out[c][i + 1] += s10;
                    out[c + 1][i + 1] += s11;
                }
                for (; c < nx; c++) {
                    double[] x0 = x[c];
                    double s0 = 0;
                    double s1 = 0;
                    for (int r = r0; r < r1; r++) {
                        double p = x0[r];
                        s0 += b0[r] * p;
                        s1 += b1[r] * p;
                    }
                    out[c][i] += s0;
                    out[c][i + 1] += s1;
                }
            }
            for (; i < count; i++) {
                double[] b0 = basis[i];
                for (int c = 0; c < nx; c++) {
                    double[] xc = x[c];
                    double s0 = 0;
                    double s1 = 0;
                    int r = r0;
                    for (; r + 1 < r1; r += 2) {
                        s0 += b0[r] * xc[r];
                        s1 += b0[r + 1] * xc[r + 1];
                    }
                    if (r < r1) {
                        s0 += b0[r] * xc[r];
                    }
                    out[c][i] += s0 + s1;
                }
            }
        }
    }

    private static void subtractRows(double[][] basis, int count, double[][] coef, double[][] x, int nx, int from,
                                     int to) {
        for (int r0 = from; r0 < to; r0 += BLOCK) {
            int r1 = Math.min(to, r0 + BLOCK);
            for (int c = 0; c < nx; c++) {
                double[] xc = x[c];
                double[] k = coef[c];
                int i = 0;
                for (; i + 1 < count; i += 2) {
                    double[] b0 = basis[i];
                    double[] b1 = basis[i + 1];
                    double c0 = k[i];
                    double c1 = k[i + 1];
                    for (int r = r0; r < r1; r++) {
                        xc[r] -= c0 * b0[r] + c1 * b1[r];
                    }
                }
                if (i < count) {
                    double[] b0 = basis[i];
                    double c0 = k[i];
                    for (int r = r0; r < r1; r++) {
                        xc[r] -= c0 * b0[r];
                    }
                }
            }
        }
    }

    private static void combineRows(double[][] basis, int count, double[][] s, int columns, double[][] out, int from,
                                    int to) {
        for (int r0 = from; r0 < to; r0 += BLOCK) {
            int r1 = Math.min(to, r0 + BLOCK);
            for (int i = 0; i < columns; i++) {
                double[] y = out[i];
                java.util.Arrays.fill(y, r0, r1, 0.0);
                int q = 0;
                for (; q + 1 < count; q += 2) {
                    double[] b0 = basis[q];
                    double[] b1 = basis[q + 1];
                    double c0 = s[q][i];
                    double c1 = s[q + 1][i];
                    for (int r = r0; r < r1; r++) {
                        y[r] += c0 * b0[r] + c1 * b1[r];
                    }
                }
                if (q < count) {
                    double[] b0 = basis[q];
                    double c0 = s[q][i];
                    for (int r = r0; r < r1; r++) {
                        y[r] += c0 * b0[r];
                    }
                }
            }
        }
    }
}
