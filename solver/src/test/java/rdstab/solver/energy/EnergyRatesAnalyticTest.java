package rdstab.solver.energy;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.drive.StabilityCheck;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.energy.EnergyRates;

/**
 * The three rates (spectral abscissa, numerical abscissa, a-priori bound) against analytic values,
 * through the whole check (case text → base state → J, M, T → rates).
 */
class EnergyRatesAnalyticTest {

    static CheckResult run(String text) {
        CheckResult r = StabilityCheck.run(CaseReader.parse(text, "test.yaml"));
        for (EigenPair e : r.modes()) {
            assertTrue(e.residual() < 1e-10, "eigenpair residual " + e.residual());
        }
        return r;
    }

    static String slab(double length, int cells, String params, String diff, String drift, String source,
                       String left, String right) {
        return "title: t\ngeometry: {shape: slab, from: 0, to: " + length + "}\nmesh: {cells: " + cells + "}\n"
                + "parameters: {" + params + "}\nfields:\n  - name: u\n    diffusivity: " + diff + "\n"
                + (drift == null ? "" : "    drift: " + drift + "\n") + "    source: " + source + "\n"
                + "boundaries:\n  left: {u: " + left + "}\n  right: {u: " + right + "}\n";
    }

    /**
     * Heat equation u_t = α u_xx on (0, L), u = 0 at both ends, no source: σ₁ = −απ²/L² (separation of
     * variables), and the classical energy argument ½ d/dt ‖u‖² = −α‖u_x‖² ≤ −απ²/L² ‖u‖² is sharp, so the
     * numerical abscissa and the a-priori bound (μ₁ = απ²/L², ρ = 0) equal it too; the discrete values
     * approach it at order 2.
     */
    @Test
    void heatEquationAllThreeRatesEqualMinusAlphaPiSquaredOverLSquared() {
        double alpha = 0.5;
        double length = 2.0;
        double exact = -alpha * Math.PI * Math.PI / (length * length);
        double[] err = new double[2];
        for (int g = 0; g < 2; g++) {
            CheckResult r = run(slab(length, 100 * (g + 1), "alpha: " + alpha, "alpha", null, "0", "{fixed: 0}", "{fixed: 0}"));
            EnergyRates e = r.energy();
            double s = r.assessment().growthRate();
            assertEquals(s, e.numericalAbscissa(), 1e-10 * Math.abs(s), "self-adjoint: numerical = spectral abscissa");
            assertEquals(s, e.bound(), 1e-10 * Math.abs(s), "no source: bound = −μ₁ = spectral abscissa");
            assertEquals(0.0, e.reactionRate(), 0.0);
            assertEquals(-exact, e.analyticPoincare(), 1e-12, "analytic μ₁ = απ²/L² (ζ₁ = π)");
            err[g] = Math.abs(s - exact);
            assertTrue(err[g] < 1e-4 * Math.abs(exact), "rate " + s + " vs " + exact);
        }
        double order = Math.log(err[0] / err[1]) / Math.log(2);
        assertEquals(2.0, order, 0.05, "observed order");
    }

    /**
     * A self-adjoint reacting case (Frank-Kamenetskii slab, δ = 0.5, insulated centre, fixed surface): one
     * field without drift, so J is symmetric and the numerical abscissa equals the spectral abscissa to
     * solver tolerance (Rayleigh quotient = largest eigenvalue, common practice); both lie below the a-priori
     * bound −μ₁ + max δe^ū, which is strict because the mode is not constant where δe^ū peaks. The spectral
     * abscissa itself is −1.8020144 (REFERENCE-CHECKS, closed form) to O(h²).
     */
    @Test
    void selfAdjointReactingCaseNumericalEqualsSpectralBelowTheBound() {
        CheckResult r = run(slab(1, 200, "delta: 0.5", "1", null, "delta*exp(u)", "insulated", "{fixed: 0}"));
        EnergyRates e = r.energy();
        double s = r.assessment().growthRate();
        assertTrue(e.selfAdjoint());
        assertEquals(s, e.numericalAbscissa(), 1e-10 * Math.abs(s));
        assertTrue(e.bound() > s + 0.01, "bound " + e.bound() + " above " + s);
        assertEquals(-1.8020144, s, 1e-4);
        // fixed-insulated slab: ζ₁ = π/2, μ₁ = π²/4 (analytic)
        assertEquals(Math.PI * Math.PI / 4, e.analyticPoincare(), 1e-12);
        assertEquals(e.analyticPoincare(), e.poincare(), 1e-4 * e.poincare());
        assertEquals(1.0, e.peakAmplification(), 0.0, "self-adjoint and decaying: energy never grows");
    }

