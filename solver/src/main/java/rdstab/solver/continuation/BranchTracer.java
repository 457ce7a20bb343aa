package rdstab.solver.continuation;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.ejml.data.DMatrixSparseCSC;
import rdstab.solver.assess.SafetyCautions;
import rdstab.solver.drive.StabilityCheck;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.error.ConvergenceException.Reason;
import rdstab.solver.model.Case;
import rdstab.solver.newton.BaseState;
import rdstab.solver.setup.Problem;

/**
 * Traces the branch of steady states of a case through one parameter by Keller's pseudo-arclength
 * continuation, through folds, with the rightmost eigenvalues and the stability of every point, and
 * locates the special points in between (folds, stationary crossings, Hopf points).
 *
 * <h2>Method</h2>
 * <ol>
 *   <li>Start: the case's damped-Newton solution at p = from ({@link StabilityCheck#steadyState}); the
 *       first tangent solves [[J, F_p], [0, 1]] t = (0, 1), normalised, oriented towards {@code to}.</li>
 *   <li>Step: predictor along the unit tangent, {@link ArclengthCorrector} (bordered Newton on the
 *       assembled sparse matrix), new tangent oriented by the old one.</li>
 *   <li>Guards and step control as in {@link TraceOptions}: a step whose secant-to-tangent angle or turning
 *       angle exceeds the limit, or whose corrector fails, is halved and retried.</li>
 *   <li>At every accepted point: the rightmost eigenvalues ({@link PointAnalysis}) and the stability word.</li>
 *   <li>Between two accepted points: a sign change of dp/ds is a fold; a change of the number of real
 *       eigenvalues with Re λ &gt; 0 without a fold is a stationary crossing; a change of the number of
 *       non-real ones (not a collision of a real pair into a complex one) is a Hopf point. Each is located by
 *       {@link SpecialPointLocator} and becomes a labelled row.</li>
 *   <li>Stop: p reaches either end of [from, to] (the last row lies exactly on it, found by Brent on p(s) −
 *       end), the step cap, or a step below the minimum.</li>
 * </ol>
 * Counts of unstable eigenvalues consider the computed rightmost set only (the case's {@code modes}); raise it
 * when many eigenvalues are unstable at once.
 */
public final class BranchTracer {

    private final ParameterFamily family;
    private final TraceOptions options;
    private final TraceListener listener;
    private final ArclengthCorrector corrector;
    private final SpecialPointLocator locator;
    private final List<BranchRow> rows = new ArrayList<>();
    private final List<SpecialPoint> specials = new ArrayList<>();
    private final List<String> warnings = new ArrayList<>();
    private int nextRow;
    private String skipOnce = "";
    private int rejected;

    private BranchTracer(Case c, TraceOptions o, double reference, TraceListener l) {
        this.family = new ParameterFamily(c, o.name(), reference);
        this.options = o;
        this.listener = l;
        this.corrector = new ArclengthCorrector(family, c.analysis().newtonTolerance(), o.maxCorrectorIterations());
        this.locator = new SpecialPointLocator(family, corrector);
    }

    /**
     * Traces from the case's Newton solution at {@code options.from()}.
     *
     * @throws ConvergenceException NO_STEADY_STATE when Newton finds no start; SINGULAR_SHIFT when the start is a fold
     */
    public static TraceResult trace(Case c, TraceOptions options, TraceListener listener) {
        BranchTracer t = new BranchTracer(c, options, options.from(), listener);
        return t.run(t.start(), 0, 0, 0.0, options.step());
    }

    /** Resumes a trace from a row of an earlier one (same case, parameter and options give the same rows after it). */
    public static TraceResult resume(Case c, TraceOptions options, RestartPoint r, TraceListener listener) {
        BranchTracer t = new BranchTracer(c, options, options.from(), listener);
        if (r.point().u().length != t.family.unknowns()) {
            throw new IllegalArgumentException("the restart state has " + r.point().u().length + " unknowns, the case has "
                    + t.family.unknowns() + " (same case and --cells needed)");
        }
        t.skipOnce = r.label() == null ? "" : r.label();
        return t.run(r.point(), r.row(), r.step(), r.arclength(), r.nextStep());
    }

