package rdstab.solver.sweep;

import rdstab.solver.drive.CheckResult;
import rdstab.solver.model.Case;

/**
 * The outcome at one sweep point.
 *
 * @param point            point number (see {@link SweepGrid})
 * @param values           the varied parameter values, one per axis
 * @param theCase          the case at this point (all parameters), or null when it could not be built
 * @param status           what happened
 * @param result           the check result when status is OK, else null
 * @param newtonIterations Newton steps of the base state (also on failure, when known; −1 when not)
 * @param newtonResidual   final scaled Newton residual (NaN when not known)
 * @param message          why the point failed ("" when OK)
 */
public record PointOutcome(int point, double[] values, Case theCase, PointStatus status, CheckResult result,
                           int newtonIterations, double newtonResidual, String message) {
}
