package rdstab.solver.linear;

import java.util.LinkedHashMap;
import java.util.Map;
import org.ejml.data.DMatrixSparseCSC;

/**
 * Chooses and caches factorizations: supernodal Cholesky for symmetric positive definite matrices,
 * LU with partial pivoting otherwise, always after a fill-reducing {@link Ordering}.
 *
 * <p><b>Contract.</b> {@code factor(A, spd, ordering)} returns F with F.solve(b) = A⁻¹b to the
 * backward accuracy of the factorization; a numerically singular A (or a non-positive-definite one
 * with spd = true) raises {@link rdstab.solver.error.ConvergenceException} SINGULAR_SHIFT. A is not
 * modified and not retained.
 *
 * <p><b>Symbolic reuse.</b> The {@link SymbolicAnalysis} of the last {@link #CACHE_SIZE} patterns is
 * kept (keyed by pattern, factorization kind and ordering instance), so repeated factorizations of
 * matrices with one pattern — every Newton step, every shift, every continuation step or sweep
 * point on one mesh — skip the ordering and the symbolic phase. A cache hit requires the exact
 * same pattern (column pointers and row indices compared entry by entry).
 */
public final class Factorizations {

    /** Number of symbolic analyses kept (a few: J and σM − J of the problem in hand, per thread of a sweep). */
    public static final int CACHE_SIZE = 6;

    private static final Map<Key, SymbolicAnalysis> CACHE = new LinkedHashMap<>(16, 0.75f, true) {
        @Override
        protected boolean removeEldestEntry(Map.Entry<Key, SymbolicAnalysis> eldest) {
            return size() > CACHE_SIZE;
        }
    };

    private Factorizations() {
    }

    /**
     * @param a                  square matrix
     * @param symmetricPositive  true when the caller knows A is SPD (Cholesky, about half the work and memory)
     * @param ordering           fill-reducing symmetric permutation
     */
    public static SparseFactorization factor(DMatrixSparseCSC a, boolean symmetricPositive, Ordering ordering) {
        return analysis(a, symmetricPositive, ordering).factor(a);
    }

    /** The symbolic analysis of A's pattern, from the cache or computed (and cached) now. */
    public static SymbolicAnalysis analysis(DMatrixSparseCSC a, boolean symmetricPositive, Ordering ordering) {
        Key key = new Key(fingerprint(a), a.numCols, a.nz_length, symmetricPositive, ordering);
        synchronized (CACHE) {
            SymbolicAnalysis s = CACHE.get(key);
            if (s != null && s.matches(a)) {
                return s;
            }
        }
        SymbolicAnalysis s = SymbolicAnalysis.of(a, symmetricPositive, ordering);
        synchronized (CACHE) {
            CACHE.put(key, s);
        }
        return s;
    }

    /** Forgets every cached analysis (tests; or to release memory after a large problem). */
    public static void clearCache() {
        synchronized (CACHE) {
            CACHE.clear();
        }
    }

    /** Default ordering: {@link Ordering#automatic()} (natural order for narrow bands, nested dissection otherwise). */
    public static Ordering defaultOrdering() {
        return Ordering.automatic();
    }

    private static long fingerprint(DMatrixSparseCSC a) {
        long h = 1469598103934665603L;
        for (int j = 0; j <= a.numCols; j++) {
            h = (h ^ a.col_idx[j]) * 1099511628211L;
        }
        for (int q = 0; q < a.nz_length; q++) {
            h = (h ^ a.nz_rows[q]) * 1099511628211L;
        }
        return h;
    }

    /**
     * Cache key. equals and hashCode are written out: a record's generated ones are bootstrapped through
     * method handles on first use, about 10 % of a short check's start-up.
     */
    private record Key(long fingerprint, int n, int nnz, boolean spd, Ordering ordering) {
        @Override
        public boolean equals(Object o) {
            return o instanceof Key k && k.fingerprint == fingerprint && k.n == n && k.nnz == nnz && k.spd == spd
                    && java.util.Objects.equals(k.ordering, ordering);
        }

        @Override
        public int hashCode() {
            return (int) (fingerprint ^ (fingerprint >>> 32)) * 31 + n * 17 + nnz + (spd ? 1 : 0) + 7 * java.util.Objects.hashCode(ordering);
        }
    }
}
