package rdstab.cli.command;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import rdstab.solver.sweep.NeutralCurve;
import rdstab.solver.sweep.SweepGrid;

/** Prints a neutral curve as a short table. */
final class NeutralCurveReport {

    private NeutralCurveReport() {
    }

    static void print(PrintWriter w, SweepGrid grid, List<NeutralCurve.Entry> curve, Path file) {
        String a = grid.axes().get(0).name();
        String b = grid.axes().get(1).name();
        w.println();
        w.printf("Neutral curve: critical %s for each %s (written to %s)%n", b, a, file);
        w.printf(Locale.ROOT, "  %14s  %14s  %-20s  %s%n", a, b + " critical", "kind", "between grid values");
        for (NeutralCurve.Entry e : curve) {
            w.printf(Locale.ROOT, "  %14.6g  %14s  %-20s  %s%n", e.first(),
                    Double.isFinite(e.value()) ? String.format(Locale.ROOT, "%.6g", e.value()) : "-", e.kind(),
                    Double.isFinite(e.low()) ? String.format(Locale.ROOT, "%.6g .. %.6g", e.low(), e.high()) : "");
        }
        w.println("  Crossings are interpolated linearly in the growth rate (error O(spacing^2)); folds are placed midway "
                + "between the last grid value with a steady state and the first without (error at most half the spacing). "
                + "For a sharper value run 'rdstab critical' at that " + a + ".");
    }
}
