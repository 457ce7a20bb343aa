package rdstab.solver.linear;

import java.util.Arrays;
import org.ejml.data.DMatrixSparseCSC;

/**
 * Symbolic Cholesky analysis of B = A(p, p) for a symmetric pattern: elimination tree, its postorder
 * (folded into p, which leaves the fill unchanged), the column counts of L, the supernode partition
 * and each supernode's row structure. It depends only on the pattern of A and on the ordering, so it
 * is computed once and reused for every matrix with the same pattern (Newton steps, shifts,
 * continuation steps, sweep points).
 *
 * <p>A supernode is a range of consecutive columns f..l of L whose structures below the diagonal
 * block coincide; it is stored as one dense m×w column-major panel (m = number of rows of column f,
 * w = l − f + 1). Consecutive columns j, j+1 join when parent(j) = j+1 and
 * |L(:,j)| = |L(:,j+1)| + 1 (exact supernodes). Small chains are further merged ("relaxed"
 * amalgamation) while the merged panel stores at most {@link #RELAX_ZEROS} explicit zeros per
 * true non-zero or is at most {@link #RELAX_ALWAYS} columns wide: this trades a little memory and
 * arithmetic for dense kernels on wider panels.
 *
 * <p>Algorithms: elimination tree by Liu's path-compressed ancestor search; row structures of L by
 * traversing the row subtrees (O(|L|)); see T. A. Davis, <i>Direct Methods for Sparse Linear
 * Systems</i>, SIAM 2006, ch. 4.
 */
final class CholeskySymbolic {

    /** Chains up to this many columns are always merged. */
    static final int RELAX_ALWAYS = 8;
    /** Merging wider chains is allowed while explicit zeros stay below this fraction of the panel entries. */
    static final double RELAX_ZEROS = 0.05;
    /** Merged panels are not widened beyond this many columns. */
    static final int RELAX_MAX_WIDTH = 96;

    final int n;
    /** Final symmetric permutation (ordering then etree postorder), p[new] = old. */
    final int[] perm;
    /** Number of supernodes. */
    final int supernodes;
    /** first[s] .. first[s+1]−1 are the columns of supernode s. */
    final int[] first;
    /** rowStart[s] .. rowStart[s+1]−1 index rows[] for supernode s (sorted, beginning with its own columns). */
    final int[] rowStart;
    final int[] rows;
    /** Offset of supernode s's panel in the value array. */
    final long[] valueStart;
    /** Supernode of each column. */
    final int[] superOf;
    /** For each stored entry q of A: its position in the value array, or −1 when it lies above the diagonal of B. */
    final long[] scatter;
    /** Non-zeros of L counted without the explicit zeros of relaxed panels. */
    final long nonZeros;

    private CholeskySymbolic(int n, int[] perm, int[] first, int[] rowStart, int[] rows, long[] valueStart,
                             int[] superOf, long[] scatter, long nonZeros) {
        this.n = n;
        this.perm = perm;
        this.supernodes = first.length - 1;
        this.first = first;
        this.rowStart = rowStart;
        this.rows = rows;
        this.valueStart = valueStart;
        this.superOf = superOf;
        this.scatter = scatter;
        this.nonZeros = nonZeros;
    }

    private volatile TreeSplit split;

    /** The two-thread split of the supernodal tree (computed on first use, then kept with the analysis). */
    TreeSplit split() {
        TreeSplit t = split;
        if (t == null) {
            t = TreeSplit.of(this);
            split = t;
        }
        return t;
    }

    /** Total length of the value array. */
    long values() {
        return valueStart[supernodes];
    }

    /** Analyses the pattern of A (square, symmetric pattern assumed) under the ordering p0. */
    static CholeskySymbolic analyse(DMatrixSparseCSC a, int[] p0) {
        int n = a.numCols;
        int[] parent0 = etree(Pattern.of(a, p0, SparseOps.inverse(p0)));
        int[] post = postorder(parent0);
        int[] perm = compose(p0, post);
        int[] pinv = SparseOps.inverse(perm);
        Pattern b = Pattern.of(a, perm, pinv);
        int[] parent = etree(b);
        int[] count = columnCounts(b, parent);
        long nnz = sum(count);
        int[] first = partition(parent, count);
        int ns = first.length - 1;
        int[] superOf = owners(first, n);
        int[][] struct = structures(b, parent, first, superOf, count);
        int[] rowStart = new int[ns + 1];
        long[] valueStart = new long[ns + 1];
        int[] rows = pack(struct, first, rowStart, valueStart);
        long[] scatter = scatterMap(a, pinv, first, rowStart, rows, valueStart, superOf);
        return new CholeskySymbolic(n, perm, first, rowStart, rows, valueStart, superOf, scatter, nnz);
    }