    /**
     * Convection–diffusion u_t = D u_xx − c u_x on (0, L), u = 0 at both ends: σ_n = −D(nπ/L)² − c²/(4D)
     * (substitution u = e^{cx/(2D)} w, REFERENCE-CHECKS), energy rate −Dπ²/L² (the drift term is
     * skew-adjoint with zero end values). The energy rate lies above the spectral abscissa by c²/(4D):
     * the operator is not normal; here the energy still decays from the start.
     */
    @Test
    void convectionDiffusionSpectrumAndEnergyRate() {
        double d = 0.1;
        double c = 1.0;
        CheckResult r = run(slab(1, 400, "D: " + d + ", c: " + c, "D", "c", "0", "{fixed: 0}", "{fixed: 0}"));
        for (int n = 1; n <= 4; n++) {
            double exact = -d * n * n * Math.PI * Math.PI - c * c / (4 * d);
            assertEquals(exact, r.modes().get(n - 1).re(), 2e-4 * Math.abs(exact), "σ_" + n);
            assertEquals(0.0, r.modes().get(n - 1).im(), 1e-8);
        }
        EnergyRates e = r.energy();
        assertEquals(-d * Math.PI * Math.PI, e.numericalAbscissa(), 1e-4 * d * Math.PI * Math.PI);
        assertTrue(e.numericalAbscissa() > r.assessment().growthRate() + 2.4, "gap c²/4D = 2.5");
        assertTrue(e.numericalAbscissa() <= e.bound() + 1e-12);
        assertTrue(r.assessment().energyVerdict().startsWith("energy-stable"), r.assessment().energyVerdict());
        assertTrue(Double.isNaN(e.analyticPoincare()), "drift: no closed-form μ₁");
    }

    /**
     * The same with a growth term a·u, Dπ² &lt; a &lt; Dπ² + c²/(4D): every σ_n + a &lt; 0 (modally stable) while
     * the energy rate −Dπ² + a &gt; 0 (analytic, as above). The tool flags transient growth and finds a peak
     * amplification &gt; 1, below the energy-method ceiling e^{ω t_peak}.
     */
    @Test
    void convectionDiffusionWithGrowthFlagsTransientGrowth() {
        double d = 0.1;
        double a = 2.0;
        CheckResult r = run(slab(1, 200, "D: 0.1, c: 1, a: 2", "D", "c", "a*u", "{fixed: 0}", "{fixed: 0}"));
        double s = r.assessment().growthRate();
        assertEquals(-d * Math.PI * Math.PI - 2.5 + a, s, 1e-3);
        EnergyRates e = r.energy();
        assertEquals(-d * Math.PI * Math.PI + a, e.numericalAbscissa(), 1e-3);
        assertEquals("modally stable, transient growth possible", r.assessment().energyVerdict());
        assertTrue(e.peakAmplification() > 1.05, "peak " + e.peakAmplification());
        assertTrue(e.peakAmplification() <= Math.exp(e.numericalAbscissa() * e.peakTime()) * (1 + 1e-9),
                "peak within the energy ceiling e^{ωt}");
        assertTrue(r.assessment().warnings().stream().anyMatch(w -> w.contains("transient growth")));
    }
}
