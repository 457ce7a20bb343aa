package rdstab.solver.linear;

import org.ejml.data.DMatrixSparseCSC;

/** Chooses a factorization: Cholesky for symmetric positive definite matrices, LU otherwise. */
public final class Factorizations {

    private Factorizations() {
    }

    /**
     * @param a                  square matrix
     * @param symmetricPositive  true when the caller knows A is SPD (Cholesky, about half the work and memory)
     * @param ordering           fill-reducing symmetric permutation
     */
    public static SparseFactorization factor(DMatrixSparseCSC a, boolean symmetricPositive, Ordering ordering) {
        return symmetricPositive ? SparseCholesky.factor(a, ordering) : SparseLU.factor(a, ordering);
    }

    /** Default ordering: reverse Cuthill–McKee (natural order is kept when it is already banded). */
    public static Ordering defaultOrdering() {
        return Ordering.reverseCuthillMcKee();
    }
}
