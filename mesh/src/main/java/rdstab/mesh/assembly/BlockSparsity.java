package rdstab.mesh.assembly;

import java.util.Arrays;

import org.ejml.data.DMatrixSparseCSC;

/**
 * The fixed sparsity pattern of a node-major Jacobian built from a node graph, assembled directly
 * in compressed-column form (no triplets): memory O(nnz), time O(nnz log(stencil)).
 *
 * <p>Column (node c, field g) holds the rows (node r, field f) for every graph neighbour r of c
 * (c itself included) and every field f when r = c or {@code fullBlocks}, else only f = g; rows
 * and columns of fixed pairs are left out. Entries are then added by binary search in the
 * column, so assembly loops can add in any order; adding outside the pattern is a programming
 * error ({@link IllegalStateException}).
 */
public final class BlockSparsity {

    private final int n;
    private final int[] colStart;
    private int[] rows;
    private final int[] index;
    private final int nf;

    /**
     * @param adjStart   CSR start of each node's neighbour list (length nodes + 1)
     * @param adj        neighbours of each node in increasing order, the node itself included
     * @param index      unknown map index[node·nf + field] (−1 = fixed)
     * @param nf         fields per node
     * @param unknowns   number of unknowns
     * @param fullBlocks true when neighbours couple all field pairs, false for the diagonal only
     */
    public BlockSparsity(int[] adjStart, int[] adj, int[] index, int nf, int unknowns, boolean fullBlocks) {
        this.n = unknowns;
        this.index = index;
        this.nf = nf;
        int nodes = adjStart.length - 1;
        colStart = new int[unknowns + 1];
        int nnz = 0;
        for (int pass = 0; pass < 2; pass++) {
            int[] out = pass == 0 ? null : new int[nnz];
            nnz = 0;
            int col = 0;
            for (int c = 0; c < nodes; c++) {
                for (int g = 0; g < nf; g++) {
                    if (index[c * nf + g] < 0) {
                        continue;
                    }
                    colStart[col++] = nnz;
                    for (int p = adjStart[c]; p < adjStart[c + 1]; p++) {
                        int r = adj[p];
                        for (int f = 0; f < nf; f++) {
                            int row = index[r * nf + f];
                            if (row >= 0 && (r == c || fullBlocks || f == g)) {
                                if (out != null) {
                                    out[nnz] = row;
                                }
                                nnz++;
                            }
                        }
                    }
                }
            }
            colStart[col] = nnz;
            if (out != null) {
                rows = out;
                return;
            }
        }
        throw new IllegalStateException("unreachable");
    }

    /** Number of stored entries. */
    public int nonZeros() {
        return colStart[n];
    }

    /** A new zero matrix with this pattern (indices sorted). */
    public DMatrixSparseCSC newMatrix() {
        DMatrixSparseCSC m = new DMatrixSparseCSC(n, n, 0);
        m.col_idx = colStart.clone();
        m.nz_rows = rows.clone();
        m.nz_values = new double[rows.length];
        m.nz_length = rows.length;
        m.indicesSorted = true;
        return m;
    }

    /** Adds v to entry (node rn, field rf; node cn, field cg) of m; pairs with a fixed value are skipped. */
    public void add(DMatrixSparseCSC m, int rn, int rf, int cn, int cg, double v) {
        int r = index[rn * nf + rf];
        int c = index[cn * nf + cg];
        if (r < 0 || c < 0) {
            return;
        }
        int pos = Arrays.binarySearch(m.nz_rows, colStart[c], colStart[c + 1], r);
        if (pos < 0) {
            throw new IllegalStateException("entry (" + r + ", " + c + ") is outside the Jacobian pattern");
        }
        m.nz_values[pos] += v;
    }

    /**
     * Node-graph CSR (self included, sorted) from undirected edges (a_e, b_e), duplicates allowed.
     *
     * @return {adjStart, adj}
     */
    public static int[][] graph(int nodes, int[] a, int[] b) {
        long[] keys = new long[2 * a.length + nodes];
        int k = 0;
        for (int e = 0; e < a.length; e++) {
            keys[k++] = ((long) a[e] << 32) | b[e];
            keys[k++] = ((long) b[e] << 32) | a[e];
        }
        for (int i = 0; i < nodes; i++) {
            keys[k++] = ((long) i << 32) | i;
        }
        Arrays.sort(keys);
        int[] start = new int[nodes + 1];
        int[] adj = new int[keys.length];
        int m = 0;
        long prev = -1;
        for (long key : keys) {
            if (key == prev) {
                continue;
            }
            prev = key;
            start[(int) (key >>> 32) + 1]++;
            adj[m++] = (int) key;
        }
        for (int i = 0; i < nodes; i++) {
            start[i + 1] += start[i];
        }
        return new int[][] {start, Arrays.copyOf(adj, m)};
    }
}
