package rdstab.solver.continuation;

import java.util.List;
import rdstab.solver.model.Case;

/**
 * A traced branch with its special points and evidence; everything a report or a plot needs.
 *
 * @param theCase        the case (at its own parameter values; the traced one varies along the rows)
 * @param options        the trace settings
 * @param rows           the rows in arclength order (step points and located special points)
 * @param specialPoints  the special points, in arclength order
 * @param steps          accepted continuation steps
 * @param rejected       rejected steps (retried shorter)
 * @param stopReason     why the trace ended, in plain words
 * @param warnings       things the user should know (e.g. unlocated special points)
 * @param cautions       the standard safety cautions
 */
public record TraceResult(Case theCase, TraceOptions options, List<BranchRow> rows, List<SpecialPoint> specialPoints,
                          int steps, int rejected, String stopReason, List<String> warnings, List<String> cautions) {

    public TraceResult {
        rows = List.copyOf(rows);
        specialPoints = List.copyOf(specialPoints);
        warnings = List.copyOf(warnings);
        cautions = List.copyOf(cautions);
    }
}
