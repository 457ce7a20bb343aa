package rdstab.solver.timestep;

import org.ejml.data.DMatrixSparseCSC;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.error.ConvergenceException.Reason;
import rdstab.solver.linear.Factorizations;
import rdstab.solver.linear.SparseFactorization;
import rdstab.solver.linear.SparseOps;
import rdstab.solver.newton.DampedNewton;

/**
 * The two-stage, second-order, L-stable Rosenbrock method ROS2 (Verwer, Spee, Blom and Hundsdorfer, SIAM J. Sci.
 * Comput. 20 (1999) 1456) with an embedded first-order solution for step-size control, for M dy/dt = G(y):
 * <pre>
 *   W = M − γ h J(y_n),           γ = 1 + 1/√2
 *   W k1 = G(y_n)
 *   W k2 = G(y_n + h k1) − 2 M k1
 *   y_{n+1} = y_n + (3/2) h k1 + (1/2) h k2          (order 2; stability function → 0 as hλ → −∞)
 *   ŷ_{n+1} = y_n + h k1                            (order 1, embedded)
 *   e = y_{n+1} − ŷ_{n+1} = (h/2)(k1 + k2)
 * </pre>
 * One sparse LU of W per step (the exact Jacobian every step; the fill-reducing ordering is computed once, since the
 * pattern does not change), no Newton iterations.
 *
 * <h2>Error norm and control</h2>
 * err = ‖e‖ / (atol + rtol·‖max(|y_n|, |y_{n+1}|)‖) with ‖v‖ = sqrt(Σ_i w_i v_i² / Σ_i w_i) and w_i the row sums
 * of M: a norm-wise relative error in a volume-weighted RMS norm, so the same tolerance means the same thing on
 * every grid, and nodes where the solution is near zero (next to a fixed boundary) do not force tiny steps. A step is accepted when
 * err ≤ 1; the next step is h·min(5, max(0.2, 0.9·err^(−1/2))) (the estimate is O(h²)), and at most h after a
 * rejection. A step whose stage is not finite, or whose W is singular, is rejected and halved. Failures raise
 * {@link ConvergenceException}: DIVERGED when h falls below 1e-14 of the interval, MAX_ITERATIONS at the step cap.
 */
public final class Rosenbrock2 {

    /** γ = 1 + 1/√2: L-stable choice. */
    public static final double GAMMA = 1.0 + 1.0 / Math.sqrt(2.0);
    /** Classical order of the method. */
    public static final int ORDER = 2;

    /**
     * Settings.
     *
     * @param rtol     relative tolerance (&gt; 0)
     * @param atol     absolute tolerance (&gt; 0), in the units of y
     * @param maxStep  largest step (&gt; 0)
     * @param maxSteps cap on attempted steps
     */
    public record Settings(double rtol, double atol, double maxStep, int maxSteps) {
        public Settings {
            if (!(rtol > 0) || !(atol > 0) || !(maxStep > 0) || maxSteps < 1) {
                throw new IllegalArgumentException("tolerances and max step must be > 0 and the step cap >= 1, got rtol "
                        + rtol + ", atol " + atol + ", max step " + maxStep + ", cap " + maxSteps);
            }
        }

        /** Copy with another largest step. */
        public Settings withMaxStep(double h) {
            return new Settings(rtol, atol, h, maxSteps);
        }
    }

    /** Told after each accepted step; returns false to stop the integration there. */
    public interface Observer {
        /** @return true to continue */
        boolean accepted(double t, double[] y);
    }

    /**
     * Counters of one integration.
     *
     * @param t         time reached
     * @param y         state reached
     * @param accepted  accepted steps
     * @param rejected  rejected steps (error too large, non-finite stage or singular W)
     * @param lastStep  the step size proposed for the next step
     * @param stopped   true when the observer stopped it before the end time
     */
    public record Outcome(double t, double[] y, int accepted, int rejected, double lastStep, boolean stopped) {
    }

    private final SemiDiscreteSystem sys;
    private final int n;
    private final double[] w;
    private final DMatrixSparseCSC m;
    /** Fill-reducing ordering of W, computed once: the pattern of M − γhJ is the same at every step. */
    private int[] permutation;

    /** An integrator for one system. */
    public Rosenbrock2(SemiDiscreteSystem system) {
        this.sys = system;
        this.n = system.size();
        this.m = system.mass();
        this.w = DampedNewton.rowSums(m);
    }

