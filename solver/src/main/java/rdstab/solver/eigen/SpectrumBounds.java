package rdstab.solver.eigen;

import org.ejml.data.DMatrixSparseCSC;
import org.ejml.sparse.csc.CommonOps_DSCC;
import rdstab.solver.linear.SparseOps;

/**
 * Enclosures of the spectrum of the pencil (J, M), M symmetric positive definite, used to place the
 * automatic shift and to certify the rightmost set.
 *
 * <p><b>Diagonal M.</b> The pencil has the eigenvalues of A = M^{-1/2} J M^{-1/2}, and of the similar
 * matrices M⁻¹J and JM⁻¹. Then Re λ ≤ min(row Gershgorin bounds of A and M⁻¹J, column Gershgorin
 * bounds of A and JM⁻¹, Gershgorin bound of the symmetric part (A + Aᵀ)/2) — the last by Bendixson's theorem — and |Im λ| ≤ Gershgorin bound of the skew part
 * (A − Aᵀ)/2 (Bendixson). All bounds are rigorous.
 *
 * <p><b>General SPD M.</b> For an eigenpair, λ = x*Jx / x*Mx with x*Mx &gt; 0, so
 * Re λ = x*Hx / x*Mx and |Im λ| = |x*Kx| / x*Mx with H, K the symmetric and skew parts of J. With
 * h = Gershgorin upper bound of λmax(H), s = Gershgorin bound of ‖K‖₂ and [μ₋, μ₊] the Gershgorin
 * enclosure of the spectrum of M: Re λ ≤ h/μ₋ if h ≥ 0, h/μ₊ if h &lt; 0, and |Im λ| ≤ s/μ₋. This needs
 * μ₋ &gt; 0 (M diagonally dominant). Otherwise (e.g. a P1 consistent mass matrix, whose Gershgorin lower
 * bound is 0) the bounds of the lumped pencil (J, diag(M)) are used and marked not rigorous.
 *
 * @param reUpper   upper bound of Re λ
 * @param imBound   bound of |Im λ|
 * @param rigorous  whether both are proven bounds
 */
record SpectrumBounds(double reUpper, double imBound, boolean rigorous) {

    /** Relative margin added to the bound for the automatic shift. */
    static final double SHIFT_MARGIN = 1e-2;

    /** Automatic shift σ = reUpper + 0.01·max(1, |reUpper|), strictly right of the spectrum. */
    double automaticShift() {
        return reUpper + SHIFT_MARGIN * Math.max(1.0, Math.abs(reUpper));
    }

    static SpectrumBounds of(DMatrixSparseCSC j, DMatrixSparseCSC m) {
        double[] diag = SparseOps.diagonal(m);
        boolean diagonal = SparseOps.isDiagonal(m);
        if (!diagonal) {
            double lo = Double.POSITIVE_INFINITY;
            double hi = Double.NEGATIVE_INFINITY;
            double[] off = offDiagonalRowSums(m);
            for (int i = 0; i < diag.length; i++) {
                lo = Math.min(lo, diag[i] - off[i]);
                hi = Math.max(hi, diag[i] + off[i]);
            }
            if (lo > 0) {
                DMatrixSparseCSC jt = CommonOps_DSCC.transpose(j, null, null);
                double h = upperGershgorin(SparseOps.add(0.5, j, 0.5, jt));
                double s = maxOffRowSum(SparseOps.add(0.5, j, -0.5, jt));
                return new SpectrumBounds(h >= 0 ? h / lo : h / hi, s / lo, true);
            }
        }
        for (double d : diag) {
            if (!(d > 0)) {
                throw new IllegalArgumentException("M must be positive definite; found diagonal entry " + d);
            }
        }
        double[] scale = new double[diag.length];
        for (int i = 0; i < diag.length; i++) {
            scale[i] = 1.0 / Math.sqrt(diag[i]);
        }
        DMatrixSparseCSC a = j.copy();
        for (int col = 0; col < a.numCols; col++) {
            for (int p = a.col_idx[col]; p < a.col_idx[col + 1]; p++) {
                a.nz_values[p] *= scale[a.nz_rows[p]] * scale[col];
            }
        }
        DMatrixSparseCSC at = CommonOps_DSCC.transpose(a, null, null);
        double rows = upperGershgorin(a);
        double cols = upperGershgorin(at);
        // M⁻¹J and J M⁻¹ are similar to A as well; their Gershgorin discs are much tighter for
        // finite-volume operators whose boundary cells have half weights (A's rows are unbalanced there).
        DMatrixSparseCSC left = j.copy();
        DMatrixSparseCSC right = j.copy();
        for (int col = 0; col < j.numCols; col++) {
            for (int p = j.col_idx[col]; p < j.col_idx[col + 1]; p++) {
                left.nz_values[p] /= diag[j.nz_rows[p]];
                right.nz_values[p] /= diag[col];
            }
        }
        rows = Math.min(rows, upperGershgorin(left));
        cols = Math.min(cols, upperGershgorin(CommonOps_DSCC.transpose(right, null, null)));
        double sym = upperGershgorin(SparseOps.add(0.5, a, 0.5, at));
        double skew = maxOffRowSum(SparseOps.add(0.5, a, -0.5, at));
        return new SpectrumBounds(Math.min(sym, Math.min(rows, cols)), skew, diagonal);
    }

    /** max_i (a_ii + Σ_{j≠i} |a_ij|). */
    private static double upperGershgorin(DMatrixSparseCSC a) {
        double[] d = SparseOps.diagonal(a);
        double[] off = offDiagonalRowSums(a);
        double best = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < d.length; i++) {
            best = Math.max(best, d[i] + off[i]);
        }
        return best;
    }

    private static double maxOffRowSum(DMatrixSparseCSC a) {
        double best = 0.0;
        for (double v : offDiagonalRowSums(a)) {
            best = Math.max(best, v);
        }
        return best;
    }

    /** Σ_{j≠i} |a_ij| for every row i. */
    private static double[] offDiagonalRowSums(DMatrixSparseCSC a) {
        double[] s = new double[a.numRows];
        for (int col = 0; col < a.numCols; col++) {
            for (int p = a.col_idx[col]; p < a.col_idx[col + 1]; p++) {
                if (a.nz_rows[p] != col) {
                    s[a.nz_rows[p]] += Math.abs(a.nz_values[p]);
                }
            }
        }
        return s;
    }
}
