package rdstab.solver.drive;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.model.Case;

/** Each numerical fault reproduced by a small case and handled as stated (exit 3 only when unrecoverable). */
class NumericalFaultsTest {

    static Case fk(double delta, String initial, String source, String analysis) {
        return CaseReader.parse(String.join("\n",
                "title: t", "geometry: {shape: slab, from: 0, to: 1}", "mesh: {cells: 100}",
                "parameters: {delta: " + delta + "}",
                "fields:", "  - name: u", "    diffusivity: 1", "    source: " + source, "    initial: " + initial,
                "boundaries:", "  left: {u: insulated}", "  right: {u: {fixed: 0}}",
                analysis, ""), "faults.yaml");
    }

    @Test
    void divergingNewtonIsRecoveredBySourceContinuation() {
        // A far-off guess (u = 60 everywhere) makes Newton fail; the lower branch is reached from the source-free
        // state. Same base state and eigenvalue as from the good guess (FK slab, delta = 0.8 < 0.8785).
        CheckResult good = StabilityCheck.run(fk(0.8, "0", "delta*exp(u)", ""));
        CheckResult bad = StabilityCheck.run(fk(0.8, "60", "delta*exp(u)", ""));
        assertEquals("newton", good.base().route());
        assertEquals("source continuation", bad.base().route());
        assertEquals(good.assessment().growthRate(), bad.assessment().growthRate(), 1e-8);
        assertTrue(bad.assessment().warnings().stream().anyMatch(w -> w.contains("continuation in the source strength")));
        for (EigenPair e : bad.modes()) {
            assertTrue(e.residual() < 1e-8);
        }
    }

    @Test
    void noSteadyStateNamesTheFoldOfTheSourceContinuation() {
        ConvergenceException e = assertThrows(ConvergenceException.class, () -> StabilityCheck.run(fk(1.0, "0", "delta*exp(u)", "")));
        assertEquals(ConvergenceException.Reason.NO_STEADY_STATE, e.reason());
        // the path turns back at s = delta_c/delta = 0.8785 (Frank-Kamenetskii) of the full source
        assertTrue(e.getMessage().contains("stops at 0.87"), e.getMessage());
    }

    @Test
    void notANumberFromAFormulaNamesTheFormulaTheValuesAndThePoint() {
        ConvergenceException e = assertThrows(ConvergenceException.class,
                () -> StabilityCheck.run(fk(0.5, "0", "delta*log(u - 5)", "")));
        assertTrue(e.getMessage().contains("log(u - 5)") && e.getMessage().contains("u=0") && e.getMessage().contains("x="),
                e.getMessage());
    }

    @Test
    void shiftExactlyOnAnEigenvalueIsMovedAndTheAnswerStands() {
        CheckResult first = StabilityCheck.run(fk(0.5, "0", "delta*exp(u)", ""));
        double lambda = first.modes().get(0).re();
        CheckResult again = StabilityCheck.run(fk(0.5, "0", "delta*exp(u)", "analysis: {shift: " + lambda + "}"));
        assertEquals(lambda, again.modes().get(0).re(), 1e-9 * Math.abs(lambda));
        assertTrue(again.modes().get(0).residual() < 1e-8);
    }

    @Test
    void anEigenpairAboveTheResidualLimitIsNeverReportedAsConverged() {
        ConvergenceException e = assertThrows(ConvergenceException.class,
                () -> StabilityCheck.run(fk(0.5, "0", "delta*exp(u)", "analysis: {residual-limit: 1e-40}")));
        assertEquals(ConvergenceException.Reason.EIGEN_NOT_CONVERGED, e.reason());
    }
}