    /**
     * Integrates from (t0, y0) to tEnd with error control.
     *
     * @param y0       initial state, not modified
     * @param h0       first trial step (&gt; 0)
     * @param observer may be null
     */
    public Outcome integrate(double[] y0, double t0, double tEnd, double h0, Settings s, Observer observer) {
        double[] y = y0.clone();
        double t = t0;
        double h = Math.min(h0, s.maxStep());
        double hMin = 1e-14 * Math.max(tEnd - t0, Double.MIN_NORMAL);
        int acc = 0;
        int rej = 0;
        boolean afterReject = false;
        double[] next = new double[n];
        double[] est = new double[n];
        for (int attempt = 0; attempt < s.maxSteps(); attempt++) {
            if (t >= tEnd) {
                return new Outcome(t, y, acc, rej, h, false);
            }
            double step = Math.min(h, tEnd - t);
            double err = trial(y, step, next, est) ? norm(est, y, next, s) : Double.POSITIVE_INFINITY;
            if (err <= 1.0) {
                t = (step == tEnd - t) ? tEnd : t + step;
                System.arraycopy(next, 0, y, 0, n);
                acc++;
                double fac = err == 0 ? 5.0 : Math.min(5.0, Math.max(0.2, 0.9 / Math.sqrt(err)));
                h = Math.min(s.maxStep(), step * (afterReject ? Math.min(1.0, fac) : fac));
                afterReject = false;
                if (observer != null && !observer.accepted(t, y)) {
                    return new Outcome(t, y, acc, rej, h, true);
                }
            } else {
                rej++;
                afterReject = true;
                h = step * (Double.isFinite(err) ? Math.max(0.2, 0.9 / Math.sqrt(err)) : 0.5);
                if (h < hMin) {
                    throw new ConvergenceException(Reason.DIVERGED, String.format(java.util.Locale.ROOT,
                            "time step fell below %.1e at t = %.6g (the solution may blow up there)", hMin, t), acc, err);
                }
            }
        }
        throw new ConvergenceException(Reason.MAX_ITERATIONS, "time integration needed more than " + s.maxSteps()
                + " steps to reach t = " + tEnd + " (stopped at t = " + t + ")", s.maxSteps(), Double.NaN);
    }

    /** Integrates with n equal steps and no error control (for convergence studies of the method itself). */
    public double[] fixedSteps(double[] y0, double t0, double tEnd, int steps) {
        double[] y = y0.clone();
        double[] next = new double[n];
        double[] est = new double[n];
        double h = (tEnd - t0) / steps;
        for (int k = 0; k < steps; k++) {
            if (!trial(y, h, next, est)) {
                throw new ConvergenceException(Reason.NOT_FINITE, "a stage was not finite at step " + k, k, Double.NaN);
            }
            System.arraycopy(next, 0, y, 0, n);
        }
        return y;
    }

    /** One ROS2 step of size h from y; false when a stage is not finite or W is singular. */
    private boolean trial(double[] y, double h, double[] next, double[] est) {
        try {
            DMatrixSparseCSC wMat = SparseOps.add(1.0, m, -GAMMA * h, sys.jacobian(y));
            if (permutation == null) {
                permutation = Factorizations.defaultOrdering().permutation(wMat);
            }
            int[] p = permutation;
            SparseFactorization lu = Factorizations.factor(wMat, false, a -> p);
            double[] g0 = new double[n];
            sys.rhs(y, g0);
            double[] k1 = new double[n];
            lu.solve(g0, k1);
            double[] y1 = new double[n];
            for (int i = 0; i < n; i++) {
                y1[i] = y[i] + h * k1[i];
            }
            double[] g1 = new double[n];
            sys.rhs(y1, g1);
            double[] mk1 = new double[n];
            SparseOps.multiply(m, k1, mk1);
            for (int i = 0; i < n; i++) {
                g1[i] -= 2.0 * mk1[i];
            }
            double[] k2 = new double[n];
            lu.solve(g1, k2);
            for (int i = 0; i < n; i++) {
                next[i] = y[i] + h * (1.5 * k1[i] + 0.5 * k2[i]);
                est[i] = 0.5 * h * (k1[i] + k2[i]);
                if (!Double.isFinite(next[i])) {
                    return false;
                }
            }
            return true;
        } catch (ArithmeticException e) {
            return false;
        } catch (ConvergenceException e) {
            if (e.reason() == Reason.NOT_FINITE || e.reason() == Reason.SINGULAR_SHIFT) {
                return false;
            }
            throw e;
        }
    }

    private double norm(double[] e, double[] y, double[] next, Settings s) {
        double se = 0;
        double sy = 0;
        double ws = 0;
        for (int i = 0; i < n; i++) {
            double yi = Math.max(Math.abs(y[i]), Math.abs(next[i]));
            se += w[i] * e[i] * e[i];
            sy += w[i] * yi * yi;
            ws += w[i];
        }
        return Math.sqrt(se / ws) / (s.atol() + s.rtol() * Math.sqrt(sy / ws));
    }

    @Override
    public String toString() {
        return "ROS2 (Rosenbrock, 2 stages, order 2, L-stable, embedded order-1 error estimate) on " + n + " unknowns";
    }
}
