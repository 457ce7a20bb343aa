package rdstab.solver.sweep;

import java.util.ArrayList;
import java.util.List;
import org.hipparchus.analysis.solvers.BrentSolver;
import org.hipparchus.exception.MathIllegalStateException;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.drive.StabilityCheck;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.error.ConvergenceException.Reason;
import rdstab.solver.model.Case;
import rdstab.solver.newton.BaseState;
import rdstab.solver.setup.Problem;
import rdstab.solver.setup.ProblemBuilder;
import rdstab.solver.sweep.CriticalPoint.Kind;
import rdstab.solver.sweep.CriticalPoint.ScanPoint;

/**
 * Locates the first value of a parameter, going from FROM toward TO, where the case stops being what
 * it was at FROM: either the rightmost Re λ (the growth rate g) changes sign while the steady state
 * continues (a neutral point), or the steady state ceases to exist (a fold).
 *
 * <p><b>Bracketing.</b> A coarse scan at {@code scanIntervals} + 1 evenly spaced values, each base
 * state continued from the previous one (natural continuation), stops at the first interval
 * [a, b] where g changes sign or where Newton finds no steady state at b.
 *
 * <p><b>Crossing.</b> Brent's method (Hipparchus {@link BrentSolver}) on g(p) over [a, b], every
 * evaluation warm-started from the base state at a, with absolute accuracy T/2 so the final bracket
 * is at most T wide: the root lies within ± T of the returned value. It is an "oscillatory crossing"
 * when the rightmost eigenvalue at the root has Im λ ≠ 0 (its frequency is reported), else a "real
 * crossing".
 *
 * <p><b>Fold.</b> Beyond a fold Newton fails; g is no use there, and it tends to 0 as the fold is
 * approached along the stable branch (exchange of stability: at a turning point J is singular).
 * So the fold is bisected on the existence of the continued steady state: the midpoint m of
 * [a, b] is tried by Newton from the base state at a; a is moved to m when it converges, b otherwise,
 * until b − a ≤ T. The value is (a + b)/2 ± (b − a)/2. Caveat: "Newton did not converge" is taken
 * as "no steady state"; near a fold the basin of Newton shrinks, so the bisection can stop a little
 * short of the exact fold — by at most the final bracket width when the step from a converges, which
 * the shrinking steps ensure in practice.
 *
 * <p>The critical value is that of the case's grid: rerun at a finer grid to measure the grid error
 * (second order for the finite-volume scheme).
 */
public final class CriticalFinder {

    /** Default number of scan intervals. */
    public static final int DEFAULT_SCAN = 16;

    private final Case base;
    private final String name;
    private int checks;

    private CriticalFinder(Case base, String name) {
        this.base = base;
        this.name = name;
    }

    /** The default tolerance for a range: 10⁻⁶ max(1, |FROM|, |TO|). */
    public static double defaultTolerance(Axis range) {
        return 1e-6 * Math.max(1.0, Math.max(Math.abs(range.from()), Math.abs(range.to())));
    }

    /**
     * Finds the critical value.
     *
     * @param c             the case
     * @param range         parameter and range (FROM ≠ TO; either direction)
     * @param tolerance     T &gt; 0: the result is within ± T of the discretization's critical value
     * @param scanIntervals coarse scan intervals (≥ 1)
     * @throws ConvergenceException NO_STEADY_STATE when there is none at FROM; EIGEN_NOT_CONVERGED
     *         when an eigen-solve fails
     */
    public static CriticalPoint find(Case c, Axis range, double tolerance, int scanIntervals) {
        if (!(tolerance > 0) || !Double.isFinite(tolerance)) {
            throw new rdstab.solver.error.InputException("command line", "--tolerance", "expected a number > 0, found " + tolerance);
        }
        if (scanIntervals < 1 || scanIntervals > 100_000) {
            throw new rdstab.solver.error.InputException("command line", "--scan", "expected 1 to 100000 intervals, found " + scanIntervals);
        }
        c.parameter(range.name());
        return new CriticalFinder(c, range.name()).search(range.from(), range.to(), tolerance, scanIntervals);
    }

