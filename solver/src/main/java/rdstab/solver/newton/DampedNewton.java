package rdstab.solver.newton;

import java.util.Arrays;
import org.ejml.data.DMatrixSparseCSC;
import rdstab.mesh.assembly.Discretization;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.error.ConvergenceException.Reason;
import rdstab.solver.linear.Factorizations;
import rdstab.solver.linear.SparseFactorization;

/**
 * Damped Newton's method with a backtracking (Armijo) line search on the exact sparse Jacobian, for
 * F(u) = 0 where M du/dt = F(u).
 *
 * <p>Residual measure: ρ(u) = max_i |F_i(u)| / w_i with w_i the row sums of M (the pointwise
 * residual of the PDE, in units of u per time). Merit function φ(u) = ½ Σ F_i² / w_i. A step
 * u + αΔu with J Δu = −F is accepted when φ decreases by the Armijo factor (1 − 2·10⁻⁴ α); α is
 * halved up to {@link #MAX_HALVINGS} times (a trial state whose formulas give NaN or infinity is
 * treated as a failed trial). Converged when ρ ≤ max(tolerance, floor) where the round-off floor is
 * 64 ε max_i (Σ_j |J_ij| max(|u_j|, 1)) / w_i — the residual cannot be computed more accurately than
 * that on fine grids.
 *
 * <p>Failures throw {@link ConvergenceException}: MAX_ITERATIONS, DIVERGED (no descent possible),
 * NOT_FINITE (NaN at the start), SINGULAR_SHIFT (singular Jacobian).
 */
public final class DampedNewton {

    /** Largest number of step halvings in one line search. */
    public static final int MAX_HALVINGS = 40;
    private static final double ARMIJO = 1e-4;

    private final double tolerance;
    private final int maxSteps;

    /**
     * @param tolerance accepted scaled residual (&gt; 0)
     * @param maxSteps  iteration cap (≥ 1)
     */
    public DampedNewton(double tolerance, int maxSteps) {
        if (!(tolerance > 0)) {
            throw new IllegalArgumentException("Newton tolerance must be > 0, got " + tolerance);
        }
        if (maxSteps < 1) {
            throw new IllegalArgumentException("Newton step cap must be >= 1, got " + maxSteps);
        }
        this.tolerance = tolerance;
        this.maxSteps = maxSteps;
    }

    /**
     * Solves F(u) = 0 from the guess u0 (not modified).
     *
     * @return the base state with its residual history
     */
    public BaseState solve(Discretization d, double[] u0) {
        int n = d.unknowns();
        double[] w = rowSums(d.mass());
        double[] u = u0.clone();
        double[] f = new double[n];
        d.residual(u, f);
        double rho = scaledNorm(f, w);
        if (!Double.isFinite(rho)) {
            throw new ConvergenceException(Reason.NOT_FINITE, "the residual at the initial guess is not finite", 0, rho);
        }
        double[] history = new double[maxSteps + 1];
        double[] trial = new double[n];
        double[] ftrial = new double[n];
        double[] step = new double[n];
        for (int it = 0; it <= maxSteps; it++) {
            history[it] = rho;
            DMatrixSparseCSC j = d.jacobian(u);
            double tol = Math.max(tolerance, roundOffFloor(j, u, w));
            if (rho <= tol) {
                return new BaseState(u, it, rho, tol, Arrays.copyOf(history, it + 1));
            }
            if (it == maxSteps) {
                break;
            }
            SparseFactorization lu = factor(j, it, rho);
            double[] rhs = new double[n];
            for (int i = 0; i < n; i++) {
                rhs[i] = -f[i];
            }
            lu.solve(rhs, step);
            double phi = merit(f, w);
            double alpha = 1.0;
            boolean accepted = false;
            for (int h = 0; h <= MAX_HALVINGS; h++) {
                for (int i = 0; i < n; i++) {
                    trial[i] = u[i] + alpha * step[i];
                }
                double phiTrial = evaluate(d, trial, ftrial, w);
                if (phiTrial <= (1 - 2 * ARMIJO * alpha) * phi) {
                    accepted = true;
                    break;
                }
                alpha *= 0.5;
            }
            if (!accepted) {
                throw new ConvergenceException(Reason.DIVERGED, "Newton's method found no descent direction after "
                        + it + " steps (residual " + String.format(java.util.Locale.ROOT, "%.3e", rho)
                        + "): there may be no steady state near the initial guess", it, rho);
            }
            System.arraycopy(trial, 0, u, 0, n);
            System.arraycopy(ftrial, 0, f, 0, n);
            rho = scaledNorm(f, w);
        }
        throw new ConvergenceException(Reason.MAX_ITERATIONS, "Newton's method did not converge in " + maxSteps
                + " steps (residual " + String.format(java.util.Locale.ROOT, "%.3e", rho) + ")", maxSteps, rho);
    }

    private static SparseFactorization factor(DMatrixSparseCSC j, int it, double rho) {
        try {
            return Factorizations.factor(j, false, Factorizations.defaultOrdering());
        } catch (ConvergenceException e) {
            throw new ConvergenceException(Reason.SINGULAR_SHIFT, "the Jacobian is singular at Newton step " + it
                    + " (a fold or a branch point of the steady states is near)", it, rho, e);
        }
    }

    /** φ at a trial point, or +∞ when the formulas give NaN/∞ there. */
    private static double evaluate(Discretization d, double[] u, double[] f, double[] w) {
        try {
            d.residual(u, f);
        } catch (ConvergenceException e) {
            if (e.reason() == Reason.NOT_FINITE) {
                return Double.POSITIVE_INFINITY;
            }
            throw e;
        } catch (ArithmeticException e) {
            return Double.POSITIVE_INFINITY;
        }
        double phi = merit(f, w);
        return Double.isFinite(phi) ? phi : Double.POSITIVE_INFINITY;
    }

    static double merit(double[] f, double[] w) {
        double s = 0;
        for (int i = 0; i < f.length; i++) {
            s += f[i] * f[i] / w[i];
        }
        return 0.5 * s;
    }

    /** max_i |f_i| / w_i. */
    public static double scaledNorm(double[] f, double[] w) {
        double m = 0;
        for (int i = 0; i < f.length; i++) {
            double v = Math.abs(f[i]) / w[i];
            if (!(v <= m)) {
                m = v;
            }
        }
        return m;
    }

    /** Row sums of a (positive) mass matrix: the lumped weights. */
    public static double[] rowSums(DMatrixSparseCSC m) {
        double[] w = new double[m.numRows];
        for (int c = 0; c < m.numCols; c++) {
            for (int k = m.col_idx[c]; k < m.col_idx[c + 1]; k++) {
                w[m.nz_rows[k]] += m.nz_values[k];
            }
        }
        return w;
    }

    private static double roundOffFloor(DMatrixSparseCSC j, double[] u, double[] w) {
        double[] s = new double[j.numRows];
        for (int c = 0; c < j.numCols; c++) {
            double uc = Math.max(Math.abs(u[c]), 1.0);
            for (int k = j.col_idx[c]; k < j.col_idx[c + 1]; k++) {
                s[j.nz_rows[k]] += Math.abs(j.nz_values[k]) * uc;
            }
        }
        return 64 * Math.ulp(1.0) * scaledNorm(s, w);
    }
}
