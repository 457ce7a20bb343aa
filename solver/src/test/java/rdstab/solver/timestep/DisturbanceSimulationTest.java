package rdstab.solver.timestep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.drive.StabilityCheck;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.model.Case;

/** The nonlinear simulation against analytic decay rates and the known structure of the thermal-explosion slab. */
class DisturbanceSimulationTest {

    static final double RESIDUAL_LIMIT = 1e-8;

    static CheckResult check(String yaml) {
        CheckResult r = StabilityCheck.run(CaseReader.parse(yaml, "sim.yaml"));
        for (EigenPair e : r.modes()) {
            assertTrue(e.residual() < RESIDUAL_LIMIT, "eigenpair residual " + e.residual());
        }
        return r;
    }

    static DisturbanceSimulation.Options opts(double time, Double... amplitudes) {
        return new DisturbanceSimulation.Options(1, List.of(amplitudes), time, Double.NaN, DisturbanceSimulation.DEFAULT_RTOL);
    }

    /** Frank-Kamenetskii slab u'' + δ e^u = 0, insulated centre, fixed surface, on the chosen branch. */
    static String fk(double delta, String initial) {
        return String.join("\n", "title: FK slab", "geometry: {shape: slab, from: 0, to: 1}", "mesh: {cells: 100}",
                "parameters: {delta: " + delta + "}", "fields:", "  - name: u", "    diffusivity: 1",
                "    source: delta*exp(u)", "    initial: " + initial, "boundaries:", "  left: {u: insulated}",
                "  right: {u: {fixed: 0}}", "");
    }

    @Test
    void heatEquationModeDecaysAtTheAnalyticRate() {
        // u_t = α u_xx on (0, L), u = 0 at both ends: σ1 = −α π²/L² (separation of variables)
        double alpha = 0.5;
        double len = 2.0;
        CheckResult c = check(String.join("\n", "title: heat", "geometry: {shape: slab, from: 0, to: L}",
                "mesh: {cells: 100}", "parameters: {alpha: " + alpha + ", L: " + len + "}", "fields:", "  - name: u",
                "    diffusivity: alpha", "    source: 0", "    initial: 0", "boundaries:", "  left: {u: {fixed: 0}}",
                "  right: {u: {fixed: 0}}", ""));
        SimulationResult s = DisturbanceSimulation.run(c, opts(Double.NaN, 0.3), null);
        double exact = -alpha * Math.PI * Math.PI / (len * len);
        SimulationResult.Run run = s.runs().get(0);
        assertEquals(exact, run.measuredRate(), 0.01 * Math.abs(exact), "measured decay rate");
        assertTrue(run.fitSamples() >= 40, "fit points " + run.fitSamples());
        assertEquals(SimulationResult.Outcome.RETURNED, run.outcome());
        assertTrue(s.cautions().size() >= 3, "safety cautions kept");
    }

    @Test
    void lowerBranchDisturbanceDecaysAtThePredictedRate() {
        // lower-branch sigma = -1.8020144 at delta = 0.5 (REFERENCE-CHECKS.md, from the closed form)
        CheckResult c = check(fk(0.5, "0"));
        SimulationResult s = DisturbanceSimulation.run(c, opts(Double.NaN, 1e-3), null);
        SimulationResult.Run run = s.runs().get(0);
        assertEquals(-1.8020144, run.measuredRate(), 0.01 * 1.8020144);
        assertEquals(s.linearRate(), run.measuredRate(), 0.01 * Math.abs(s.linearRate()));
        assertEquals(SimulationResult.Outcome.RETURNED, run.outcome());
    }

    @Test
    void upperBranchGrowsAtThePredictedRateAndLargeDisturbancesGoEitherWay() {
        // upper-branch sigma = +3.9664338 at delta = 0.5 (REFERENCE-CHECKS.md, from the closed form)
        CheckResult upper = check(fk(0.5, "5*cos(pi*x/2)"));
        assertTrue(upper.modes().get(0).re() > 0);
        // runaway threshold u > 10 (about 3.5 times the upper-branch maximum 2.9): e^u is then 150 times its value
        // on the upper branch; a higher threshold only adds steps near the blow-up
        SimulationResult s = DisturbanceSimulation.run(upper, new DisturbanceSimulation.Options(1, List.of(1e-4, 0.3, -0.3),
                8.0, 10.0, DisturbanceSimulation.DEFAULT_RTOL), null);
        SimulationResult.Run small = s.runs().get(0);
        assertEquals(3.9664338, small.measuredRate(), 0.01 * 3.9664338);
        // Bistable structure (Frank-Kamenetskii; the upper state is the saddle between the lower state and runaway):
        // pushed up it runs away, pushed down it falls onto the lower branch.
        SimulationResult.Run up = s.runs().get(1);
        SimulationResult.Run down = s.runs().get(2);
        assertEquals(SimulationResult.Outcome.RUNAWAY, up.outcome());
        assertTrue(up.runawayTime() > 0 && up.runawayTime() < 8.0, "runaway time " + up.runawayTime());
        assertEquals(SimulationResult.Outcome.OTHER_STEADY_STATE, down.outcome());
        CheckResult lower = check(fk(0.5, "0"));
        assertEquals(lower.baseMax().get("u"), down.finalMax()[0], 1e-6, "ends on the lower branch");
        // the linear prediction holds for the small disturbance only
        assertTrue(small.departure(s.linearRate()) < 0.01);
        assertEquals(0.3, s.departureAmplitude(), 0.0, "smallest amplitude departing by more than 10%");
    }
}
