package rdstab.solver.continuation;

import java.util.HashMap;
import java.util.Map;
import java.util.function.ToDoubleFunction;
import org.hipparchus.analysis.solvers.BrentSolver;
import org.hipparchus.exception.MathRuntimeException;
import rdstab.solver.error.ConvergenceException;

/**
 * Locates a special point between two accepted step points a (s = 0) and b (s = Δs) by Brent's method
 * (Hipparchus {@link BrentSolver}) on a scalar test function g(s) evaluated at the branch point at
 * arclength s from a, i.e. the corrector solution anchored at a with Δs = s (the same parametrization that
 * produced b, so g(Δs) is g at b):
 * <ul>
 *   <li>fold: g = dp/ds, the parameter component of the unit tangent (changes sign at a turning point);</li>
 *   <li>stationary crossing: g = the real eigenvalue nearest 0;</li>
 *   <li>Hopf point: g = Re λ of the complex pair nearest the imaginary axis.</li>
 * </ul>
 * Tolerance: the bracket in s is narrowed to 10⁻⁹ Δs (absolute) or 10⁻¹⁴ relative, whichever is larger,
 * within {@link #MAX_EVALUATIONS} corrector solves. Near a fold p(s) is quadratic in s − s*, so the fold value
 * of p is far more accurate than s; states and eigenvalues are accurate to about |d/ds| · 10⁻⁹ Δs, well below
 * the corrector tolerance for the steps used here.
 */
final class SpecialPointLocator {

    /** Cap on corrector solves per location. */
    static final int MAX_EVALUATIONS = 60;
    /** Absolute tolerance in s, as a fraction of the step Δs. */
    static final double RELATIVE_TO_STEP = 1e-9;

    private final ParameterFamily family;
    private final ArclengthCorrector corrector;

    SpecialPointLocator(ParameterFamily family, ArclengthCorrector corrector) {
        this.family = family;
        this.corrector = corrector;
    }

    /** A located point: where, what is there, and how it was found. */
    record Location(double s, BranchPoint point, PointAnalysis analysis, boolean located, double tolerance, int evaluations) {
    }

    /** What a location needs at a branch point: the point alone (fold) or also its spectrum (crossings). */
    enum Needs { POINT, SPECTRUM }

    /**
     * Finds the root of g in (0, Δs).
     *
     * @param a      the step point at s = 0
     * @param aInfo  analysis at a
     * @param ds     the step to b
     * @param b      the step point at s = Δs (returned as the fallback when no root is bracketed)
     * @param bInfo  analysis at b
     * @param test   g, from a point and (when {@code needs} is SPECTRUM) its analysis
     */
    Location locate(BranchPoint a, PointAnalysis aInfo, double ds, BranchPoint b, PointAnalysis bInfo, Needs needs,
                    java.util.function.BiFunction<BranchPoint, PointAnalysis, Double> test) {
        Map<Double, BranchPoint> points = new HashMap<>();
        Map<Double, PointAnalysis> infos = new HashMap<>();
        int[] count = {0};
        ToDoubleFunction<Double> g = s -> {
            BranchPoint x = s == 0 ? a : s == ds ? b : points.computeIfAbsent(s, t -> {
                count[0]++;
                return corrector.correct(a, t);
            });
            PointAnalysis info = needs == Needs.POINT ? null
                    : s == ds ? bInfo : s == 0 ? aInfo : infos.computeIfAbsent(s, t -> PointAnalysis.of(family, x.u(), x.p()));
            return test.apply(x, info);
        };
        double tol = RELATIVE_TO_STEP * ds;
        try {
            double g0 = g.applyAsDouble(0.0);
            double g1 = g.applyAsDouble(ds);
            if (!(g0 * g1 < 0)) {
                return new Location(ds, b, bInfo, false, ds, count[0]);
            }
            BrentSolver brent = new BrentSolver(1e-14, tol, 0.0);
            double root = brent.solve(MAX_EVALUATIONS, s -> g.applyAsDouble(s), 0.0, ds);
            BranchPoint x = root == ds ? b : root == 0 ? a : points.computeIfAbsent(root, t -> corrector.correct(a, t));
            PointAnalysis info = root == ds ? bInfo : infos.computeIfAbsent(root, t -> PointAnalysis.of(family, x.u(), x.p()));
            return new Location(root, x, info, true, tol, count[0]);
        } catch (ConvergenceException | MathRuntimeException e) {
            return new Location(ds, b, bInfo, false, ds, count[0]);
        }
    }
}
