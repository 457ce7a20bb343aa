package rdstab.solver.linear;

import java.util.Arrays;
import org.ejml.data.DMatrixSparseCSC;

/**
 * Everything about a factorization that depends only on the sparsity pattern: the fill-reducing
 * permutation and, for Cholesky, the elimination tree, supernodes and the structure of L. Computed
 * once per pattern and reused for every matrix with that pattern — Newton steps (the Jacobian's
 * pattern is fixed by the mesh), shifts σM − J, continuation steps and sweep points — so a
 * refactorization costs only the numeric phase.
 *
 * <p><b>LU.</b> A general matrix is first factorized without row interchanges by
 * {@link SupernodalLU} on the Cholesky structure of the symmetrized pattern A + Aᵀ (whole structure
 * reused, dense supernodal kernels). When that is refused (a round-off-level pivot, or a backward
 * error of a test solve above {@link SupernodalLU#BACKWARD_ERROR_LIMIT}), LU with partial pivoting
 * ({@link SparseLU}) runs on the same ordering; there only the column ordering and the permutation
 * of the entries are reused, since the row pivots, and with them the patterns of L and U, depend on
 * the values.
 *
 * <p>Immutable and thread-safe; {@link #factor} returns a new factorization each call.
 */
public final class SymbolicAnalysis {

    private final boolean symmetricPositive;
    private final int n;
    private final int[] colIdx;
    private final int[] rowIdx;
    private final int[] perm;
    private final CholeskySymbolic cholesky;
    /** Entry targets in A(p, p) for the pivoted fallback; computed on first need (idempotent, so a race only repeats work). */
    private volatile int[] luTarget;
    private final CholeskySymbolic luStructure;
    private final long[] luPanelTarget;
    private final double seconds;

    private SymbolicAnalysis(boolean spd, DMatrixSparseCSC a, int[] perm, CholeskySymbolic cholesky, int[] luTarget,
                             CholeskySymbolic luStructure, double seconds) {
        this.symmetricPositive = spd;
        this.n = a.numCols;
        this.colIdx = Arrays.copyOf(a.col_idx, a.numCols + 1);
        this.rowIdx = Arrays.copyOf(a.nz_rows, a.nz_length);
        this.perm = perm;
        this.cholesky = cholesky;
        this.luTarget = luTarget;
        this.luStructure = luStructure;
        this.luPanelTarget = luStructure == null ? null : SupernodalLU.targets(a, luStructure);
        this.seconds = seconds;
    }

    /**
     * Analyses the pattern of A.
     *
     * @param a                 square matrix (its values are not read)
     * @param symmetricPositive true for a Cholesky analysis (A symmetric positive definite), false for LU
     * @param ordering          fill-reducing ordering
     */
    public static SymbolicAnalysis of(DMatrixSparseCSC a, boolean symmetricPositive, Ordering ordering) {
        PermutedFactorization.requireSquare(a);
        long t0 = System.nanoTime();
        int[] p = ordering.permutation(a);
        requirePermutation(p, a.numCols);
        if (symmetricPositive) {
            CholeskySymbolic c = CholeskySymbolic.analyse(a, p);
            return new SymbolicAnalysis(true, a, c.perm, c, null, null, (System.nanoTime() - t0) * 1e-9);
        }
        CholeskySymbolic s = CholeskySymbolic.analyse(symmetrizedPattern(a), p);
        return new SymbolicAnalysis(false, a, p, null, null, s, (System.nanoTime() - t0) * 1e-9);
    }

    /** True when A has exactly the analysed pattern (same order, column pointers and row indices). */
    public boolean matches(DMatrixSparseCSC a) {
        if (a.numCols != n || a.numRows != n || a.nz_length != rowIdx.length) {
            return false;
        }
        return Arrays.equals(colIdx, 0, n + 1, a.col_idx, 0, n + 1)
                && Arrays.equals(rowIdx, 0, rowIdx.length, a.nz_rows, 0, rowIdx.length);
    }

    /**
     * Numeric factorization of A on this analysis.
     *
     * @throws IllegalArgumentException when A's pattern differs from the analysed one
     * @throws rdstab.solver.error.ConvergenceException SINGULAR_SHIFT when A is numerically singular
     *         (or, for Cholesky, not positive definite)
     */
    public SparseFactorization factor(DMatrixSparseCSC a) {
        if (!matches(a)) {
            throw new IllegalArgumentException("the matrix pattern (" + a.numRows + "x" + a.numCols + ", " + a.nz_length
                    + " entries) differs from the analysed one (" + n + "x" + n + ", " + rowIdx.length + " entries)");
        }
        if (symmetricPositive) {
            return SupernodalCholesky.factor(a, cholesky);
        }
        SupernodalLU fast = SupernodalLU.tryFactor(a, luStructure, luPanelTarget);
        if (fast != null) {
            return fast;
        }
        return factorPivoted(a);
    }

