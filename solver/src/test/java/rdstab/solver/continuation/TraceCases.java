package rdstab.solver.continuation;

import static org.junit.jupiter.api.Assertions.assertTrue;

import rdstab.solver.casefile.CaseReader;
import rdstab.solver.model.Case;

/** Case texts and shared checks for the continuation tests. */
final class TraceCases {

    /**
     * Eigenpair residual limit asserted on every row: the case default (1e-8) is the reporting limit; the pairs here
     * come out near 1e-15, so 1e-10 leaves round-off room and still fails on any wrong pair.
     */
    static final double EIGEN_RESIDUAL = 1e-10;

    private TraceCases() {
    }

    /** Frank-Kamenetskii: u'' + (j/r) u' + δ e^u = 0, u'(0) = 0, u(1) = 0. */
    static Case frankKamenetskii(String shape, int cells, double delta) {
        String bc = shape.equals("slab") ? "  left:\n    u: insulated\n  right:\n" : "  outer:\n";
        return CaseReader.parse("title: FK " + shape + "\n"
                + "geometry: {shape: " + shape + ", from: 0, to: 1}\n"
                + "mesh: {cells: " + cells + "}\n"
                + "parameters: {delta: " + delta + "}\n"
                + "fields:\n  - name: u\n    diffusivity: 1\n    source: delta*exp(u)\n    initial: 0\n"
                + "boundaries:\n" + bc + "    u: {fixed: 0}\n", "fk.yaml");
    }

    /** Brusselator on a slab (0, L) with zero-flux ends and equal diffusivities D. */
    static Case brusselator(double a, double b, double d, double length, int cells) {
        return CaseReader.parse("title: Brusselator\n"
                + "geometry: {shape: slab, from: 0, to: " + length + "}\n"
                + "mesh: {cells: " + cells + "}\n"
                + "parameters: {A: " + a + ", B: " + b + ", D: " + d + "}\n"
                + "fields:\n  - name: u\n    diffusivity: D\n    source: A - (B+1)*u + u^2*v\n    initial: A\n"
                + "  - name: v\n    diffusivity: D\n    source: B*u - u^2*v\n    initial: B/A\n"
                + "boundaries:\n  left:\n    u: insulated\n    v: insulated\n  right:\n    u: insulated\n    v: insulated\n",
                "brusselator.yaml");
    }

    /** Asserts the residual of every eigenpair of every row. */
    static void assertEigenResiduals(TraceResult r) {
        for (BranchRow row : r.rows()) {
            assertTrue(!row.eigenvalues().isEmpty(), "row " + row.row() + " has eigenvalues");
            for (Eigenvalue e : row.eigenvalues()) {
                assertTrue(e.residual() <= EIGEN_RESIDUAL, "row " + row.row() + ": eigenpair residual " + e.residual());
            }
        }
        for (SpecialPoint sp : r.specialPoints()) {
            assertTrue(sp.critical().residual() <= EIGEN_RESIDUAL, sp.kind() + ": residual " + sp.critical().residual());
        }
    }

    /** The single special point of a kind (fails when there is not exactly one). */
    static SpecialPoint only(TraceResult r, SpecialPointKind kind) {
        SpecialPoint found = null;
        int count = 0;
        for (SpecialPoint sp : r.specialPoints()) {
            if (sp.kind() == kind) {
                found = sp;
                count++;
            }
        }
        assertTrue(count == 1, "expected one " + kind.word() + ", found " + count + " in " + r.specialPoints());
        return found;
    }
}
