package rdstab.solver.linear;

import org.ejml.data.DMatrixSparseCSC;

/**
 * A symmetric permutation P applied before factorizing: the factor is computed for
 * A(p, p), i.e. row and column i of the permuted matrix are row and column {@code p[i]} of A.
 *
 * <p>Only the sparsity pattern of A + Aᵀ is used. Implementations: {@link #identity()} (natural
 * order, already optimal for 1D banded problems) and {@link #reverseCuthillMcKee()} (bandwidth
 * reduction). A nested-dissection ordering for 2D grids can be plugged in here later.
 */
@FunctionalInterface
public interface Ordering {

    /**
     * @param a square matrix (only its pattern is read)
     * @return p, a permutation of 0..n−1 with {@code p[new] = old}
     */
    int[] permutation(DMatrixSparseCSC a);

    /** Natural order p[i] = i. */
    static Ordering identity() {
        return a -> {
            int[] p = new int[a.numCols];
            for (int i = 0; i < p.length; i++) {
                p[i] = i;
            }
            return p;
        };
    }

    /** Reverse Cuthill–McKee on the pattern of A + Aᵀ. */
    static Ordering reverseCuthillMcKee() {
        return ReverseCuthillMcKee::order;
    }
}
