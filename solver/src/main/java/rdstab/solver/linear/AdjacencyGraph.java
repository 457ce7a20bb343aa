package rdstab.solver.linear;

import org.ejml.data.DMatrixSparseCSC;

/**
 * The undirected graph of a square sparse matrix: vertices are the unknowns, and i, j (i ≠ j) are
 * adjacent when A_ij ≠ 0 or A_ji ≠ 0 (the pattern of A + Aᵀ without the diagonal). Stored in
 * compressed form: the neighbours of v are {@code adjacency[start[v] .. start[v+1])}, sorted and
 * without duplicates. Only the pattern is read; explicitly stored zeros count as edges.
 */
final class AdjacencyGraph {

    final int n;
    final int[] start;
    final int[] adjacency;

    private AdjacencyGraph(int n, int[] start, int[] adjacency) {
        this.n = n;
        this.start = start;
        this.adjacency = adjacency;
    }

    int degree(int v) {
        return start[v + 1] - start[v];
    }

    /** Graph of A + Aᵀ (A square). */
    static AdjacencyGraph of(DMatrixSparseCSC a) {
        int n = a.numCols;
        int[] count = new int[n + 1];
        for (int j = 0; j < n; j++) {
            for (int q = a.col_idx[j]; q < a.col_idx[j + 1]; q++) {
                int i = a.nz_rows[q];
                if (i != j) {
                    count[i]++;
                    count[j]++;
                }
            }
        }
        int[] start = new int[n + 1];
        for (int v = 0; v < n; v++) {
            start[v + 1] = start[v] + count[v];
        }
        int[] raw = new int[start[n]];
        int[] fill = java.util.Arrays.copyOf(start, n);
        for (int j = 0; j < n; j++) {
            for (int q = a.col_idx[j]; q < a.col_idx[j + 1]; q++) {
                int i = a.nz_rows[q];
                if (i != j) {
                    raw[fill[i]++] = j;
                    raw[fill[j]++] = i;
                }
            }
        }
        // sort each list and drop duplicates (an entry present in both A and Aᵀ appears twice)
        int[] compact = new int[n + 1];
        int out = 0;
        for (int v = 0; v < n; v++) {
            int from = start[v];
            int to = start[v + 1];
            java.util.Arrays.sort(raw, from, to);
            compact[v] = out;
            for (int q = from; q < to; q++) {
                if (q == from || raw[q] != raw[q - 1]) {
                    raw[out++] = raw[q];
                }
            }
        }
        compact[n] = out;
        return new AdjacencyGraph(n, compact, java.util.Arrays.copyOf(raw, out));
    }
}
