package rdstab.solver.sweep;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.function.IntFunction;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.drive.StabilityCheck;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.model.Case;
import rdstab.solver.setup.Problem;
import rdstab.solver.setup.ProblemBuilder;

/**
 * Runs the chains of a sweep on a pool of threads.
 *
 * <p>Each chain runs on one thread, point after point: the case is rebuilt at the point's parameter
 * values ({@link Case#withParameter}), and {@link StabilityCheck#run(Problem, double[])} is started
 * from the warm-start guess — the base state of the latest point of the chain that had one, or the
 * case's own initial guess at the first point (and after failures that left none). Because chains
 * are fixed by the {@link SweepGrid} and each is computed sequentially, the numbers do not depend on
 * the number of threads.
 *
 * <p>Points already finished (a resumed run) are not reported again. Where a later point of the chain
 * still has to be computed, the base state of a finished point with status OK or NOT_CONVERGED is
 * recomputed by Newton alone (no eigen-solve), so the next point starts from the same guess as in an
 * uninterrupted run; a finished point that had no steady state (or was a bad point) left the guess
 * unchanged then and is skipped now. Chains with nothing left to compute are not run at all.
 *
 * <p>The listener is called from worker threads, concurrently and in completion order; it must be
 * thread-safe. If it throws, the sweep stops and the exception is rethrown by {@link #run}.
 */
public final class SweepRunner {

    /** Receives every computed point. */
    @FunctionalInterface
    public interface Listener {
        /** One point is finished (called from a worker thread). */
        void pointFinished(PointOutcome outcome) throws Exception;
    }

    private SweepRunner() {
    }

    /**
     * Computes the given chains.
     *
     * @param base    the case (its values of the varied parameters are replaced point by point)
     * @param grid    the sweep
     * @param chains  chain numbers to compute
     * @param finished status of each point already finished (null when it is still to be computed)
     * @param threads worker threads (≥ 1)
     * @param l       receives each outcome
     * @throws Exception the first exception thrown by the listener (the sweep stops)
     */
    public static void run(Case base, SweepGrid grid, List<Integer> chains, IntFunction<PointStatus> finished, int threads,
                           Listener l)
            throws Exception {
        if (threads < 1) {
            throw new IllegalArgumentException("threads must be >= 1, got " + threads);
        }
        ExecutorService pool = Executors.newFixedThreadPool(threads, r -> {
            Thread t = new Thread(r, "rdstab-sweep");
            t.setDaemon(true);
            return t;
        });
        try {
            List<Future<?>> futures = new ArrayList<>();
            for (int k : chains) {
                int[] pts = grid.chain(k);
                futures.add(pool.submit(() -> {
                    runChain(base, grid, pts, finished, l);
                    return null;
                }));
            }
            for (Future<?> f : futures) {
                try {
                    f.get();
                } catch (ExecutionException e) {
                    for (Future<?> g : futures) {
                        g.cancel(true);
                    }
                    throw e.getCause() instanceof Exception ex ? ex : new IllegalStateException(e.getCause());
                }
            }
        } finally {
            pool.shutdownNow();
        }
    }

    /** One chain, sequentially (public for tests and for single-thread drivers). */
    public static void runChain(Case base, SweepGrid grid, int[] pts, IntFunction<PointStatus> finished, Listener l)
            throws Exception {
        int last = pts.length - 1;
        while (last >= 0 && finished.apply(pts[last]) != null) {
            last--;
        }
        double[] warm = null;
        for (int i = 0; i <= last; i++) {
            int p = pts[i];
            PointStatus earlier = finished.apply(p);
            if (Thread.currentThread().isInterrupted()) {
                throw new InterruptedException("sweep stopped");
            }
            double[] v = grid.values(p);
            Case c;
            Problem prob;
            try {
                c = base;
                for (int a = 0; a < v.length; a++) {
                    c = c.withParameter(grid.axes().get(a).name(), v[a]);
                }
                prob = ProblemBuilder.build(c);
            } catch (IllegalArgumentException e) {
                if (earlier == null) {
                    l.pointFinished(new PointOutcome(p, v, null, PointStatus.BAD_POINT, null, -1, Double.NaN, e.getMessage()));
                }
                continue;
            }
            double[] guess = warm != null && warm.length == prob.full().unknowns() ? warm : prob.initial();
            if (earlier != null) {
                if (earlier == PointStatus.OK || earlier == PointStatus.NOT_CONVERGED) {
                    warm = baseOnly(prob, guess, warm);
                }
                continue;
            }
            PointOutcome o = compute(p, v, c, prob, guess);
            if (o.result() != null) {
                warm = o.result().base().u();
            } else if (o.status() == PointStatus.NOT_CONVERGED) {
                warm = baseOnly(prob, guess, warm);
            }
            l.pointFinished(o);
        }
    }

    private static double[] baseOnly(Problem prob, double[] guess, double[] previous) {
        try {
            return StabilityCheck.steadyState(prob, guess).u();
        } catch (RuntimeException e) {
            return previous;
        }
    }

    /** The check at one point; every failure becomes a status. */
    static PointOutcome compute(int p, double[] v, Case c, Problem prob, double[] guess) {
        try {
            CheckResult r = StabilityCheck.run(prob, guess);
            return new PointOutcome(p, v, c, PointStatus.OK, r, r.base().iterations(), r.base().residual(), "");
        } catch (ConvergenceException e) {
            PointStatus s = e.reason() == ConvergenceException.Reason.NO_STEADY_STATE
                    ? PointStatus.NO_STEADY_STATE : PointStatus.NOT_CONVERGED;
            int it = s == PointStatus.NO_STEADY_STATE ? e.iterations() : -1;
            double res = s == PointStatus.NO_STEADY_STATE ? e.lastResidual() : Double.NaN;
            return new PointOutcome(p, v, c, s, null, it, res, e.getMessage());
        } catch (IllegalArgumentException e) {
            return new PointOutcome(p, v, c, PointStatus.BAD_POINT, null, -1, Double.NaN, e.getMessage());
        } catch (RuntimeException e) {
            return new PointOutcome(p, v, c, PointStatus.BAD_POINT, null, -1, Double.NaN,
                    "internal error (" + e.getClass().getSimpleName() + "): " + e.getMessage());
        }
    }
}