    // analyse's own loops are small methods: the JIT compiles each alone rather than analyse whole with all it
    // inlines (0.12 s of C2 CPU in a one-shot 512² run).

    /** perm[k] = p0[post[k]]. */
    private static int[] compose(int[] p0, int[] post) {
        int[] perm = new int[post.length];
        for (int k = 0; k < perm.length; k++) {
            perm[k] = p0[post[k]];
        }
        return perm;
    }

    private static long sum(int[] count) {
        long nnz = 0;
        for (int c : count) {
            nnz += c;
        }
        return nnz;
    }

    /** superOf[c] = the supernode holding column c. */
    private static int[] owners(int[] first, int n) {
        int[] superOf = new int[n];
        for (int s = 0; s + 1 < first.length; s++) {
            Arrays.fill(superOf, first[s], first[s + 1], s);
        }
        return superOf;
    }

    /** The row lists one after the other; fills rowStart and valueStart (panel offsets, column-major m×w). */
    private static int[] pack(int[][] struct, int[] first, int[] rowStart, long[] valueStart) {
        int ns = struct.length;
        for (int s = 0; s < ns; s++) {
            rowStart[s + 1] = rowStart[s] + struct[s].length;
            valueStart[s + 1] = valueStart[s] + (long) struct[s].length * (first[s + 1] - first[s]);
        }
        int[] rows = new int[rowStart[ns]];
        for (int s = 0; s < ns; s++) {
            System.arraycopy(struct[s], 0, rows, rowStart[s], struct[s].length);
        }
        return rows;
    }

    /**
     * The pattern of B = A(p, p), column by column, rows in no particular order and no values: all the symbolic
     * phase reads (the elimination tree, the column counts and the row structures sort what they need). Cheaper
     * than a permuted copy of A with sorted columns, which was formed twice per analysis before.
     */
    record Pattern(int n, int[] colIdx, int[] rows) {
        /** The pattern of A(p, p); pinv is the inverse of p. */
        static Pattern of(DMatrixSparseCSC a, int[] p, int[] pinv) {
            int n = a.numCols;
            int[] colIdx = new int[n + 1];
            int[] rows = new int[a.col_idx[n]];
            int nz = 0;
            for (int jNew = 0; jNew < n; jNew++) {
                int jOld = p[jNew];
                colIdx[jNew] = nz;
                for (int q = a.col_idx[jOld]; q < a.col_idx[jOld + 1]; q++) {
                    rows[nz++] = pinv[a.nz_rows[q]];
                }
            }
            colIdx[n] = nz;
            return new Pattern(n, colIdx, rows);
        }
    }

    /** Elimination tree of a symmetric pattern (upper triangle read): parent[j] or −1 for a root. */
    static int[] etree(Pattern b) {
        int n = b.n();
        int[] colIdx = b.colIdx();
        int[] rowsOf = b.rows();
        int[] parent = new int[n];
        int[] ancestor = new int[n];
        for (int k = 0; k < n; k++) {
            parent[k] = -1;
            ancestor[k] = -1;
            for (int q = colIdx[k]; q < colIdx[k + 1]; q++) {
                int i = rowsOf[q];
                while (i != -1 && i < k) {
                    int next = ancestor[i];
                    ancestor[i] = k;
                    if (next == -1) {
                        parent[i] = k;
                    }
                    i = next;
                }
            }
        }
        return parent;
    }

    /** Depth-first postorder of a forest: post[k] = node numbered k. */
    static int[] postorder(int[] parent) {
        int n = parent.length;
        int[] head = new int[n];
        int[] next = new int[n];
        Arrays.fill(head, -1);
        for (int j = n - 1; j >= 0; j--) {
            if (parent[j] != -1) {
                next[j] = head[parent[j]];
                head[parent[j]] = j;
            }
        }
        int[] post = new int[n];
        int[] stack = new int[n];
        int k = 0;
        for (int root = 0; root < n; root++) {
            if (parent[root] != -1) {
                continue;
            }
            int top = 0;
            stack[0] = root;
            while (top >= 0) {
                int p = stack[top];
                int child = head[p];
                if (child == -1) {
                    top--;
                    post[k++] = p;
                } else {
                    head[p] = next[child];
                    stack[++top] = child;
                }
            }
        }
        return post;
    }

    /** |L(:,j)| including the diagonal, by walking each row subtree (O(|L|) time). */
    private static int[] columnCounts(Pattern b, int[] parent) {
        int n = b.n();
        int[] colIdx = b.colIdx();
        int[] rowsOf = b.rows();
        int[] count = new int[n];
        int[] flag = new int[n];
        Arrays.fill(flag, -1);
        for (int i = 0; i < n; i++) {
            flag[i] = i;
            count[i]++;
            for (int q = colIdx[i]; q < colIdx[i + 1]; q++) {
                int k = rowsOf[q];
                while (k < i && flag[k] != i) {
                    count[k]++;
                    flag[k] = i;
                    k = parent[k];
                }
            }
        }
        return count;
    }

