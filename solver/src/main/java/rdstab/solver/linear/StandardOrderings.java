package rdstab.solver.linear;

import org.ejml.data.DMatrixSparseCSC;

/** The shared ordering instances behind the factories of {@link Ordering}. */
final class StandardOrderings {

    /**
     * Half-bandwidth up to which the natural order is kept by {@link Ordering#automatic()}: a band
     * of half-width b gives at most n·b fill (common practice, no source: any fill-reducing order
     * has overhead that does not pay off for bands this narrow; 1D cases with a few fields have b ≤ 8).
     */
    static final int NARROW_BAND = 16;

    static final Ordering IDENTITY = a -> {
        int[] p = new int[a.numCols];
        for (int i = 0; i < p.length; i++) {
            p[i] = i;
        }
        return p;
    };
    static final Ordering REVERSE_CUTHILL_MCKEE = ReverseCuthillMcKee::order;
    static final Ordering NESTED_DISSECTION = NestedDissection::order;
    static final Ordering APPROXIMATE_MINIMUM_DEGREE = ApproximateMinimumDegree::order;
    static final Ordering AUTOMATIC = a -> halfBandwidth(a) <= NARROW_BAND
            ? IDENTITY.permutation(a) : NestedDissection.order(a);

    private StandardOrderings() {
    }

    /** max |i − j| over the stored entries. */
    static int halfBandwidth(DMatrixSparseCSC a) {
        int b = 0;
        for (int j = 0; j < a.numCols; j++) {
            for (int q = a.col_idx[j]; q < a.col_idx[j + 1]; q++) {
                b = Math.max(b, Math.abs(a.nz_rows[q] - j));
            }
        }
        return b;
    }
}
