package rdstab.solver.continuation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Brusselator u_t = D u_xx + A − (B+1)u + u²v, v_t = D v_xx + Bu − u²v (Prigogine &amp; Lefever, in Murray,
 * Mathematical Biology) on a slab with zero-flux ends and equal diffusivities, traced in B from below.
 *
 * <p>Reference (REFERENCE-CHECKS.md): the uniform state (A, B/A) loses stability at the Hopf value B = 1 + A² with
 * frequency ω = A. With equal diffusivities the Turing threshold (1 + A)² lies above 1 + A², so the uniform mode
 * crosses first; and the uniform vector is an exact eigenvector of the discrete zero-flux Laplacian (eigenvalue 0),
 * so the discrete threshold equals the continuous one on any grid. Tolerance 1e-7: the location tolerance in
 * arclength is 1e-9 Δs and Re λ changes at rate 1/2 per unit B, so B and ω come out to ~1e-9.
 */
class HopfTest {

    @ParameterizedTest(name = "A = {0}")
    @CsvSource({"2, 3, 7", "1, 1.2, 2.8"})
    void uniformStateLosesStabilityAtTheHopfValueWithFrequencyA(double a, double from, double to) {
        TraceResult r = BranchTracer.trace(TraceCases.brusselator(a, from, 1.0, 1.0, 40),
                TraceOptions.of("B", from, to, 100, Double.NaN), TraceListener.NONE);
        TraceCases.assertEigenResiduals(r);
        assertEquals(1, r.specialPoints().size(), "one special point: " + r.specialPoints());
        SpecialPoint h = TraceCases.only(r, SpecialPointKind.HOPF);
        assertTrue(h.located());
        assertEquals(1 + a * a, h.parameter(), 1e-7, "Hopf value B = 1 + A²");
        assertEquals(a, h.frequency(), 1e-7, "frequency ω = A");
        assertEquals(2 * Math.PI / a, h.period(), 1e-6, "period 2π/ω");
        assertEquals(0.0, h.critical().re(), 1e-8, "the pair is on the imaginary axis");
        assertEquals("stable to unstable", h.direction());
        for (BranchRow row : r.rows()) {
            // the base state is the uniform state (A, B/A) all along
            assertEquals(row.parameter() / a, row.max().get("v"), 1e-8, "v = B/A at row " + row.row());
            if (row.parameter() < h.parameter() - 1e-6) {
                assertEquals("stable", row.stability(), "row " + row.row());
            } else if (row.parameter() > h.parameter() + 1e-6) {
                assertEquals("unstable", row.stability(), "row " + row.row());
                assertTrue(row.frequency() > 0, "oscillatory growth above the Hopf value");
            }
        }
    }
}
