package rdstab.solver.pattern;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.drive.StabilityCheck;
import rdstab.solver.eigen.EigenPair;

/**
 * Brusselator u_t = Du u_xx + A − (B+1)u + u²v, v_t = Dv v_xx + Bu − u²v (Prigogine &amp; Lefever; Murray,
 * Mathematical Biology; values as in REFERENCE-CHECKS.md): uniform state (A, B/A); Hopf threshold
 * B_H = 1 + A² with frequency A; Turing threshold B_T = (1 + A√(Du/Dv))², k_c² = A/√(Du·Dv). Example
 * A = 2, Du = 1, Dv = 8: B_T = 2.9142136, k_c² = 0.7071068, B_H = 5.
 */
class BrusselatorTest {

    static String brusselator(double a, double b, double du, double dv, double length, int cells) {
        return "title: Brusselator\ngeometry: {shape: slab, from: 0, to: " + length + "}\nmesh: {cells: " + cells + "}\n"
                + "parameters: {A: " + a + ", B: " + b + ", Du: " + du + ", Dv: " + dv + "}\n"
                + "fields:\n  - name: u\n    diffusivity: Du\n    source: A - (B + 1)*u + u^2*v\n    initial: A\n"
                + "  - name: v\n    diffusivity: Dv\n    source: B*u - u^2*v\n    initial: B/A\n"
                + "boundaries:\n  left: {u: insulated, v: insulated}\n  right: {u: insulated, v: insulated}\n";
    }

    static CheckResult run(String text) {
        CheckResult r = StabilityCheck.run(CaseReader.parse(text, "brusselator.yaml"));
        for (EigenPair e : r.modes()) {
            assertTrue(e.residual() < 1e-10, "eigenpair residual " + e.residual());
        }
        return r;
    }

    /** The reaction Jacobian at (A, B/A): [[B − 1, A²], [−B, −A²]] (analytic). */
    static double[][] jacobian(double a, double b) {
        return new double[][] {{b - 1, a * a}, {-b, -a * a}};
    }

    @Test
    void turingThresholdAndCriticalWavenumber() {
        double a = 2;
        double[] d = {1, 8};
        double bt = 2.9142136;
        double[] below = DispersionRelation.fastest(jacobian(a, bt * (1 - 1e-5)), d, 5);
        double[] above = DispersionRelation.fastest(jacobian(a, bt * (1 + 1e-5)), d, 5);
        assertTrue(below[1] < 0 && above[1] > 0, "growth changes sign at B_T: " + below[1] + ", " + above[1]);
        assertEquals(0.7071068, above[0] * above[0], 2e-3, "k_c² at the threshold");
        double[] at = DispersionRelation.fastest(jacobian(a, bt), d, 5);
        assertEquals(0.0, at[1], 1e-7, "neutral at B_T");
        assertEquals(0.7071068, at[0] * at[0], 1e-4, "k_c²");
    }

    @Test
    void hopfThresholdOfTheUniformMode() {
        double a = 2;
        double[] d = {1, 8};
        double[] atHopf = DispersionRelation.rightmost(jacobian(a, 5), d, 0);
        assertEquals(0.0, atHopf[0], 1e-12, "B_H = 1 + A² = 5: Re λ(0) = 0");
        assertEquals(a, atHopf[1], 1e-12, "frequency A");
        assertTrue(DispersionRelation.rightmost(jacobian(a, 4.99), d, 0)[0] < 0);
        assertTrue(DispersionRelation.rightmost(jacobian(a, 5.01), d, 0)[0] > 0);
    }

    /**
     * On (0, 20) with zero-flux ends the admitted wavenumbers are nπ/20; at B = 3.2 the discrete spectrum's
     * rightmost eigenvalue equals λ(k_n) at the leading admitted n to O(h²): the finite-volume Neumann
     * Laplacian has eigenvalues (2/h)² sin²(kh/2) = k²(1 − (kh)²/12 + ...) (analytic).
     */
    @Test
    void discreteSpectrumMatchesTheDispersionRelationAtAdmittedWavenumbers() {
        double[] err = new double[2];
        for (int g = 0; g < 2; g++) {
            CheckResult r = run(brusselator(2, 3.2, 1, 8, 20, 100 * (g + 1)));
            DispersionRelation.Result d = r.dispersion();
            assertTrue(d.applies(), d.reason());
            assertEquals("stationary pattern (Turing type)", d.kind());
            assertEquals(5, d.leadingMode().n(), "k = 5π/20 = 0.785 is the admitted wavenumber nearest k_c = 0.86");
            // the base state is the uniform (A, B/A)
            assertEquals(2.0, r.baseMax().get("u"), 1e-12);
            assertEquals(1.6, r.baseMax().get("v"), 1e-12);
            err[g] = Math.abs(r.modes().get(0).re() - d.leadingMode().re());
            assertEquals(0.0, r.modes().get(0).im(), 0.0);
        }
        assertTrue(err[1] < 3e-4, "grid 200: " + err[1]);
        assertEquals(2.0, Math.log(err[0] / err[1]) / Math.log(2), 0.1, "observed order");
    }

    @Test
    void equalDiffusionAboveHopfIsAUniformOscillation() {
        CheckResult r = run(brusselator(2, 5.5, 1, 1, 10, 60));
        DispersionRelation.Result d = r.dispersion();
        assertEquals("uniform oscillation (Hopf type)", d.kind());
        assertEquals(0, d.leadingMode().n());
        // uniform mode: λ = (B − 1 − A²)/2 ± i √(A² − ((B − 1 − A²)/2)²) = 0.25 ± i 1.984313 (analytic)
        assertEquals(0.25, r.modes().get(0).re(), 1e-9);
        assertEquals(Math.sqrt(4 - 0.0625), Math.abs(r.modes().get(0).im()), 1e-9);
    }

    @Test
    void nonUniformBaseStateIsDetected() {
        String text = brusselator(2, 2.0, 1, 8, 5, 50).replace("left: {u: insulated, v: insulated}",
                "left: {u: {fixed: 1}, v: insulated}");
        CheckResult r = StabilityCheck.run(CaseReader.parse(text, "b.yaml"));
        assertTrue(!r.dispersion().applies(), "fixed u = 1 ≠ A at one end");
    }
}
