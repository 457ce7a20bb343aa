package rdstab.solver.continuation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import rdstab.solver.model.Case;

/**
 * Restarting a trace from any row of its own output continues the same branch (common practice, no source: the
 * tracer is deterministic given the state, tangent and next step of a row, so the rows after it must repeat).
 * Tolerance 1e-9 on p and on the field maxima: the eigen-solver's start vector may differ between runs, which
 * moves eigenvalues at round-off only; states are recomputed by the same corrector.
 */
class RestartTest {

    static void assertSameRows(List<BranchRow> expected, List<BranchRow> actual) {
        assertEquals(expected.size(), actual.size(), "row count after the restart row");
        for (int i = 0; i < expected.size(); i++) {
            BranchRow e = expected.get(i);
            BranchRow a = actual.get(i);
            assertEquals(e.row(), a.row());
            assertEquals(e.label(), a.label(), "label of row " + e.row());
            assertEquals(e.parameter(), a.parameter(), 1e-9, "p of row " + e.row());
            assertEquals(e.arclength(), a.arclength(), 1e-9, "s of row " + e.row());
            assertEquals(e.max().get("u"), a.max().get("u"), 1e-9, "max u of row " + e.row());
            assertEquals(e.growthRate(), a.growthRate(), 1e-8, "growth rate of row " + e.row());
            assertEquals(e.stability(), a.stability());
        }
    }

    static RestartPoint at(BranchRow row) {
        return new RestartPoint(row.row(), row.step(), row.arclength(), row.point(), row.nextStep(), row.label());
    }

    @Test
    void restartingFromEveryStepRowRepeatsTheRowsAfterIt() {
        Case c = TraceCases.frankKamenetskii("slab", 60, 0.3);
        TraceOptions o = TraceOptions.of("delta", 0.3, 1.0, 40, Double.NaN);
        TraceResult full = BranchTracer.trace(c, o, TraceListener.NONE);
        TraceCases.assertEigenResiduals(full);
        assertEquals(1, full.specialPoints().size());
        int tested = 0;
        for (BranchRow row : full.rows()) {
            if (!row.label().isEmpty() || row.row() % 3 != 1) {
                continue;
            }
            TraceResult again = BranchTracer.resume(c, o, at(row), TraceListener.NONE);
            TraceCases.assertEigenResiduals(again);
            assertSameRows(full.rows().subList(row.row(), full.rows().size()), again.rows());
            tested++;
        }
        assertTrue(tested >= 3, "restarts tested: " + tested);
    }

    @Test
    void restartingFromTheFoldRowContinuesOnTheUpperPart() {
        Case c = TraceCases.frankKamenetskii("slab", 60, 0.3);
        TraceOptions o = TraceOptions.of("delta", 0.3, 1.0, 40, Double.NaN);
        TraceResult full = BranchTracer.trace(c, o, TraceListener.NONE);
        SpecialPoint f = TraceCases.only(full, SpecialPointKind.FOLD);
        TraceResult again = BranchTracer.resume(c, o, at(full.rows().get(f.row())), TraceListener.NONE);
        TraceCases.assertEigenResiduals(again);
        BranchRow last = again.rows().get(again.rows().size() - 1);
        BranchRow lastFull = full.rows().get(full.rows().size() - 1);
        assertEquals(0.3, last.parameter(), 1e-12, "ends on the range end");
        // the same upper state at δ = 0.3 (not the lower one, u(0) ≈ 0.12)
        assertEquals(lastFull.max().get("u"), last.max().get("u"), 1e-7);
        assertTrue(last.max().get("u") > 3, "upper branch");
        for (BranchRow row : again.rows().subList(1, again.rows().size())) {
            assertEquals("unstable", row.stability());
        }
    }
}
