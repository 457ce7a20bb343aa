package rdstab.solver.eigen;

import java.util.ArrayList;
import java.util.List;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.sparse.csc.CommonOps_DSCC;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.linear.SparseOps;

/**
 * How far a computed eigenvalue may be from the exact one: its condition number from the left eigenvector,
 * times its backward error.
 *
 * <p>A residual says that (λ, x) is an exact eigenpair of a nearby operator (backward error η, see
 * {@link EigenChecks#errorBound}); how far that moves λ depends on the operator. In the energy norm
 * (‖x‖_M² = xᴴMx) a perturbation of size η moves a simple eigenvalue by up to κ·η to first order, with
 * κ = ‖W^{1/2} y‖₂ ‖x‖_M / |yᴴ M x|, y the left eigenvector (yᴴ J = λ yᴴ M) and W the row sums of M
 * (W = M when M is diagonal). A self-adjoint pencil has κ = 1. A strongly non-normal one does not:
 * convection–diffusion with mesh Péclet number P is similar to a symmetric operator through a diagonal
 * scaling growing like e^{P x/2}, and κ grows like e^{P/2} (S. C. Reddy and L. N. Trefethen, SIAM J. Appl.
 * Math. 54 (1994), from memory): at P ≈ 70 a residual at round-off no longer fixes even the first digit.
 * No finer grid helps; the continuous operator has the same sensitivity.
 *
 * <p>Two numbers come out. The error estimate belongs to the computation: when the eigenvalues were computed
 * for a symmetrizing similarity D⁻¹JD ({@link DiagonalScaling}), κ and η are those of the scaled pencil, where
 * such an operator is well conditioned. The sensitivity is κ of the original pencil in the energy norm: how far
 * a perturbation of the physical operator of size δ can move λ (about κ·δ) — a property of the model, not of
 * the computation, and large for strongly non-normal transport however accurately λ is computed.
 *
 * <p>Method: the left eigenvectors of (J, M) are the right eigenvectors of (Jᵀ, Mᵀ) (for λ, ȳ is one),
 * computed by the same shift-invert solver with the same shift. Each right eigenvalue is paired with the
 * nearest left one; their distance d is itself evidence (two backward-stable computations of one eigenvalue
 * that differ by d cannot both be closer than d/2), so the reported error estimate is max(κ·η, d). The cost
 * is one more factorization and Krylov run; for a self-adjoint pencil nothing is computed (κ = 1).
 */
public final class EigenConditioning {

    /**
     * Conditioning of one eigenvalue.
     *
     * @param condition     κ in the coordinates of the computation (1 for a self-adjoint pencil; +∞ when the left
     *                      and right vectors are orthogonal to working precision; NaN when the left problem could
     *                      not be solved)
     * @param backwardError η: ‖W^{-1/2}(Jx − λMx)‖₂ / ‖x‖_M, in the same coordinates
     * @param leftGap       distance to the paired eigenvalue of the transposed problem (0 when self-adjoint)
     * @param errorEstimate max(κ·η, leftGap): the first-order size of the computed eigenvalue's error
     * @param sensitivity   κ of the original pencil in the energy norm (= condition without a scaling)
     */
    public record Estimate(double condition, double backwardError, double leftGap, double errorEstimate,
                           double sensitivity) {

        /** True when the estimate exceeds the given fraction of max(|λ|, floor). */
        public boolean exceeds(double fraction, double value, double floor) {
            return !(errorEstimate <= fraction * Math.max(Math.abs(value), floor));
        }
    }

    private EigenConditioning() {
    }

    /**
     * One estimate per pair, in the pairs' order.
     *
     * @param pairs       eigenpairs of (J, M) in the original coordinates
     * @param scaling     the scaling the pairs were computed under ({@link Spectrum#scaling()})
     * @param selfAdjoint true when J is symmetric (M always is): then κ = 1 and no left problem is solved
     * @param shift       the shift the pairs were computed with (the left problem uses the same)
     * @param options     the options of the right solve (count, tolerance)
     */
    public static List<Estimate> of(DMatrixSparseCSC j, DMatrixSparseCSC m, List<EigenPair> pairs, DiagonalScaling scaling,
                                    boolean selfAdjoint, double shift, EigenOptions options) {
        return of(j, m, pairs, scaling, selfAdjoint, shift, options, 0);
    }