    private BranchPoint start() {
        double p = options.from();
        Problem pr = family.problem(p);
        BaseState base = StabilityCheck.steadyState(pr, pr.initial());
        int n = family.unknowns();
        DMatrixSparseCSC j = family.jacobian(base.u(), p);
        double[] t;
        try {
            t = BorderedSystem.factor(j, family.parameterDerivative(base.u(), p), new double[n], 1.0).solve(new double[n], 1.0);
        } catch (ConvergenceException e) {
            throw new ConvergenceException(Reason.SINGULAR_SHIFT, "cannot start the trace at " + options.name() + " = " + p
                    + ": the Jacobian is singular there (a fold or branch point); start a little away from it", 0,
                    base.residual(), e);
        }
        double norm = Math.sqrt(family.dot(t, t[n], t, t[n])) * Math.signum(options.to() - options.from());
        double[] tu = new double[n];
        for (int i = 0; i < n; i++) {
            tu[i] = t[i] / norm;
        }
        return new BranchPoint(base.u(), p, tu, t[n] / norm, base.iterations(), base.residual());
    }

    private TraceResult run(BranchPoint first, int row0, int step0, double s0, double ds0) {
        nextRow = row0;
        int steps = step0;
        double s = s0;
        double ds = Math.min(Math.max(ds0, options.minStep()), options.maxStep());
        BranchPoint x = first;
        PointAnalysis xInfo = PointAnalysis.of(family, x.u(), x.p());
        addRow(steps, s, x, xInfo, "", ds);
        String stop = atEnd(x) ? String.format(Locale.ROOT, "reached %s = %.10g", options.name(), x.p()) : null;
        String lastFailure = "";
        while (stop == null) {
            if (steps >= options.maxSteps()) {
                stop = "step cap " + options.maxSteps() + " reached";
                break;
            }
            BranchPoint y;
            try {
                y = corrector.correct(x, ds);
                String why = guard(x, y, ds);
                if (why != null) {
                    throw new ConvergenceException(Reason.DIVERGED, why, y.iterations(), y.residual());
                }
            } catch (ConvergenceException e) {
                rejected++;
                lastFailure = e.getMessage();
                listener.rejected(ds, lastFailure);
                ds *= 0.5;
                if (ds < options.minStep()) {
                    stop = String.format(Locale.ROOT, "the step fell below %.3g at %s = %.10g (last failure: %s)",
                            options.minStep(), options.name(), x.p(), lastFailure);
                }
                continue;
            }
            PointAnalysis yInfo = PointAnalysis.of(family, y.u(), y.p());
            double step = ds;
            double bound = y.p() > options.high() ? options.high() : y.p() < options.low() ? options.low() : Double.NaN;
            if (!Double.isNaN(bound)) {
                SpecialPointLocator.Location end = locator.locate(x, xInfo, ds, y, yInfo, SpecialPointLocator.Needs.POINT,
                        (pt, info) -> pt.p() - bound);
                step = end.s();
                y = land(x, end.point(), bound);
                yInfo = PointAnalysis.of(family, y.u(), y.p());
                stop = String.format(Locale.ROOT, "reached %s = %.10g", options.name(), y.p());
            }
            steps++;
            locateSpecials(x, xInfo, step, y, yInfo, steps - 1, s);
            skipOnce = "";
            ds = adapt(ds, x, y);
            s += step;
            addRow(steps, s, y, yInfo, "", ds);
            x = y;
            xInfo = yInfo;
        }
        return new TraceResult(family.baseCase(), options, rows, specials, steps - step0, rejected, stop, warnings,
                SafetyCautions.STANDARD);
    }

    /** True when x lies on an end of the range with the tangent pointing out of it (a restart from the last row). */
    private boolean atEnd(BranchPoint x) {
        return x.p() == options.high() && x.tangentP() > 0 || x.p() == options.low() && x.tangentP() < 0;
    }

    /** The branch point exactly at p = bound, from the located one (falls back to it when Newton fails). */
    private BranchPoint land(BranchPoint anchor, BranchPoint located, double bound) {
        try {
            return corrector.atParameter(anchor, located.u(), bound);
        } catch (ConvergenceException e) {
            warnings.add("the last row could not be moved exactly onto " + options.name() + " = " + bound + ": " + e.getMessage());
            return located;
        }
    }

    /** Null when the step is acceptable, else why not. */
    private String guard(BranchPoint x, BranchPoint y, double ds) {
        int n = family.unknowns();
        double[] sec = new double[n];
        for (int i = 0; i < n; i++) {
            sec[i] = y.u()[i] - x.u()[i];
        }
        double secP = y.p() - x.p();
        double secNorm = Math.sqrt(family.dot(sec, secP, sec, secP));
        double secAngle = Math.acos(Math.min(1.0, Math.abs(ds) / secNorm));
        if (secAngle > options.maxAngle()) {
            return String.format(Locale.ROOT, "the corrector moved %.3g from the predictor (secant angle %.3g rad): possible jump "
                    + "to another branch", secNorm * Math.sin(secAngle), secAngle);
        }
        double turn = turn(x, y);
        if (turn > options.maxAngle()) {
            return String.format(Locale.ROOT, "the tangent turned by %.3g rad in one step", turn);
        }
        return null;
    }

