package rdstab.solver.linear;

import org.ejml.data.DMatrixSparseCSC;

/** Small allocation-free kernels on EJML compressed-column matrices used by the solvers. */
public final class SparseOps {

    private SparseOps() {
    }

    /** y = A x (y overwritten). */
    public static void multiply(DMatrixSparseCSC a, double[] x, double[] y) {
        java.util.Arrays.fill(y, 0, a.numRows, 0.0);
        for (int j = 0; j < a.numCols; j++) {
            double xj = x[j];
            if (xj == 0.0) {
                continue;
            }
            for (int p = a.col_idx[j]; p < a.col_idx[j + 1]; p++) {
                y[a.nz_rows[p]] += a.nz_values[p] * xj;
            }
        }
    }

    /** ‖A‖₁ = maximum absolute column sum. */
    public static double norm1(DMatrixSparseCSC a) {
        double best = 0.0;
        for (int j = 0; j < a.numCols; j++) {
            double s = 0.0;
            for (int p = a.col_idx[j]; p < a.col_idx[j + 1]; p++) {
                s += Math.abs(a.nz_values[p]);
            }
            best = Math.max(best, s);
        }
        return best;
    }

    /** Diagonal of A (zero where not stored). */
    public static double[] diagonal(DMatrixSparseCSC a) {
        double[] d = new double[Math.min(a.numRows, a.numCols)];
        for (int j = 0; j < d.length; j++) {
            for (int p = a.col_idx[j]; p < a.col_idx[j + 1]; p++) {
                if (a.nz_rows[p] == j) {
                    d[j] += a.nz_values[p];
                }
            }
        }
        return d;
    }

    /** True when every stored non-zero lies on the diagonal. */
    public static boolean isDiagonal(DMatrixSparseCSC a) {
        for (int j = 0; j < a.numCols; j++) {
            for (int p = a.col_idx[j]; p < a.col_idx[j + 1]; p++) {
                if (a.nz_rows[p] != j && a.nz_values[p] != 0.0) {
                    return false;
                }
            }
        }
        return true;
    }

    /** α A + β B (patterns merged). */
    public static DMatrixSparseCSC add(double alpha, DMatrixSparseCSC a, double beta, DMatrixSparseCSC b) {
        DMatrixSparseCSC c = new DMatrixSparseCSC(a.numRows, a.numCols, a.nz_length + b.nz_length);
        org.ejml.sparse.csc.CommonOps_DSCC.add(alpha, a, beta, b, c, null, null);
        return c;
    }

    /** B = A(p, p) with p[new] = old; columns of B have sorted row indices. */
    static DMatrixSparseCSC permuteSymmetric(DMatrixSparseCSC a, int[] p) {
        int n = a.numCols;
        int[] pinv = inverse(p);
        DMatrixSparseCSC b = new DMatrixSparseCSC(n, n, a.nz_length);
        int nz = 0;
        for (int jNew = 0; jNew < n; jNew++) {
            int jOld = p[jNew];
            b.col_idx[jNew] = nz;
            for (int q = a.col_idx[jOld]; q < a.col_idx[jOld + 1]; q++) {
                b.nz_rows[nz] = pinv[a.nz_rows[q]];
                b.nz_values[nz] = a.nz_values[q];
                nz++;
            }
        }
        b.col_idx[n] = nz;
        b.nz_length = nz;
        b.indicesSorted = false;
        b.sortIndices(null);
        return b;
    }

    /** The inverse permutation: pinv[p[k]] = k. */
    static int[] inverse(int[] p) {
        int[] pinv = new int[p.length];
        for (int k = 0; k < p.length; k++) {
            pinv[p[k]] = k;
        }
        return pinv;
    }

    /** Adjacency lists of the pattern of A + Aᵀ without the diagonal. */
    static int[][] symmetricAdjacency(DMatrixSparseCSC a) {
        int n = a.numCols;
        int[] deg = new int[n];
        for (int j = 0; j < n; j++) {
            for (int q = a.col_idx[j]; q < a.col_idx[j + 1]; q++) {
                int i = a.nz_rows[q];
                if (i != j) {
                    deg[i]++;
                    deg[j]++;
                }
            }
        }
        int[][] adj = new int[n][];
        for (int v = 0; v < n; v++) {
            adj[v] = new int[deg[v]];
        }
        int[] fill = new int[n];
        for (int j = 0; j < n; j++) {
            for (int q = a.col_idx[j]; q < a.col_idx[j + 1]; q++) {
                int i = a.nz_rows[q];
                if (i != j) {
                    adj[i][fill[i]++] = j;
                    adj[j][fill[j]++] = i;
                }
            }
        }
        for (int v = 0; v < n; v++) {
            adj[v] = java.util.Arrays.stream(adj[v]).sorted().distinct().toArray();
        }
        return adj;
    }
}
