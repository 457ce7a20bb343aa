package rdstab.solver.continuation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.hipparchus.analysis.solvers.BrentSolver;
import org.junit.jupiter.api.Test;

/**
 * Folds of the Frank-Kamenetskii thermal-explosion problem u'' + (j/r) u' + δ e^u = 0, u'(0) = 0, u(1) = 0,
 * traced through the turning point.
 *
 * <p>Reference values (REFERENCE-CHECKS.md): slab δ_c = 0.87845768 with u(0) = 1.18684217, from the closed form
 * u = ln a − 2 ln cosh(√(aδ/2) x) (Frank-Kamenetskii); cylinder δ_c = 2 exactly with u(0) = ln 4 (closed form,
 * Frank-Kamenetskii; Chambré). Exchange of stability at a turning point (standard result): the rightmost
 * eigenvalue passes through zero at the fold, the lower part is stable and the upper part unstable.
 *
 * <p>The grid value approaches the reference at second order (vertex-centred finite volumes), so the tests check
 * the observed order on three grids and the Richardson extrapolation of the two finer ones. Tolerance 1e-8: the
 * fold is located to ~1e-10 in s (quadratic in p), and the Richardson remainder O(h⁴) observed on these grids is
 * about 1e-9.
 */
class FoldTest {

    /** Richardson extrapolation of a second-order quantity from grids n and 2n. */
    static double richardson(double coarse, double fine) {
        return fine + (fine - coarse) / 3.0;
    }

    static SpecialPoint fold(String shape, int cells, double from, double to) {
        TraceResult r = BranchTracer.trace(TraceCases.frankKamenetskii(shape, cells, from),
                TraceOptions.of("delta", from, to, 100, Double.NaN), TraceListener.NONE);
        TraceCases.assertEigenResiduals(r);
        SpecialPoint f = TraceCases.only(r, SpecialPointKind.FOLD);
        assertTrue(f.located(), "fold located");
        // exchange of stability: the rightmost eigenvalue passes through zero at the fold (standard result)
        assertEquals(0.0, f.critical().re(), 1e-8, "rightmost eigenvalue at the fold");
        assertEquals(0.0, r.rows().get(f.row()).growthRate(), 1e-8, "growth rate of the fold row");
        return f;
    }

    @Test
    void slabFoldConvergesToTheFrankKamenetskiiValueAtSecondOrder() {
        SpecialPoint f1 = fold("slab", 50, 0.6, 1.0);
        SpecialPoint f2 = fold("slab", 100, 0.6, 1.0);
        SpecialPoint f4 = fold("slab", 200, 0.6, 1.0);
        double order = Math.log((f1.parameter() - f2.parameter()) / (f2.parameter() - f4.parameter())) / Math.log(2);
        assertEquals(2.0, order, 0.1, "observed order of the fold value");
        // Frank-Kamenetskii closed form (REFERENCE-CHECKS.md)
        assertEquals(0.87845768, richardson(f2.parameter(), f4.parameter()), 1e-8);
        assertEquals(1.18684217, richardson(f2.max().get("u"), f4.max().get("u")), 1e-8);
    }

    @Test
    void cylinderFoldIsAtDeltaTwoWithCentreValueLnFour() {
        SpecialPoint f2 = fold("cylinder", 100, 1.5, 2.5);
        SpecialPoint f4 = fold("cylinder", 200, 1.5, 2.5);
        // closed form (Frank-Kamenetskii; Chambré): δ_c = 2, u(0) = ln 4
        assertEquals(2.0, richardson(f2.parameter(), f4.parameter()), 1e-8);
        assertEquals(Math.log(4), richardson(f2.max().get("u"), f4.max().get("u")), 1e-8);
    }

    @Test
    void lowerPartIsStableAndUpperPartUnstable() {
        TraceResult r = BranchTracer.trace(TraceCases.frankKamenetskii("slab", 100, 0.6), TraceOptions.of("delta", 0.6, 1.0, 100,
                Double.NaN), TraceListener.NONE);
        TraceCases.assertEigenResiduals(r);
        SpecialPoint f = TraceCases.only(r, SpecialPointKind.FOLD);
        int before = 0;
        int after = 0;
        for (BranchRow row : r.rows()) {
            if (row.row() < f.row()) {
                assertEquals("stable", row.stability(), "row " + row.row() + " below the fold");
                assertTrue(row.point().tangentP() > 0, "δ grows along the lower part");
                before++;
            } else if (row.row() > f.row()) {
                assertEquals("unstable", row.stability(), "row " + row.row() + " above the fold");
                assertTrue(row.point().tangentP() < 0, "δ falls along the upper part");
                after++;
            }
        }
        assertTrue(before >= 3 && after >= 3, "rows on both parts: " + before + ", " + after);
        assertEquals("fold", r.rows().get(f.row()).label());
        assertEquals(0.6, r.rows().get(r.rows().size() - 1).parameter(), 1e-12, "the trace ends on the range end");
    }

    /**
     * Past the fold to u(0) ≥ 6 without jumping back: u(0) strictly increasing and δ strictly decreasing after the
     * fold, one fold only; the final state matches the upper closed-form solution at δ = 0.05.
     */
    @Test
    void traceContinuesUpTheUpperBranchWithoutJumpingBack() {
        double end = 0.05;
        TraceResult r = BranchTracer.trace(TraceCases.frankKamenetskii("slab", 200, end), TraceOptions.of("delta", end, 1.0, 200,
                Double.NaN), TraceListener.NONE);
        TraceCases.assertEigenResiduals(r);
        SpecialPoint f = TraceCases.only(r, SpecialPointKind.FOLD);
        double lastU = f.max().get("u");
        double lastP = f.parameter();
        for (BranchRow row : r.rows().subList(f.row() + 1, r.rows().size())) {
            assertTrue(row.max().get("u") > lastU, "u(0) increases at row " + row.row());
            assertTrue(row.parameter() < lastP, "δ decreases at row " + row.row());
            lastU = row.max().get("u");
            lastP = row.parameter();
        }
        BranchRow last = r.rows().get(r.rows().size() - 1);
        assertEquals(end, last.parameter(), 1e-12);
        assertTrue(last.max().get("u") >= 6, "reached u(0) = " + last.max().get("u"));
        // closed form u(0) = ln a with cosh²(√(aδ/2)) = a, upper root (Frank-Kamenetskii), found by Hipparchus Brent
        double a = new BrentSolver(1e-14, 1e-12).solve(200,
                x -> Math.pow(Math.cosh(Math.sqrt(x * end / 2)), 2) - x, 50, 5000);
        // 200 cells, second order: observed error 1.0e-5 at u(0) = 6.41; tolerance 1e-4
        assertEquals(Math.log(a), last.max().get("u"), 1e-4, "upper-branch centre value at δ = " + end);
    }
}