    /**
     * As {@link #of(DMatrixSparseCSC, DMatrixSparseCSC, List, DiagonalScaling, boolean, double, EigenOptions)}, with
     * the left problem asked for {@code leftCount} eigenvalues only (0: as many as the right one). With 1, only the
     * leading eigenvalue (and its conjugate) is matched and the others get NaN estimates: what sweeps and critical
     * searches need for the verdict, at about 40 % of the cost (a 24-point reactor sweep: 4.6 s against 5.3 s, 4.3 s
     * without any estimate).
     */
    public static List<Estimate> of(DMatrixSparseCSC j, DMatrixSparseCSC m, List<EigenPair> pairs, DiagonalScaling scaling,
                                    boolean selfAdjoint, double shift, EigenOptions options, int leftCount) {
        List<Estimate> out = new ArrayList<>();
        double[] w = EigenChecks.rowSums(m);
        if (selfAdjoint) {
            for (EigenPair p : pairs) {
                double eta = EigenChecks.errorBound(p, j, m, w);
                out.add(new Estimate(1.0, eta, 0.0, eta, 1.0));
            }
            return out;
        }
        DMatrixSparseCSC jb = scaling.scale(j);
        List<EigenPair> left;
        try {
            DMatrixSparseCSC jt = CommonOps_DSCC.transpose(jb, null, null);
            DMatrixSparseCSC mt = CommonOps_DSCC.transpose(m, null, null);
            int count = Math.min(j.numCols, leftCount > 0 ? leftCount : Math.max(options.count(), pairs.size()));
            left = EigenSolvers.solve(jt, mt, new EigenOptions(count, shift, false, options.tolerance(),
                    options.maxRestarts(), options.subspace())).pairs();
        } catch (ConvergenceException | ArrayIndexOutOfBoundsException e) {
            // the left problem is evidence, not the answer: when it fails (ARPACK's Fortran translation has been
            // seen to overflow its own arrays on a badly scaled operator) the estimate is NaN and the check says so
            left = List.of();
        }
        boolean[] used = new boolean[left.size()];
        for (EigenPair p : pairs) {
            EigenPair pb = scaling.isIdentity() ? p
                    : new EigenPair(p.re(), p.im(), scaling.toScaled(p.vectorRe()), scaling.toScaled(p.vectorIm()), p.residual());
            double eta = EigenChecks.errorBound(pb, jb, m, w);
            int best = nearest(p, left, used);
            if (best < 0) {
                out.add(new Estimate(Double.NaN, eta, Double.NaN, Double.NaN, Double.NaN));
                continue;
            }
            used[best] = true;
            EigenPair q = left.get(best);
            double kappa = condition(pb, q, m, w);
            double gap = Math.hypot(p.re() - q.re(), p.im() - q.im());
            double err = Double.isFinite(kappa) ? Math.max(kappa * eta, gap) : Double.POSITIVE_INFINITY;
            double sensitivity = kappa;
            if (!scaling.isIdentity()) {
                // left vector of (J, M): D⁻¹ times that of (D⁻¹JD, M); right vector: the original x
                EigenPair qo = new EigenPair(q.re(), q.im(), scaling.toScaled(q.vectorRe()), scaling.toScaled(q.vectorIm()),
                        q.residual());
                sensitivity = condition(p, qo, m, w);
            }
            out.add(new Estimate(kappa, eta, gap, err, sensitivity));
        }
        return out;
    }

    /** Index of the unused left pair nearest to p, or −1 when there is none. */
    private static int nearest(EigenPair p, List<EigenPair> left, boolean[] used) {
        int best = -1;
        double dist = Double.POSITIVE_INFINITY;
        for (int i = 0; i < left.size(); i++) {
            double d = Math.hypot(p.re() - left.get(i).re(), p.im() - left.get(i).im());
            if (!used[i] && d < dist) {
                dist = d;
                best = i;
            }
        }
        return best;
    }

    /**
     * κ = ‖W^{1/2} y‖₂ ‖x‖_M / |yᴴ M x| with y = conj(v), v the eigenvector of the transposed pencil
     * (so yᴴ M x = vᵀ M x, no conjugation).
     */
    static double condition(EigenPair right, EigenPair left, DMatrixSparseCSC m, double[] w) {
        int n = w.length;
        double[] xr = right.vectorRe();
        double[] xi = right.vectorIm();
        double[] vr = left.vectorRe();
        double[] vi = left.vectorIm();
        double[] mr = new double[n];
        double[] mi = new double[n];
        SparseOps.multiply(m, xr, mr);
        SparseOps.multiply(m, xi, mi);
        double dotRe = 0;
        double dotIm = 0;
        double xm = 0;
        double yw = 0;
        for (int i = 0; i < n; i++) {
            dotRe += vr[i] * mr[i] - vi[i] * mi[i];
            dotIm += vr[i] * mi[i] + vi[i] * mr[i];
            xm += xr[i] * mr[i] + xi[i] * mi[i];
            yw += w[i] * (vr[i] * vr[i] + vi[i] * vi[i]);
        }
        double dot = Math.hypot(dotRe, dotIm);
        double kappa = Math.sqrt(yw) * Math.sqrt(xm) / dot;
        return Double.isNaN(kappa) ? Double.POSITIVE_INFINITY : Math.max(1.0, kappa);
    }
}
