package rdstab.solver.continuation;

import java.util.Locale;
import org.ejml.data.DMatrixSparseCSC;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.error.ConvergenceException.Reason;

/**
 * Keller's pseudo-arclength corrector: Newton's method on the extended system
 * <pre>
 *   F(u; p) = 0
 *   ⟨t₀, (u, p) − (u₀, p₀)⟩ − Δs = 0
 * </pre>
 * from the predictor (u₀, p₀) + Δs t₀, where t₀ is the unit tangent at the anchor point and ⟨·,·⟩ the
 * scaled inner product of {@link ParameterFamily}. Each iteration assembles and factors the bordered
 * matrix [[J, F_p], [c₀ᵀ, t₀p]] ({@link BorderedSystem}; c₀ = the state part of t₀ weighted by w_i / Σw).
 *
 * <p>Converged when the scaled residual max_i |F_i| / w_i ≤ max(tolerance, 64 ε · (row sums of |J|·max(|u|,1)) / w)
 * — the acceptance rule of {@link rdstab.solver.newton.DampedNewton}, so a branch point is as accurate as a
 * checked base state. The arclength equation is linear and holds to round-off after the first iteration.
 * The new tangent solves [[J, F_p], [c₀ᵀ, t₀p]] t = (0, 1) at the converged point and is normalised: its
 * orientation therefore follows t₀ (⟨t, t₀⟩ &gt; 0), which is what lets dp/ds change sign at a fold.
 *
 * <p>Failure (iteration cap, residual growing twice in a row, a singular bordered matrix, non-finite
 * values) throws {@link ConvergenceException}; the tracer catches it and halves the step.
 */
final class ArclengthCorrector {

    private final ParameterFamily family;
    private final double tolerance;
    private final int maxIterations;

    ArclengthCorrector(ParameterFamily family, double tolerance, int maxIterations) {
        this.family = family;
        this.tolerance = tolerance;
        this.maxIterations = maxIterations;
    }

    /** The branch point at arclength Δs from the anchor, measured along the anchor's tangent. */
    BranchPoint correct(BranchPoint anchor, double ds) {
        int n = family.unknowns();
        double[] u = new double[n];
        for (int i = 0; i < n; i++) {
            u[i] = anchor.u()[i] + ds * anchor.tangentU()[i];
        }
        return newton(anchor, u, anchor.p() + ds * anchor.tangentP(), ds, Double.NaN);
    }

    /**
     * The branch point at the parameter value p exactly (Newton on F(u; p) = 0 with the border row (0, 1)), from a
     * nearby guess; its tangent is oriented by the anchor's. Used to land the last row on the end of the range.
     */
    BranchPoint atParameter(BranchPoint anchor, double[] guess, double p) {
        return newton(anchor, guess.clone(), p, Double.NaN, p);
    }

    /** Newton on F = 0 plus the arclength equation (fixedP NaN) or p = fixedP. */
    private BranchPoint newton(BranchPoint anchor, double[] u, double p0, double ds, double fixedP) {
        int n = family.unknowns();
        boolean arclength = Double.isNaN(fixedP);
        double p = p0;
        double[] c = family.scaledWeights();
        for (int i = 0; i < n; i++) {
            c[i] *= anchor.tangentU()[i];
        }
        double[] f = new double[n];
        double previous = Double.POSITIVE_INFINITY;
        int growing = 0;
        for (int it = 0; ; it++) {
            evaluate(u, p, f);
            DMatrixSparseCSC j = family.jacobian(u, p);
            double rho = family.scaledResidual(f, p);
            double tol = Math.max(tolerance, roundOffFloor(j, u, p));
            double[] fp = family.parameterDerivative(u, p);
            BorderedSystem tangent = BorderedSystem.factor(j, fp, c, anchor.tangentP());
            if (rho <= tol) {
                double[] t = tangent.solve(new double[n], 1.0);
                double norm = Math.sqrt(family.dot(t, t[n], t, t[n]));
                double[] tu = new double[n];
                for (int i = 0; i < n; i++) {
                    tu[i] = t[i] / norm;
                }
                return new BranchPoint(u, p, tu, t[n] / norm, it, rho);
            }
            growing = rho > previous ? growing + 1 : 0;
            if (it >= maxIterations || growing >= 2 || !Double.isFinite(rho)) {
                throw new ConvergenceException(it >= maxIterations ? Reason.MAX_ITERATIONS : Reason.DIVERGED,
                        String.format(Locale.ROOT, "the arclength corrector did not converge (step %.3g, %d iterations, residual %.3e)",
                                ds, it, rho), it, rho);
            }
            previous = rho;
            double[] g = new double[n];
            for (int i = 0; i < n; i++) {
                g[i] = -f[i];
            }
            double[] d;
            if (arclength) {
                double arc = -(family.dot(anchor.tangentU(), anchor.tangentP(), difference(u, anchor.u()), p - anchor.p()) - ds);
                d = tangent.solve(g, arc);
            } else {
                d = BorderedSystem.factor(j, fp, new double[n], 1.0).solve(g, 0.0);
            }
            for (int i = 0; i < n; i++) {
                u[i] += d[i];
            }
            p += d[n];
        }
    }

    private void evaluate(double[] u, double p, double[] f) {
        try {
            family.residual(u, p, f);
        } catch (ArithmeticException e) {
            throw new ConvergenceException(Reason.NOT_FINITE, "the corrector reached a state where the formulas are not finite: "
                    + e.getMessage(), -1, Double.NaN, e);
        }
    }

    private static double[] difference(double[] a, double[] b) {
        double[] d = new double[a.length];
        for (int i = 0; i < a.length; i++) {
            d[i] = a[i] - b[i];
        }
        return d;
    }

    private double roundOffFloor(DMatrixSparseCSC j, double[] u, double p) {
        double[] s = new double[j.numRows];
        for (int col = 0; col < j.numCols; col++) {
            double uc = Math.max(Math.abs(u[col]), 1.0);
            for (int k = j.col_idx[col]; k < j.col_idx[col + 1]; k++) {
                s[j.nz_rows[k]] += Math.abs(j.nz_values[k]) * uc;
            }
        }
        return 64 * Math.ulp(1.0) * family.scaledResidual(s, p);
    }
}
