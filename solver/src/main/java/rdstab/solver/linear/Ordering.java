package rdstab.solver.linear;

import org.ejml.data.DMatrixSparseCSC;

/**
 * A symmetric permutation P applied before factorizing: the factor is computed for
 * A(p, p), i.e. row and column i of the permuted matrix are row and column {@code p[i]} of A.
 *
 * <p>Only the sparsity pattern of A + Aᵀ is used. Implementations: {@link #identity()} (natural
 * order, already optimal for 1D banded problems), {@link #reverseCuthillMcKee()} (bandwidth
 * reduction), {@link #nestedDissection()} (graph nested dissection, the best on 2D grids: measured
 * 10.2 M non-zeros in L for the 512² five-point Laplacian against 9.9 M for approximate minimum
 * degree, but a cheaper factorization, fewer and wider supernodes),
 * {@link #nestedDissection(double[][])} (geometric, from coordinates),
 * {@link #approximateMinimumDegree()} and {@link #automatic()} (natural order for narrow bands, nested
 * dissection otherwise). The static factories return shared instances, so an ordering can key a
 * cache of symbolic analyses.
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
        return StandardOrderings.IDENTITY;
    }

    /** Reverse Cuthill–McKee on the pattern of A + Aᵀ. */
    static Ordering reverseCuthillMcKee() {
        return StandardOrderings.REVERSE_CUTHILL_MCKEE;
    }

    /** Graph nested dissection of A + Aᵀ (level-structure separators); works on any mesh. */
    static Ordering nestedDissection() {
        return StandardOrderings.NESTED_DISSECTION;
    }

    /**
     * Geometric nested dissection: coords[dir][i] is coordinate dir of unknown i. A new instance per
     * call (it holds the coordinates).
     */
    static Ordering nestedDissection(double[][] coords) {
        double[][] copy = new double[coords.length][];
        for (int d = 0; d < coords.length; d++) {
            copy[d] = coords[d].clone();
        }
        return a -> NestedDissection.order(a, copy);
    }

    /** Approximate minimum degree (CSparseJ cs_amd). */
    static Ordering approximateMinimumDegree() {
        return StandardOrderings.APPROXIMATE_MINIMUM_DEGREE;
    }

    /**
     * Natural order when the matrix already has a narrow band (half-bandwidth at most
     * {@link StandardOrderings#NARROW_BAND}, e.g. node-major 1D discretizations, where no ordering
     * beats the band), graph nested dissection otherwise.
     */
    static Ordering automatic() {
        return StandardOrderings.AUTOMATIC;
    }
}
