package rdstab.solver.drive;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import rdstab.solver.assess.Verdict;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.eigen.EigenPair;

/**
 * Convection-dominated transport through the whole check: u_t = u_xx/Pe − u_x + k u on (0, 1), u = 0 at both ends.
 *
 * <p>Reference: the substitution u = e^{Pe x/2} w turns the operator into w_xx/Pe − (Pe/4 − k) w, so the
 * eigenvalues are λ_n = k − Pe/4 − n²π²/Pe (separation of variables; common practice, no source). The
 * eigenfunctions e^{Pe x/2} sin(nπx) make the operator strongly non-normal: at Pe = 200 the eigenvalue
 * condition number is near e^{100}, and an eigen-solver working in the original coordinates returned
 * −19.9 with spurious complex pairs for an operator of this kind whose eigenvalues are real.
 */
class ConvectionDominatedTest {

    static final double PE = 200;
    static final double K = 40;

    static String caseText(int cells) {
        return "title: convection-diffusion with a linear source\n"
                + "geometry: {shape: slab, from: 0, to: 1}\n"
                + "mesh: {cells: " + cells + "}\n"
                + "parameters: {Pe: " + PE + ", k: " + K + "}\n"
                + "fields:\n  - name: u\n    diffusivity: 1/Pe\n    drift: 1\n    source: k*u\n    initial: 0\n"
                + "boundaries:\n  left:\n    u: {fixed: 0}\n  right:\n    u: {fixed: 0}\n";
    }

    static CheckResult check(int cells) {
        return StabilityCheck.run(CaseReader.parse(caseText(cells), "cd.yaml"));
    }

    static double exact(int n) {
        return K - PE / 4 - n * n * Math.PI * Math.PI / PE;
    }

    @Test
    void eigenvaluesConvergeToTheClosedFormAtPecletTwoHundred() {
        double[] g = new double[3];
        double[] second = new double[3];
        int[] cells = {400, 800, 1600};
        for (int i = 0; i < 3; i++) {
            CheckResult r = check(cells[i]);
            EigenPair lead = r.modes().get(0);
            assertEquals(0.0, lead.im(), 0.0, "the spectrum is real");
            assertTrue(r.conditioning().get(0).errorEstimate() < 1e-8, "error estimate " + r.conditioning().get(0).errorEstimate());
            assertTrue(r.conditioning().get(0).sensitivity() > 1e20, "sensitivity " + r.conditioning().get(0).sensitivity());
            assertEquals(Verdict.STABLE, r.assessment().verdict());
            assertTrue(r.assessment().warnings().stream().anyMatch(w -> w.contains("very sensitive")), r.assessment().warnings().toString());
            g[i] = lead.re();
            second[i] = r.modes().get(1).re();
        }
        double p = Math.log(Math.abs((g[0] - g[1]) / (g[1] - g[2]))) / Math.log(2);
        assertEquals(2.0, p, 0.1, "observed order of the leading eigenvalue");
        double extrapolated = g[2] + (g[2] - g[1]) / 3.0;
        assertEquals(exact(1), extrapolated, 1e-4 * Math.abs(exact(1)), "Richardson value of λ1");
        assertEquals(exact(2), second[2] + (second[2] - second[1]) / 3.0, 1e-4 * Math.abs(exact(2)), "Richardson value of λ2");
    }
}