    /** Supernode boundaries: exact supernodes, then relaxed merging of a child chain into its parent. */
    private static int[] partition(int[] parent, int[] count) {
        int n = parent.length;
        int[] firsts = new int[n + 1];
        int ns = 0;
        for (int j = 0; j < n; j++) {
            boolean joins = j > 0 && parent[j - 1] == j && count[j - 1] == count[j] + 1;
            if (!joins) {
                firsts[ns++] = j;
            }
        }
        firsts[ns] = n;
        // relaxed amalgamation: merge supernode s into s+1 when s's last column has its parent in s+1
        int[] out = new int[ns + 1];
        int m = 0;
        int curFirst = firsts[0];
        long curTrue = 0;
        for (int s = 0; s < ns; s++) {
            int f = firsts[s];
            int l = firsts[s + 1];
            long trueNz = 0;
            for (int j = f; j < l; j++) {
                trueNz += count[j];
            }
            if (s > 0 && f > curFirst && parent[f - 1] >= f && parent[f - 1] < l) {
                int w = l - curFirst;
                long rowsMerged = (long) count[f] + (f - curFirst);
                long stored = rowsMerged * w - (long) w * (w - 1) / 2;
                long merged = curTrue + trueNz;
                boolean take = w <= RELAX_ALWAYS
                        || (w <= RELAX_MAX_WIDTH && stored - merged <= RELAX_ZEROS * stored);
                if (take) {
                    curTrue = merged;
                    continue;
                }
            }
            if (s > 0) {
                out[m++] = curFirst;
            }
            curFirst = f;
            curTrue = trueNz;
        }
        out[m++] = curFirst;
        out[m] = n;
        return Arrays.copyOf(out, m + 1);
    }

    /** Row structure of each supernode: its columns, the rows of B below them, and its child supernodes' rows. */
    private static int[][] structures(Pattern b, int[] parent, int[] first, int[] superOf, int[] count) {
        int ns = first.length - 1;
        int n = b.n();
        int[] colIdx = b.colIdx();
        int[] rowsOf = b.rows();
        int[][] struct = new int[ns][];
        int[] headChild = new int[ns];
        int[] nextChild = new int[ns];
        Arrays.fill(headChild, -1);
        for (int s = 0; s < ns; s++) {
            int last = first[s + 1] - 1;
            int p = parent[last];
            if (p != -1) {
                int t = superOf[p];
                nextChild[s] = headChild[t];
                headChild[t] = s;
            }
        }
        int[] flag = new int[n];
        Arrays.fill(flag, -1);
        int[] buf = new int[n];
        for (int s = 0; s < ns; s++) {
            int f = first[s];
            int l = first[s + 1];
            int len = 0;
            for (int j = f; j < l; j++) {
                flag[j] = s;
                buf[len++] = j;
            }
            for (int j = f; j < l; j++) {
                for (int q = colIdx[j]; q < colIdx[j + 1]; q++) {
                    int i = rowsOf[q];
                    if (i >= l && flag[i] != s) {
                        flag[i] = s;
                        buf[len++] = i;
                    }
                }
            }
            for (int c = headChild[s]; c != -1; c = nextChild[c]) {
                for (int i : struct[c]) {
                    if (i >= l && flag[i] != s) {
                        flag[i] = s;
                        buf[len++] = i;
                    }
                }
            }
            int[] rs = Arrays.copyOf(buf, len);
            Arrays.sort(rs, l - f, len);
            struct[s] = rs;
        }
        return struct;
    }

    /** Position of every lower-triangle entry of B = A(perm, perm) in the panel storage (pinv the inverse of perm). */
    private static long[] scatterMap(DMatrixSparseCSC a, int[] pinv, int[] first, int[] rowStart, int[] rows,
                                     long[] valueStart, int[] superOf) {
        int n = a.numCols;
        long[] scatter = new long[a.nz_length];
        for (int jOld = 0; jOld < n; jOld++) {
            for (int q = a.col_idx[jOld]; q < a.col_idx[jOld + 1]; q++) {
                int i = pinv[a.nz_rows[q]];
                int j = pinv[jOld];
                if (i < j) {
                    scatter[q] = -1;
                    continue;
                }
                int s = superOf[j];
                int m = rowStart[s + 1] - rowStart[s];
                int r = Arrays.binarySearch(rows, rowStart[s], rowStart[s + 1], i) - rowStart[s];
                if (i < first[s + 1]) {
                    r = i - first[s];
                }
                scatter[q] = valueStart[s] + (long) (j - first[s]) * m + r;
            }
        }
        return scatter;
    }
}
