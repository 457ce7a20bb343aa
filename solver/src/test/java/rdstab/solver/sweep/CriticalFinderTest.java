package rdstab.solver.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.model.Case;

/** Critical values of thermal explosion problems against the Frank-Kamenetskii closed forms. */
class CriticalFinderTest {

    /** u'' + (j/r) u' + δ e^u = 0, insulated centre; surface fixed (u = 0) or convective (−u' = Bi u). */
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

    @Test
    void cylinderWithFixedSurfaceHasItsFoldAtDeltaTwo() {
        double tol = 1e-6;
        double[] d = new double[3];
        int[] cells = {100, 200, 400};
        for (int k = 0; k < 3; k++) {
            CriticalPoint c = CriticalFinder.find(fk("cylinder", cells[k], false), Axis.parseRange("delta=0.5:2.5"), tol, 16);
            assertEquals(CriticalPoint.Kind.FOLD, c.kind(), "a fold: the steady state ceases to exist");
            assertTrue(c.tolerance() <= tol, "bracket half-width " + c.tolerance());
            // exchange of stability at a fold: the growth rate at the last existing state is near 0
            assertTrue(Math.abs(c.atCritical().assessment().growthRate()) < 0.05, "g " + c.atCritical().assessment().growthRate());
            residualsSmall(c);
            d[k] = c.value();
        }
        double p = Math.log((d[0] - d[1]) / (d[1] - d[2])) / Math.log(2);
        // second-order finite volumes: observed order in a band around 2 (common practice, no source)
        assertEquals(2.0, p, 0.3, "observed order " + p + " from " + java.util.Arrays.toString(d));
        double gridError = Math.abs(d[2] - d[1]) / 3; // Richardson estimate of the error of the finest value
        // Frank-Kamenetskii / Chambré: delta_c = 2 exactly for the cylinder (REFERENCE-CHECKS.md)
        assertEquals(2.0, d[2], 2 * gridError + tol, "finest grid, within its stated error");
        assertEquals(2.0, d[2] + (d[2] - d[1]) / 3, 1e-4, "Richardson-extrapolated");
        System.err.printf("cylinder fold: %s p=%.3f grid error %.2e%n", java.util.Arrays.toString(d), p, gridError);
    }
}
