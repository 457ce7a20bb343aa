package rdstab.solver.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.hipparchus.analysis.solvers.BrentSolver;
import org.junit.jupiter.api.Test;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.model.Case;

/**
 * Critical values of thermal explosion problems u'' + (j/r) u' + δ e^u = 0 with an insulated centre,
 * against Frank-Kamenetskii's closed forms (REFERENCE-CHECKS.md).
 */
class CriticalFinderTest {

    /** The case; the surface is fixed (u = 0) or convective (−u' = Bi u). */
    static Case fk(String shape, int cells, boolean convective) {
        String surface = convective ? "{convective: {h: Bi, ambient: 0}}" : "{fixed: 0}";
        String bounds = shape.equals("slab") ? "  left: {u: insulated}\n  right: {u: " + surface + "}\n"
                : "  outer: {u: " + surface + "}\n";
        return CaseReader.parse("title: FK " + shape + "\n"
                + "geometry: {shape: " + shape + ", from: 0, to: 1}\n"
                + "mesh: {cells: " + cells + "}\n"
                + "parameters: {delta: 0.1, Bi: 1}\n"
                + "fields:\n  - name: u\n    diffusivity: 1\n    source: delta*exp(u)\n    initial: 0\n"
                + "boundaries:\n" + bounds, "fk.yaml");
    }

    static void residualsSmall(CriticalPoint c) {
        for (EigenPair e : c.atCritical().modes()) {
            assertTrue(e.residual() < 1e-8, "eigenpair residual " + e.residual());
        }
    }

    /**
     * Critical δ of the slab with a convective surface from the closed form. The symmetric solutions are
     * u = ln a − 2 ln cosh(b x) with a = 2b²/δ (Frank-Kamenetskii); −u'(1) = Bi u(1) gives
     * δ(b) = 2 b² sech²(b) exp(−2 b tanh(b) / Bi), and δ_c is its maximum over b, where
     * d ln δ/db = 2/b − 2 tanh b − (2/Bi)(tanh b + b sech² b) = 0 (solved with Hipparchus' Brent).
     * Bi → ∞ gives max 2b² sech² b = 0.87845768.
     */
    static double closedFormCritical(double bi) {
        double b = new BrentSolver(1e-15, 1e-14).solve(500, x -> {
            double t = Math.tanh(x);
            double s2 = 1 - t * t;
            return 2 / x - 2 * t - (bi == Double.POSITIVE_INFINITY ? 0 : (2 / bi) * (t + x * s2));
        }, 1e-3, 10);
        double c = Math.cosh(b);
        double tail = bi == Double.POSITIVE_INFINITY ? 1 : Math.exp(-2 * b * Math.tanh(b) / bi);
        return 2 * b * b / (c * c) * tail;
    }

    @Test
    void closedFormReproducesThePublishedFixedSurfaceValue() {
        // Frank-Kamenetskii slab, fixed surface: delta_c = 0.87845768 (REFERENCE-CHECKS.md)
        assertEquals(0.87845768, closedFormCritical(Double.POSITIVE_INFINITY), 5e-9);
    }

    @Test
    void cylinderWithFixedSurfaceHasItsFoldAtDeltaTwo() {
        double tol = 1e-7;
        int[] cells = {50, 100, 200};
        double[] d = new double[cells.length];
        for (int k = 0; k < cells.length; k++) {
            CriticalPoint c = CriticalFinder.find(fk("cylinder", cells[k], false), Axis.parseRange("delta=0.5:2.5"), tol, 8);
            assertEquals(CriticalPoint.Kind.FOLD, c.kind(), "a fold: the steady state ceases to exist");
            assertTrue(c.tolerance() <= tol, "bracket half-width " + c.tolerance());
            // exchange of stability: the growth rate at the last steady state found is near 0 (it is ~5 at delta = 0.5)
            assertTrue(Math.abs(c.atCritical().assessment().growthRate()) < 0.05, "g " + c.atCritical().assessment().growthRate());
            residualsSmall(c);
            d[k] = c.value();
        }
        double p = Math.log((d[0] - d[1]) / (d[1] - d[2])) / Math.log(2);
        // second-order finite volumes: observed order in a band around 2 (common practice, no source)
        assertEquals(2.0, p, 0.3, "observed order " + p);
        // Richardson estimate of the grid error of the finest value: |d200 - d100| / (2^p - 1) with p = 2
        double gridError = Math.abs(d[2] - d[1]) / 3;
        // Frank-Kamenetskii / Chambré: delta_c = 2 exactly for the cylinder (REFERENCE-CHECKS.md); the finest value
        // must sit within its stated error (solver tolerance + grid error, with a factor 1.25 as in the GCI)
        assertEquals(2.0, d[2], 1.25 * gridError + tol, "finest grid within its stated error; grid error " + gridError);
        assertEquals(2.0, d[2] + (d[2] - d[1]) / 3, 2e-6, "Richardson-extrapolated value");
    }

    @Test
    void slabWithConvectiveSurfaceRisesTowardTheFixedSurfaceValue() {
        double[] bis = {1, 10, 100, 1000};
        double previous = 0;
        for (double bi : bis) {
            double d1 = CriticalFinder.find(fk("slab", 50, true).withParameter("Bi", bi), Axis.parseRange("delta=0.1:1.0"), 1e-8, 4).value();
            double d2 = CriticalFinder.find(fk("slab", 100, true).withParameter("Bi", bi), Axis.parseRange("delta=0.1:1.0"), 1e-8, 4).value();
            double rich = d2 + (d2 - d1) / 3;
            double exact = closedFormCritical(bi);
            // closed form above (Frank-Kamenetskii family); Richardson value to 1e-6 (grid error at 100 cells ~1e-5)
            assertEquals(exact, rich, 1e-6, "Bi = " + bi + ": 50 cells " + d1 + ", 100 cells " + d2);
            assertTrue(rich > previous, "critical delta rises with Bi");
            assertTrue(rich < 0.87845768, "and stays below the fixed-surface value 0.87845768 (Frank-Kamenetskii)");
            previous = rich;
        }
        // Bi = 1000: within 0.2 % of the fixed-surface limit, approached like 1/Bi (boundary-condition limit)
        assertEquals(0.87845768, previous, 0.002);
    }
}
