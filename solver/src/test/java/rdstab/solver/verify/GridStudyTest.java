package rdstab.solver.verify;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import rdstab.solver.assess.Assessment;
import rdstab.solver.assess.Verdict;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.model.Case;

/** The grid study against separation of variables and the closed-form thermal-explosion rates. */
class GridStudyTest {

    static final double RESIDUAL_LIMIT = 1e-8;

    static void assertResiduals(GridStudyResult r) {
        for (GridStudyResult.Level l : r.levels()) {
            for (EigenPair e : l.check().modes()) {
                assertTrue(e.residual() < RESIDUAL_LIMIT, "eigenpair residual " + e.residual() + " on " + l.cells() + " cells");
            }
        }
        for (GridStudyResult.Tracked t : r.tracked()) {
            for (double res : t.residual()) {
                assertTrue(res < RESIDUAL_LIMIT, "tracked residual " + res);
            }
        }
    }

    static Case laplacian(double len) {
        return CaseReader.parse(String.join("\n", "title: Laplacian", "geometry: {shape: slab, from: 0, to: L}",
                "mesh: {cells: 40}", "parameters: {L: " + len + "}", "fields:", "  - name: u", "    diffusivity: 1",
                "    source: 0", "    initial: 0", "boundaries:", "  left: {u: {fixed: 0}}", "  right: {u: {fixed: 0}}",
                "analysis: {modes: 4}", ""), "laplacian.yaml");
    }

    @Test
    void laplacianWithFixedEndsConvergesAtOrderTwoToMinusPiSquaredOverLSquared() {
        double len = 2.0;
        GridStudyResult r = GridStudy.run(laplacian(len), GridStudy.refined(40, 3, 2), 2, null);
        assertResiduals(r);
        assertArrayEquals(new int[] {40, 80, 160}, r.levels().stream().mapToInt(GridStudyResult.Level::cells).toArray());
        // σ1 = −π²/L², σ2 = −4π²/L² (separation of variables)
        RichardsonEstimate first = r.tracked().get(0).estimate();
        assertEquals(RichardsonEstimate.Status.OBSERVED, first.status());
        assertEquals(2.0, first.observed(), 0.05, "observed order");
        assertEquals(-Math.PI * Math.PI / (len * len), first.extrapolated(), 1e-6);
        assertTrue(Math.abs(first.f1() - first.extrapolated()) <= first.gciFine(), "GCI covers the fine-grid error");
        RichardsonEstimate second = r.tracked().get(1).estimate();
        assertEquals(-4 * Math.PI * Math.PI / (len * len), second.extrapolated(), 1e-5);
        for (GridStudyResult.Tracked t : r.tracked()) {
            for (double o : t.overlap()) {
                assertTrue(o > 0.999, "overlap " + o);
            }
        }
        // the base state is exactly 0 on every grid
        assertEquals(RichardsonEstimate.Status.ROUND_OFF, r.baseMax().get("u").estimate().status());
        assertTrue(r.resolved(), "a growth rate of -2.47 is far outside its grid band " + r.growthBand());
    }

    @Test
    void fourLevelsGiveAnOrderPerTripleAndTheFinestThreeForTheEstimate() {
        GridStudyResult r = GridStudy.run(laplacian(1.0), GridStudy.refined(20, 4, 2), 3, null);
        assertResiduals(r);
        double[] orders = r.tracked().get(0).orders();
        assertEquals(2, orders.length);
        for (double o : orders) {
            assertEquals(2.0, o, 0.05);
        }
        assertEquals(-Math.PI * Math.PI, r.tracked().get(0).estimate().extrapolated(), 1e-6);
    }

    @Test
    void thermalExplosionLowerBranchAroundTheRequestedGrid() {
        // slab, delta = 0.5, insulated centre, fixed surface: lower-branch σ = −1.8020144 (REFERENCE-CHECKS.md)
        Case c = CaseReader.parse(String.join("\n", "title: FK", "geometry: {shape: slab, from: 0, to: 1}",
                "mesh: {cells: 100}", "parameters: {delta: 0.5}", "fields:", "  - name: u", "    diffusivity: 1",
                "    source: delta*exp(u)", "    initial: 0", "boundaries:", "  left: {u: insulated}",
                "  right: {u: {fixed: 0}}", ""), "fk.yaml");
        int[] around = GridStudy.around(100, 2);
        assertArrayEquals(new int[] {50, 100, 200, 1}, around);
        GridStudyResult r = GridStudy.run(c, new int[] {around[0], around[1], around[2]}, around[3], null);
        assertResiduals(r);
        RichardsonEstimate e = r.tracked().get(0).estimate();
        assertEquals(2.0, e.observed(), 0.1);
        assertEquals(-1.8020144, e.extrapolated(), 2e-6);
        // the band of the requested grid covers its true error
        assertTrue(Math.abs(r.growthRate() - (-1.8020144)) <= r.growthBand(), "band " + r.growthBand());
        Assessment a = r.reportedCheck().assessment().withGridBand(r.growthBand() - r.reportedCheck().assessment().band(), "GCI");
        assertEquals(Verdict.STABLE, a.verdict());
        // a band wider than the rate makes the verdict marginal
        Assessment wide = r.reportedCheck().assessment().withGridBand(2.0, "test");
        assertEquals(Verdict.MARGINAL, wide.verdict());
        assertTrue(wide.warnings().stream().anyMatch(w -> w.contains("grid error band")));
    }
}