    /** True when a factorization came from the LU without row interchanges (the fast path of {@link #factor}). */
    public static boolean withoutInterchanges(SparseFactorization f) {
        return f instanceof SupernodalLU;
    }

    /**
     * LU with partial pivoting on the analysed ordering, skipping the fast path: for callers that found the
     * fast factorization's solutions not accurate enough (e.g. a shift very close to an eigenvalue).
     *
     * @throws IllegalArgumentException when the analysis is a Cholesky one or the pattern differs
     */
    public SparseFactorization factorPivoted(DMatrixSparseCSC a) {
        if (symmetricPositive) {
            throw new IllegalArgumentException("a Cholesky analysis has no pivoted LU");
        }
        if (!matches(a)) {
            throw new IllegalArgumentException("the matrix pattern differs from the analysed one");
        }
        int[] target = luTarget;
        if (target == null) {
            target = luTargets(a, perm);
            luTarget = target;
        }
        DMatrixSparseCSC pa = new DMatrixSparseCSC(n, n, a.nz_length);
        int[] pinvCols = new int[n + 1];
        int[] pinv = SparseOps.inverse(perm);
        for (int j = 0; j < n; j++) {
            pinvCols[pinv[j] + 1] = a.col_idx[j + 1] - a.col_idx[j];
        }
        for (int k = 0; k < n; k++) {
            pinvCols[k + 1] += pinvCols[k];
        }
        System.arraycopy(pinvCols, 0, pa.col_idx, 0, n + 1);
        for (int q = 0; q < a.nz_length; q++) {
            int t = target[q];
            pa.nz_rows[t] = pinv[a.nz_rows[q]];
            pa.nz_values[t] = a.nz_values[q];
        }
        pa.nz_length = a.nz_length;
        pa.indicesSorted = true;
        return SparseLU.factorPermuted(a, perm, pa);
    }

    /** The symmetric permutation used, p[new] = old (a copy). */
    public int[] permutation() {
        return perm.clone();
    }

    /** True for a Cholesky analysis. */
    public boolean symmetricPositive() {
        return symmetricPositive;
    }

    /** Wall time the ordering and analysis took. */
    public double seconds() {
        return seconds;
    }

    /** Non-zeros of L predicted by the Cholesky analysis, or −1 for LU (known only after pivoting). */
    public long predictedNonZeros() {
        return cholesky == null ? -1 : cholesky.nonZeros;
    }

    /** Order n. */
    public int size() {
        return n;
    }

    /** Pattern of A + Aᵀ (all values 1, so nothing cancels). */
    private static DMatrixSparseCSC symmetrizedPattern(DMatrixSparseCSC a) {
        DMatrixSparseCSC ones = a.copy();
        Arrays.fill(ones.nz_values, 0, ones.nz_length, 1.0);
        DMatrixSparseCSC t = org.ejml.sparse.csc.CommonOps_DSCC.transpose(ones, null, null);
        return SparseOps.add(1.0, ones, 1.0, t);
    }

    /** Destination of every entry of A in A(p, p) with row indices sorted within each column. */
    private static int[] luTargets(DMatrixSparseCSC a, int[] p) {
        int n = a.numCols;
        int[] pinv = SparseOps.inverse(p);
        int[] target = new int[a.nz_length];
        int[] start = new int[n + 1];
        for (int j = 0; j < n; j++) {
            start[pinv[j] + 1] = a.col_idx[j + 1] - a.col_idx[j];
        }
        for (int k = 0; k < n; k++) {
            start[k + 1] += start[k];
        }
        long[] keyed = new long[0];
        for (int j = 0; j < n; j++) {
            int from = a.col_idx[j];
            int len = a.col_idx[j + 1] - from;
            if (keyed.length < len) {
                keyed = new long[Math.max(len, 2 * keyed.length)];
            }
            for (int q = 0; q < len; q++) {
                keyed[q] = ((long) pinv[a.nz_rows[from + q]] << 32) | q;
            }
            Arrays.sort(keyed, 0, len);
            int base = start[pinv[j]];
            for (int r = 0; r < len; r++) {
                target[from + (int) (keyed[r] & 0xffffffffL)] = base + r;
            }
        }
        return target;
    }

    private static void requirePermutation(int[] p, int n) {
        if (p.length != n) {
            throw new IllegalStateException("ordering returned " + p.length + " entries for order " + n);
        }
        boolean[] seen = new boolean[n];
        for (int v : p) {
            if (v < 0 || v >= n || seen[v]) {
                throw new IllegalStateException("ordering returned no permutation (entry " + v + ")");
            }
            seen[v] = true;
        }
    }
}
