package rdstab.solver.drive;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.error.InputException;
import rdstab.solver.model.Case;

/** The physical self-heating form: groups from dimensional inputs, scaling of the critical size, limits. */
class SelfHeatingModelTest {

    static final String BODY = String.join("\n",
            "title: t",
            "geometry: {shape: slab}",
            "mesh: {cells: 200}",
            "self-heating:",
            "  density: 600 kg/m^3",
            "  heat-capacity: 1800 J/(kg*K)",
            "  conductivity: 0.12 W/(m*K)",
            "  size: 0.5 m",
            "  activation-energy: 110 kJ/mol",
            "  pre-exponential-factor: 5e9 1/s",
            "  heat-of-reaction: 3.0e6 J/kg",
            "  ambient-temperature: 30 degC",
            "");

    @Test
    void deltaEqualsTheHandCalculation() {
        Case c = CaseReader.parse(BODY, "b.yaml");
        // Frank-Kamenetskii parameter, standard definition: delta = (E/(R Ta^2)) rho Q A exp(-E/(R Ta)) L^2 / k
        double r = 8.314462618;
        double ta = 273.15 + 30;
        double e = 110e3;
        double delta = (e / (r * ta * ta)) * 600 * 3.0e6 * 5e9 * Math.exp(-e / (r * ta)) * 0.5 * 0.5 / 0.12;
        assertEquals(delta, c.parameter("delta"), 1e-12 * delta);
        assertEquals(r * ta / e, c.parameter("eps"), 1e-15);
        // --set in degrees Celsius recomputes the groups
        Case hot = c.withParameter("Ta", c.parseValue("Ta", "40 degC"));
        double ta2 = 313.15;
        double delta2 = (e / (r * ta2 * ta2)) * 600 * 3.0e6 * 5e9 * Math.exp(-e / (r * ta2)) * 0.25 / 0.12;
        assertEquals(delta2, hot.parameter("delta"), 1e-12 * delta2);
        assertEquals(313.15, hot.parseValue("Ta", "40"), 1e-12, "plain numbers are in the unit the case used (degC)");
    }

    @Test
    void criticalHalfThicknessReproducesTheFrankKamenetskiiValue() {
        // Fixed surface temperature (no h), exponential kinetics: runaway when delta > 0.87845768 (Frank-Kamenetskii,
        // closed form). So L_c = L * sqrt(0.87845768 / delta(L)); just below it a steady state exists, just above none.
        Case c = CaseReader.parse(BODY.replace("mesh: {cells: 200}", "mesh: {cells: 400}"), "b.yaml");
        double lc = 0.5 * Math.sqrt(0.87845768 / c.parameter("delta"));
        Case below = c.withParameter("L", 0.995 * lc);
        Case above = c.withParameter("L", 1.005 * lc);
        assertEquals(0.87845768 * 0.995 * 0.995, below.parameter("delta"), 1e-9);
        assertTrue(StabilityCheck.run(below).assessment().growthRate() < 0);
        ConvergenceException ex = assertThrows(ConvergenceException.class, () -> StabilityCheck.run(above));
        assertEquals(ConvergenceException.Reason.NO_STEADY_STATE, ex.reason());
    }

    /** Critical delta of the slab with fixed surface and kinetics exp(u/(1+eps u)), by bisection on existence. */
    static double criticalDelta(double eps) {
        String text = String.join("\n",
                "title: t", "geometry: {shape: slab, from: 0, to: 1}", "mesh: {cells: 200}",
                "parameters: {delta: 0.5, eps: " + eps + "}",
                "fields:", "  - name: u", "    diffusivity: 1", "    source: delta*exp(u/(1 + eps*u))", "    initial: 0",
                "boundaries:", "  left: {u: insulated}", "  right: {u: {fixed: 0}}", "");
        Case c = CaseReader.parse(text, "eps.yaml");
        double lo = 0.8;
        double hi = 1.2;
        while (hi - lo > 1e-5) {
            double mid = 0.5 * (lo + hi);
            try {
                StabilityCheck.steadyState(rdstab.solver.setup.ProblemBuilder.build(c.withParameter("delta", mid)),
                        rdstab.solver.setup.ProblemBuilder.build(c.withParameter("delta", mid)).initial());
                lo = mid;
            } catch (ConvergenceException e) {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }

    @Test
    void largeActivationEnergyFormTendsToTheExponentialLimit() {
        // As eps -> 0, exp(u/(1+eps u)) -> exp(u) and the critical delta tends continuously to 0.87845768
        // (Frank-Kamenetskii). Grid error at 200 cells is about 1e-5 relative (O(h^2)); bisection to 1e-5.
        double d0 = criticalDelta(0.0);
        double d1 = criticalDelta(0.005);
        double d2 = criticalDelta(0.02);
        double d3 = criticalDelta(0.05);
        assertEquals(0.87845768, d0, 1e-4);
        assertTrue(d3 > d2 && d2 > d1 && d1 > d0, d0 + " " + d1 + " " + d2 + " " + d3);
        assertTrue(d1 - d0 < 0.01, "continuous approach: " + d1 + " vs " + d0);
    }

    @Test
    void inconsistentUnknownAndNegativeAbsoluteInputsAreOneLineErrors() {
        InputException e1 = assertThrows(InputException.class,
                () -> CaseReader.parse(BODY.replace("0.12 W/(m*K)", "0.12 W/m"), "b.yaml"));
        assertTrue(e1.problem().contains("conductivity has dimension") && e1.problem().contains("expected"), e1.getMessage());
        assertTrue(e1.place().startsWith("7:"), e1.getMessage());
        InputException e2 = assertThrows(InputException.class,
                () -> CaseReader.parse(BODY.replace("0.5 m", "0.5 furlongs"), "b.yaml"));
        assertTrue(e2.problem().contains("unknown unit"), e2.getMessage());
        InputException e3 = assertThrows(InputException.class,
                () -> CaseReader.parse(BODY.replace("30 degC", "-300 degC"), "b.yaml"));
        assertTrue(e3.problem().contains("absolute zero"), e3.getMessage());
        Case c = CaseReader.parse(BODY, "b.yaml");
        InputException e4 = assertThrows(InputException.class, () -> c.parseValue("Ta", "5 m"));
        assertTrue(e4.problem().contains("dimension"), e4.getMessage());
        InputException e5 = assertThrows(InputException.class, () -> c.withParameter("delta", 1.0));
        assertTrue(e5.problem().contains("derived"), e5.getMessage());
        InputException e6 = assertThrows(InputException.class, () -> c.withParameter("Ta", c.parseValue("Ta", "-280")));
        assertTrue(e6.problem().contains("absolute zero"), e6.getMessage());
        assertTrue(e1.getMessage().lines().count() == 1);
    }
}
