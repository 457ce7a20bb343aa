package rdstab.solver.eigen;

/**
 * Products of a Krylov basis (an array of long vectors) with small coefficient arrays, blocked by rows:
 * each basis vector streams through memory once per operation while a short block of the result (or of the
 * vector being orthogonalised) stays in the first-level cache. Done one vector at a time, a restart that
 * forms k combinations of an m-vector basis reads the basis k times; at 512² unknowns that was a third of
 * the Lanczos iteration.
 */
final class BasisOps {

    /** Rows per block: 1024 doubles = 8 KiB, so a block of x plus one of each basis vector fits in L1/L2. */
    static final int BLOCK = 1024;

    private BasisOps() {
    }

    /** out[i] = ⟨basis[i], x⟩ for i &lt; count (Euclidean). */
    static void dots(double[][] basis, int count, double[] x, double[] out) {
        java.util.Arrays.fill(out, 0, count, 0.0);
        int n = x.length;
        for (int r0 = 0; r0 < n; r0 += BLOCK) {
            int r1 = Math.min(n, r0 + BLOCK);
            for (int i = 0; i < count; i++) {
                double[] b = basis[i];
                double s0 = 0;
                double s1 = 0;
                int r = r0;
                for (; r + 1 < r1; r += 2) {
                    s0 += b[r] * x[r];
                    s1 += b[r + 1] * x[r + 1];
                }
                if (r < r1) {
                    s0 += b[r] * x[r];
                }
                out[i] += s0 + s1;
            }
        }
    }

    /** x −= Σ_{i &lt; count} c[i]·basis[i]. */
    static void subtract(double[][] basis, int count, double[] c, double[] x) {
        int n = x.length;
        for (int r0 = 0; r0 < n; r0 += BLOCK) {
            int r1 = Math.min(n, r0 + BLOCK);
            int i = 0;
            for (; i + 1 < count; i += 2) {
                double[] b0 = basis[i];
                double[] b1 = basis[i + 1];
                double c0 = c[i];
                double c1 = c[i + 1];
                for (int r = r0; r < r1; r++) {
                    x[r] -= c0 * b0[r] + c1 * b1[r];
                }
            }
            if (i < count) {
                double[] b0 = basis[i];
                double c0 = c[i];
                for (int r = r0; r < r1; r++) {
                    x[r] -= c0 * b0[r];
                }
            }
        }
    }

    /**
     * out[i] = Σ_{q &lt; count} s[q][i]·basis[q] for i &lt; columns (out[i] overwritten; none of them may be a
     * basis vector).
     */
    static void combine(double[][] basis, int count, double[][] s, int columns, double[][] out) {
        int n = out[0].length;
        for (int r0 = 0; r0 < n; r0 += BLOCK) {
            int r1 = Math.min(n, r0 + BLOCK);
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