    private double turn(BranchPoint x, BranchPoint y) {
        double c = family.dot(x.tangentU(), x.tangentP(), y.tangentU(), y.tangentP());
        return Math.acos(Math.max(-1.0, Math.min(1.0, c)));
    }

    private double adapt(double ds, BranchPoint x, BranchPoint y) {
        double next = ds;
        if (y.iterations() <= 3 && turn(x, y) < options.maxAngle() / 3) {
            next = ds * 1.5;
        } else if (y.iterations() >= 6) {
            next = ds * 0.7;
        }
        return Math.min(Math.max(next, options.minStep()), options.maxStep());
    }

    private void locateSpecials(BranchPoint x, PointAnalysis xi, double ds, BranchPoint y, PointAnalysis yi, int step, double s) {
        List<SpecialPointLocator.Location> found = new ArrayList<>();
        List<SpecialPointKind> kinds = new ArrayList<>();
        boolean fold = x.tangentP() * y.tangentP() < 0;
        int dr = yi.realUnstable() - xi.realUnstable();
        int dc = yi.complexUnstable() - xi.complexUnstable();
        boolean collision = dr + dc == 0;
        if (fold) {
            found.add(locator.locate(x, xi, ds, y, yi, SpecialPointLocator.Needs.POINT, (pt, info) -> pt.tangentP()));
            kinds.add(SpecialPointKind.FOLD);
        } else if (dr != 0 && !collision) {
            found.add(locator.locate(x, xi, ds, y, yi, SpecialPointLocator.Needs.SPECTRUM, (pt, info) -> realNearZero(info)));
            kinds.add(SpecialPointKind.STATIONARY_CROSSING);
        }
        if (dc != 0 && !collision) {
            found.add(locator.locate(x, xi, ds, y, yi, SpecialPointLocator.Needs.SPECTRUM, (pt, info) -> pairRe(info)));
            kinds.add(SpecialPointKind.HOPF);
        }
        List<Integer> order = new ArrayList<>();
        for (int i = 0; i < found.size(); i++) {
            order.add(i);
        }
        order.sort((a, b) -> Double.compare(found.get(a).s(), found.get(b).s()));
        for (int i : order) {
            if (kinds.get(i).word().equals(skipOnce)) {
                continue;
            }
            record(kinds.get(i), found.get(i), xi, yi, step, s, ds);
        }
    }

    private static double realNearZero(PointAnalysis info) {
        Eigenvalue e = info.realNearestZero();
        return e == null ? Double.NaN : e.re();
    }

    private static double pairRe(PointAnalysis info) {
        Eigenvalue e = info.pairNearestAxis();
        return e == null ? Double.NaN : e.re();
    }

    private void record(SpecialPointKind kind, SpecialPointLocator.Location loc, PointAnalysis xi, PointAnalysis yi, int step,
                        double s, double ds) {
        PointAnalysis info = loc.analysis();
        Eigenvalue critical = kind == SpecialPointKind.HOPF ? info.pairNearestAxis() : info.realNearestZero();
        if (critical == null) {
            critical = info.eigenvalues().get(0);
        }
        double omega = kind == SpecialPointKind.HOPF ? Math.abs(critical.im()) : Double.NaN;
        String direction;
        if (kind == SpecialPointKind.FOLD) {
            direction = "turns back";
        } else {
            int before = kind == SpecialPointKind.HOPF ? xi.complexUnstable() : xi.realUnstable();
            int after = kind == SpecialPointKind.HOPF ? yi.complexUnstable() : yi.realUnstable();
            direction = after > before ? "stable to unstable" : "unstable to stable";
        }
        int row;
        if (loc.located()) {
            row = nextRow;
            addRow(step, s + loc.s(), loc.point(), info, kind.word(), ds);
        } else {
            row = nextRow;
            warnings.add(String.format(Locale.ROOT, "a %s was detected between rows %d and %d but could not be located; "
                    + "its values are those of row %d", kind.word(), nextRow - 1, nextRow, nextRow));
        }
        specials.add(new SpecialPoint(kind, row, s + loc.s(), loc.point().p(), info.max(), critical, omega, 2 * Math.PI / omega,
                loc.located(), loc.tolerance(), loc.evaluations(), direction));
    }

    private void addRow(int step, double s, BranchPoint x, PointAnalysis info, String label, double next) {
        BranchRow r = new BranchRow(nextRow++, step, s, x.p(), info.norm(), info.max(), info.eigenvalues(), info.growthRate(),
                info.frequency(), info.stability(), label, x, next);
        rows.add(r);
        listener.row(r);
    }
}
