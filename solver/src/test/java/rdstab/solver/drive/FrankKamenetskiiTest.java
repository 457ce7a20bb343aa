package rdstab.solver.drive;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import rdstab.solver.assess.Verdict;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.model.Case;

/**
 * Frank-Kamenetskii thermal explosion u'' + (j/r) u' + δ e^u = 0, u'(0) = 0, u(1) = 0, through the
 * whole check (case text → Newton → shift-invert → assessment).
 *
 * <p>Reference values (REFERENCE-CHECKS.md): slab at δ = 0.5, rightmost σ on the lower branch
 * −1.8020144, on the upper branch +3.9664338 (from the closed form u = ln a − 2 ln cosh(√(aδ/2) x),
 * Frank-Kamenetskii); critical δ: slab 0.87845768, cylinder 2 exactly.
 */
class FrankKamenetskiiTest {

    static String fk(String shape, double delta, String initial, int cells) {
        String left = shape.equals("slab") ? "  left:\n    u: insulated\n  right:\n" : "  outer:\n";
        return "title: FK " + shape + "\n"
                + "geometry: {shape: " + shape + ", from: 0, to: 1}\n"
                + "mesh: {cells: " + cells + "}\n"
                + "parameters: {delta: " + delta + "}\n"
                + "fields:\n  - name: u\n    diffusivity: 1\n    source: delta*exp(u)\n    initial: " + initial + "\n"
                + "boundaries:\n" + left + "    u: {fixed: 0}\n";
    }

    static double growth(String shape, double delta, String initial, int cells) {
        Case c = CaseReader.parse(fk(shape, delta, initial, cells), "fk.yaml");
        CheckResult r = StabilityCheck.run(c);
        for (EigenPair e : r.modes()) {
            assertTrue(e.residual() < 1e-8, "eigenpair residual " + e.residual());
        }
        return r.assessment().growthRate();
    }

    /** Richardson extrapolation of a second-order quantity from grids n and 2n. */
    static double richardson(double coarse, double fine) {
        return fine + (fine - coarse) / 3.0;
    }

    @Test
    void lowerBranchOfSlabIsStableWithTheClosedFormRate() {
        double g1 = growth("slab", 0.5, "0", 200);
        double g2 = growth("slab", 0.5, "0", 400);
        double g4 = growth("slab", 0.5, "0", 800);
        double p = Math.log(Math.abs((g1 - g2) / (g2 - g4))) / Math.log(2);
        assertEquals(2.0, p, 0.1, "observed order of the eigenvalue");
        assertEquals(-1.8020144, richardson(g2, g4), 2e-6);
        Case c = CaseReader.parse(fk("slab", 0.5, "0", 200), "fk.yaml");
        assertEquals(Verdict.STABLE, StabilityCheck.run(c).assessment().verdict());
    }

    @Test
    void upperBranchOfSlabIsUnstableWithTheClosedFormRate() {
        String hot = "5*cos(pi*x/2)";
        double g2 = growth("slab", 0.5, hot, 400);
        double g4 = growth("slab", 0.5, hot, 800);
        assertEquals(3.9664338, richardson(g2, g4), 2e-5);
        Case c = CaseReader.parse(fk("slab", 0.5, hot, 200), "fk.yaml");
        CheckResult r = StabilityCheck.run(c);
        assertEquals(Verdict.UNSTABLE, r.assessment().verdict());
        assertEquals(0.0, r.assessment().peakX()[0], 1e-12, "the growing mode peaks at the mid-plane");
    }

    @Test
    void noSteadyStateAboveTheCriticalDeltaOfTheSlab() {
        Case c = CaseReader.parse(fk("slab", 0.9, "0", 200), "fk.yaml");
        ConvergenceException e = assertThrows(ConvergenceException.class, () -> StabilityCheck.run(c));
        assertEquals(ConvergenceException.Reason.NO_STEADY_STATE, e.reason());
    }

    @Test
    void cylinderHasSteadyStatesBelowTwoAndNoneAbove() {
        Case below = CaseReader.parse(fk("cylinder", 1.95, "0", 200), "fk.yaml");
        assertEquals(Verdict.STABLE, StabilityCheck.run(below).assessment().verdict());
        Case above = CaseReader.parse(fk("cylinder", 2.05, "0", 200), "fk.yaml");
        ConvergenceException e = assertThrows(ConvergenceException.class, () -> StabilityCheck.run(above));
        assertEquals(ConvergenceException.Reason.NO_STEADY_STATE, e.reason());
    }

    @Test
    void energyRatesAreOrderedAndCoincideForThisSelfAdjointCase() {
        Case c = CaseReader.parse(fk("slab", 0.5, "0", 200), "fk.yaml");
        CheckResult r = StabilityCheck.run(c);
        double spectral = r.assessment().growthRate();
        double numerical = r.energy().numericalAbscissa();
        // self-adjoint (one field, no drift): numerical abscissa = spectral abscissa (classical energy method)
        assertTrue(r.energy().selfAdjoint());
        assertEquals(spectral, numerical, 1e-8 * Math.max(1, Math.abs(spectral)));
        assertTrue(numerical <= r.energy().bound() + 1e-10, "numerical abscissa below the a-priori bound");
    }
}
