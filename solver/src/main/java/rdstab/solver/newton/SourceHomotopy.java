package rdstab.solver.newton;

import java.util.Locale;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.sparse.csc.CommonOps_DSCC;
import rdstab.mesh.assembly.Discretization;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.error.ConvergenceException.Reason;

/**
 * The fallback when Newton's method fails from the initial guess: natural continuation in the
 * strength s of the sources, F_s(u) = T(u) + s (F(u) − T(u)), from s = 0 (diffusion and boundary
 * exchange only, whose steady state is easy) to s = 1 (the full model), each step warm-started
 * from the previous one with a secant predictor; the step in s is halved on failure and grown on
 * success. If s cannot be pushed to 1 (the step falls below {@link #MIN_STEP}), the branch that
 * starts from the source-free state turns back at a fold before s = 1 — evidence that the full
 * model has no steady state on that branch.
 */
public final class SourceHomotopy {

    /** Smallest step in s before giving up. */
    public static final double MIN_STEP = 1e-4;
    /** Most continuation steps. */
    public static final int MAX_STEPS = 400;

    private SourceHomotopy() {
    }

    /**
     * @param full      the full model F
     * @param transport the same model without sources T
     * @param guess     starting guess for s = 0 (not modified)
     * @param newton    the corrector
     * @return the steady state of the full model, route "source continuation"
     * @throws ConvergenceException NO_STEADY_STATE when the path cannot reach s = 1
     */
    public static BaseState solve(Discretization full, Discretization transport, double[] guess, DampedNewton newton) {
        BaseState at = newton.solve(new Scaled(full, transport, 0.0), guess);
        double s = 0;
        double[] prev = null;
        double prevS = 0;
        double ds = 0.1;
        int steps = 0;
        int total = at.iterations();
        while (s < 1.0) {
            if (++steps > MAX_STEPS) {
                throw new ConvergenceException(Reason.MAX_ITERATIONS, "source continuation took more than " + MAX_STEPS
                        + " steps (reached " + fmt(s) + " of the full source)", total, Double.NaN);
            }
            double next = Math.min(1.0, s + ds);
            double[] predictor = at.u().clone();
            if (prev != null) {
                double r = (next - s) / (s - prevS);
                for (int i = 0; i < predictor.length; i++) {
                    predictor[i] += r * (at.u()[i] - prev[i]);
                }
            }
            try {
                BaseState b = newton.solve(new Scaled(full, transport, next), predictor);
                total += b.iterations();
                prev = at.u();
                prevS = s;
                at = b;
                s = next;
                ds = Math.min(0.5, ds * 1.5);
            } catch (ConvergenceException e) {
                ds *= 0.5;
                if (ds < MIN_STEP) {
                    throw new ConvergenceException(Reason.NO_STEADY_STATE, "continuation in the source strength stops at "
                            + fmt(s) + " of the full source (a fold): the steady state that starts from the source-free "
                            + "state ceases to exist before the full source is reached", total, e.lastResidual(), e);
                }
            }
        }
        return new BaseState(at.u(), total, at.residual(), at.tolerance(), at.residualHistory(), "source continuation");
    }

    private static String fmt(double s) {
        return String.format(Locale.ROOT, "%.4f", s);
    }

    /** F_s = T + s (F − T) and its Jacobian. */
    private static final class Scaled implements Discretization {
        private final Discretization full;
        private final Discretization transport;
        private final double s;

        Scaled(Discretization full, Discretization transport, double s) {
            this.full = full;
            this.transport = transport;
            this.s = s;
        }

        @Override public int unknowns() { return full.unknowns(); }
        @Override public int nodes() { return full.nodes(); }
        @Override public int fieldCount() { return full.fieldCount(); }
        @Override public int dimension() { return full.dimension(); }
        @Override public double coordinate(int node, int dir) { return full.coordinate(node, dir); }
        @Override public int unknownIndex(int field, int node) { return full.unknownIndex(field, node); }
        @Override public DMatrixSparseCSC mass() { return full.mass(); }
        @Override public boolean massIsDiagonal() { return full.massIsDiagonal(); }
        @Override public double[][] nodalValues(double[] u) { return full.nodalValues(u); }
        @Override public double[][] nodalPerturbation(double[] v) { return full.nodalPerturbation(v); }
        @Override public double[] unknownsFromNodal(double[][] nodal) { return full.unknownsFromNodal(nodal); }
        @Override public double[] nodeWeights() { return full.nodeWeights(); }

        @Override
        public void residual(double[] u, double[] f) {
            double[] t = new double[f.length];
            transport.residual(u, t);
            if (s == 0) {
                System.arraycopy(t, 0, f, 0, f.length);
                return;
            }
            full.residual(u, f);
            for (int i = 0; i < f.length; i++) {
                f[i] = t[i] + s * (f[i] - t[i]);
            }
        }

        @Override
        public DMatrixSparseCSC jacobian(double[] u) {
            DMatrixSparseCSC jt = transport.jacobian(u);
            if (s == 0) {
                return jt;
            }
            return CommonOps_DSCC.add(1 - s, jt, s, full.jacobian(u), null, null, null);
        }
    }
}
