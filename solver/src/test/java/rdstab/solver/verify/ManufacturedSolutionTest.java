package rdstab.solver.verify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.function.DoubleUnaryOperator;
import org.junit.jupiter.api.Test;
import rdstab.mesh.assembly.Discretization;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.model.Case;
import rdstab.solver.newton.BaseState;
import rdstab.solver.newton.DampedNewton;
import rdstab.solver.setup.Problem;
import rdstab.solver.setup.ProblemBuilder;

/**
 * Method of manufactured solutions (Roache, Verification and Validation in Computational Science and Engineering;
 * Salari &amp; Knupp, Sandia report 2000-1444) through the whole case-file path: the manufactured forcing is written
 * in the case's source formula, read by CaseReader, built by ProblemBuilder and solved by DampedNewton; the error
 * against the exact solution at the nodes must fall at the scheme's order 2 (± 0.1).
 *
 * <p>Every source carries a nonlinear term, e^{u*(x)} − e^u, which vanishes at the exact solution, so Newton has
 * real work to do and the Jacobian enters (with this sign the term damps, so the problem stays far from a fold).
 */
class ManufacturedSolutionTest {

    static double maxError(String yaml, int cells, DoubleUnaryOperator exact) {
        Case c = CaseReader.parse(yaml.replace("CELLS", Integer.toString(cells)), "mms.yaml");
        Problem p = ProblemBuilder.build(c);
        BaseState s = new DampedNewton(1e-12, 60).solve(p.full(), p.initial());
        Discretization d = p.full();
        double[][] u = d.nodalValues(s.u());
        double e = 0;
        for (int i = 0; i < d.nodes(); i++) {
            e = Math.max(e, Math.abs(u[0][i] - exact.applyAsDouble(d.coordinate(i, 0))));
        }
        return e;
    }

    /** Errors on 20, 40, 80, 160 cells; the observed order of each halving must be 2 ± 0.1. */
    static void assertOrderTwo(String yaml, DoubleUnaryOperator exact) {
        double prev = Double.NaN;
        for (int n = 20; n <= 160; n *= 2) {
            double e = maxError(yaml, n, exact);
            assertTrue(e < 0.1, "error " + e + " on " + n + " cells: the manufactured solution was not recovered");
            if (!Double.isNaN(prev)) {
                double p = Math.log(prev / e) / Math.log(2);
                assertEquals(2.0, p, 0.1, "observed order between " + n / 2 + " and " + n + " cells");
            }
            prev = e;
        }
    }

    @Test
    void slabWithInsulatedCentreAndFixedSurface() {
        // u* = cos(πx/2): u*'(0) = 0, u*(1) = 0; −u*'' = (π²/4) cos(πx/2)
        String yaml = String.join("\n", "title: mms slab", "geometry: {shape: slab, from: 0, to: 1}", "mesh: {cells: CELLS}",
                "fields:", "  - name: u", "    diffusivity: 1",
                "    source: exp(cos(pi*x/2)) - exp(u) + pi^2/4*cos(pi*x/2)", "    initial: 0", "boundaries:",
                "  left: {u: insulated}", "  right: {u: {fixed: 0}}", "");
        assertOrderTwo(yaml, x -> Math.cos(Math.PI * x / 2));
    }

    @Test
    void slabWithTwoFixedEndsAndVariableDiffusivity() {
        // u* = 1 + sin(πx) on [0, 1] with k = 1 + x: −(k u*')' = −π cos(πx) + π²(1 + x) sin(πx)
        String yaml = String.join("\n", "title: mms slab k(x)", "geometry: {shape: slab, from: 0, to: 1}",
                "mesh: {cells: CELLS}", "fields:", "  - name: u", "    diffusivity: 1 + x",
                "    source: exp(1 + sin(pi*x)) - exp(u) - pi*cos(pi*x) + pi^2*(1 + x)*sin(pi*x)", "    initial: 1",
                "boundaries:", "  left: {u: {fixed: 1}}", "  right: {u: {fixed: 1}}", "");
        assertOrderTwo(yaml, x -> 1 + Math.sin(Math.PI * x));
    }

    @Test
    void solidCylinderWithFixedSurface() {
        // u* = 1 − r⁴: (1/r)(r u*')' = −16 r², u*(1) = 0
        String yaml = String.join("\n", "title: mms cylinder", "geometry: {shape: cylinder, from: 0, to: 1}",
                "mesh: {cells: CELLS}", "fields:", "  - name: u", "    diffusivity: 1",
                "    source: exp(1 - r^4) - exp(u) + 16*r^2", "    initial: 0", "boundaries:", "  outer: {u: {fixed: 0}}", "");
        assertOrderTwo(yaml, r -> 1 - Math.pow(r, 4));
    }

    @Test
    void solidSphereWithConvectiveSurface() {
        // u* = 1 − r⁴: (1/r²)(r² u*')' = −20 r²; at r = 1: −u*' = 4 = h (u* − ambient) = 2 (0 − (−2))
        String yaml = String.join("\n", "title: mms sphere", "geometry: {shape: sphere, from: 0, to: 1}",
                "mesh: {cells: CELLS}", "fields:", "  - name: u", "    diffusivity: 1",
                "    source: exp(1 - r^4) - exp(u) + 20*r^2", "    initial: 0", "boundaries:",
                "  outer: {u: {convective: {h: 2, ambient: -2}}}", "");
        assertOrderTwo(yaml, r -> 1 - Math.pow(r, 4));
    }
}
