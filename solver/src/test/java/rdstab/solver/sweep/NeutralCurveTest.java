package rdstab.solver.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import rdstab.solver.model.Case;

/**
 * A two-parameter sweep (Biot number × δ) of the slab with a convective surface, run through the
 * sweep runner, and its neutral curve: the critical δ must rise with Bi and match the closed form
 * of {@link CriticalFinderTest#closedFormCritical} within the grid spacing.
 */
class NeutralCurveTest {

    @Test
    void criticalDeltaOfTheSweepIsMonotoneInBiotNumberAndMatchesTheClosedForm() throws Exception {
        Case c = CriticalFinderTest.fk("slab", 50, true);
        SweepGrid grid = new SweepGrid(List.of(Axis.parse("Bi=0.5:1000:6:log"), Axis.parse("delta=0.1:0.9:17")), 3);
        int n = grid.points();
        PointStatus[] status = new PointStatus[n];
        double[] growth = new double[n];
        double[] freq = new double[n];
        Arrays.fill(growth, Double.NaN);
        SweepRunner.run(c, grid, grid.chainsOf(Shard.ALL), p -> null, 2, o -> {
            status[o.point()] = o.status();
            if (o.result() != null) {
                growth[o.point()] = o.result().assessment().growthRate();
                freq[o.point()] = o.result().modes().get(0).im();
                assertTrue(o.result().modes().get(0).residual() < 1e-8, "eigenpair residual");
            }
        });
        List<NeutralCurve.Entry> curve = NeutralCurve.compute(grid, status, growth, freq);
        assertEquals(6, curve.size());
        double prev = 0;
        for (NeutralCurve.Entry e : curve) {
            assertEquals("fold", e.kind(), "Bi = " + e.first());
            assertTrue(e.value() >= prev, "critical delta monotone in Bi: " + curve);
            prev = e.value();
            // closed form (Frank-Kamenetskii family, see CriticalFinderTest); error: half the delta spacing (0.025)
            // plus the 50-cell grid error (< 1e-4)
            assertEquals(CriticalFinderTest.closedFormCritical(e.first()), e.value(), 0.025 + 1e-4, "Bi = " + e.first());
            assertTrue(e.low() < CriticalFinderTest.closedFormCritical(e.first()) + 1e-4
                    && CriticalFinderTest.closedFormCritical(e.first()) < e.high() + 1e-4, "bracket holds the closed form");
        }
        assertTrue(curve.get(5).value() > curve.get(0).value() + 0.3, "a real rise, from ~0.2 to ~0.88");
    }
}