    private CriticalPoint search(double from, double to, double tol, int n) {
        List<ScanPoint> scan = new ArrayList<>();
        Problem p0 = problem(from);
        CheckResult prev;
        try {
            prev = check(p0, p0.initial());
        } catch (ConvergenceException e) {
            if (e.reason() != Reason.NO_STEADY_STATE) {
                throw e;
            }
            throw new ConvergenceException(Reason.NO_STEADY_STATE, "no steady state at the start of the range, "
                    + name + " = " + from + ": start the range where one exists (" + e.getMessage() + ")",
                    e.iterations(), e.lastResidual(), e);
        }
        scan.add(point(from, prev));
        double a = from;
        double[] guessA = p0.initial();
        for (int i = 1; i <= n; i++) {
            double b = i == n ? to : from + (to - from) * i / n;
            Problem pb = problem(b);
            double[] ua = prev.base().u();
            CheckResult next;
            try {
                next = check(pb, ua);
            } catch (ConvergenceException e) {
                if (e.reason() != Reason.NO_STEADY_STATE) {
                    throw e;
                }
                scan.add(new ScanPoint(b, false, Double.NaN, Double.NaN));
                return fold(a, guessA, b, tol, scan);
            }
            scan.add(point(b, next));
            double ga = prev.assessment().growthRate();
            double gb = next.assessment().growthRate();
            if (gb == 0 || Math.signum(ga) != Math.signum(gb)) {
                return crossing(a, ua, ga, b, tol, scan);
            }
            a = b;
            guessA = ua;
            prev = next;
        }
        return new CriticalPoint(name, Double.NaN, Double.NaN, from, to, Kind.NONE, 0, prev, scan, checks);
    }

    private CriticalPoint fold(double a, double[] guessA, double b, double tol, List<ScanPoint> scan) {
        double lo = a;
        double hi = b;
        double[] guessLo = guessA;
        double[] uLo = StabilityCheck.steadyState(problem(lo), guessA).u();
        checks++;
        while (Math.abs(hi - lo) > tol) {
            double mid = 0.5 * (lo + hi);
            if (mid == lo || mid == hi) {
                break;
            }
            try {
                BaseState s = StabilityCheck.steadyState(problem(mid), uLo);
                checks++;
                guessLo = uLo;
                uLo = s.u();
                lo = mid;
            } catch (ConvergenceException e) {
                checks++;
                hi = mid;
            }
        }
        CheckResult at = check(problem(lo), guessLo);
        return new CriticalPoint(name, 0.5 * (lo + hi), 0.5 * Math.abs(hi - lo), lo, hi, Kind.FOLD, 0, at, scan, checks);
    }

    private CriticalPoint crossing(double a, double[] ua, double ga, double b, double tol, List<ScanPoint> scan) {
        BrentSolver brent = new BrentSolver(1e-15, 0.5 * tol);
        double root;
        try {
            root = ga == 0 ? a : brent.solve(200, v -> check(problem(v), ua).assessment().growthRate(),
                    Math.min(a, b), Math.max(a, b));
        } catch (MathIllegalStateException e) {
            throw new ConvergenceException(Reason.MAX_ITERATIONS, "the root finder did not bracket the neutral point of "
                    + name + " in [" + a + ", " + b + "]: " + e.getMessage(), brent.getEvaluations(), Double.NaN, e);
        }
        CheckResult at = check(problem(root), ua);
        double im = at.modes().get(0).im();
        boolean oscillatory = im != 0 && Math.abs(im) > 1e-9 * Math.max(1.0, Math.abs(at.modes().get(0).re()));
        Kind kind = oscillatory ? Kind.OSCILLATORY_CROSSING : Kind.REAL_CROSSING;
        double lo = Math.max(Math.min(a, b), root - tol);
        double hi = Math.min(Math.max(a, b), root + tol);
        boolean up = b > a;
        return new CriticalPoint(name, root, tol, up ? lo : hi, up ? hi : lo, kind, oscillatory ? Math.abs(im) : 0, at, scan,
                checks);
    }

    private Problem problem(double v) {
        return ProblemBuilder.build(base.withParameter(name, v));
    }

    private CheckResult check(Problem p, double[] guess) {
        checks++;
        return StabilityCheck.run(p, guess);
    }

    private static ScanPoint point(double v, CheckResult r) {
        return new ScanPoint(v, true, r.assessment().growthRate(), r.modes().get(0).im());
    }
}
