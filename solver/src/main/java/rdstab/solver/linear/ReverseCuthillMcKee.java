package rdstab.solver.linear;

import java.util.Arrays;
import org.ejml.data.DMatrixSparseCSC;

/**
 * Reverse Cuthill–McKee ordering: a breadth-first numbering of the graph of A + Aᵀ started from a
 * pseudo-peripheral vertex, neighbours visited by increasing degree, then reversed. It reduces the
 * bandwidth and hence the envelope fill of LU/Cholesky. Disconnected components are numbered one
 * after the other.
 */
final class ReverseCuthillMcKee {

    private ReverseCuthillMcKee() {
    }

    /** @return p with p[new] = old */
    static int[] order(DMatrixSparseCSC a) {
        int n = a.numCols;
        int[][] adj = SparseOps.symmetricAdjacency(a);
        int[] perm = new int[n];
        boolean[] placed = new boolean[n];
        int count = 0;
        int[] level = new int[n];
        while (count < n) {
            int start = -1;
            for (int v = 0; v < n; v++) {
                if (!placed[v] && (start < 0 || adj[v].length < adj[start].length)) {
                    start = v;
                }
            }
            start = pseudoPeripheral(adj, start, placed, level);
            count = breadthFirst(adj, start, placed, perm, count);
        }
        for (int i = 0, k = n - 1; i < k; i++, k--) {
            int t = perm[i];
            perm[i] = perm[k];
            perm[k] = t;
        }
        return perm;
    }

    /** Numbers the component of {@code start}; returns the new count. */
    private static int breadthFirst(int[][] adj, int start, boolean[] placed, int[] perm, int count) {
        int head = count;
        perm[count++] = start;
        placed[start] = true;
        while (head < count) {
            int v = perm[head++];
            int first = count;
            for (int w : adj[v]) {
                if (!placed[w]) {
                    placed[w] = true;
                    perm[count++] = w;
                }
            }
            sortByDegree(perm, first, count, adj);
        }
        return count;
    }

    private static void sortByDegree(int[] perm, int from, int to, int[][] adj) {
        for (int i = from + 1; i < to; i++) {
            int v = perm[i];
            int j = i - 1;
            while (j >= from && adj[perm[j]].length > adj[v].length) {
                perm[j + 1] = perm[j];
                j--;
            }
            perm[j + 1] = v;
        }
    }

    /** George–Liu heuristic: repeat BFS from the farthest, smallest-degree vertex while eccentricity grows. */
    private static int pseudoPeripheral(int[][] adj, int start, boolean[] placed, int[] level) {
        int current = start;
        int eccentricity = -1;
        for (int iter = 0; iter < 8; iter++) {
            Arrays.fill(level, -1);
            int[] queue = new int[adj.length];
            int head = 0;
            int tail = 0;
            queue[tail++] = current;
            level[current] = 0;
            int far = current;
            while (head < tail) {
                int v = queue[head++];
                for (int w : adj[v]) {
                    if (!placed[w] && level[w] < 0) {
                        level[w] = level[v] + 1;
                        queue[tail++] = w;
                        if (level[w] > level[far] || (level[w] == level[far] && adj[w].length < adj[far].length)) {
                            far = w;
                        }
                    }
                }
            }
            if (level[far] <= eccentricity) {
                break;
            }
            eccentricity = level[far];
            current = far;
        }
        return current;
    }
}
