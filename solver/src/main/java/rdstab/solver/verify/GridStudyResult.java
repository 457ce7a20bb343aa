package rdstab.solver.verify;

import java.util.List;
import java.util.Map;
import rdstab.solver.drive.CheckResult;

/**
 * What a grid-convergence study found: every level's full check, the rightmost eigenvalues followed across
 * levels by mode overlap, the base-state maxima, and the Richardson/GCI estimate of each. Immutable; the
 * data records here are also what plots draw from (one point per level and quantity).
 *
 * @param levels     the levels, coarsest first
 * @param reported   index of the level whose values are reported as "the" answer (the finest for a study, the
 *                   requested grid for a verified check)
 * @param tracked    rightmost eigenvalues of the finest level, each followed across levels (first = growth rate)
 * @param baseMax    per field: the base-state maximum on each level and its estimate
 * @param growthBand error band of the reported growth rate: the GCI of the reported level plus that level's own
 *                   eigenvalue band (marginal band or eigenvalue error, whichever is larger)
 * @param resolved   true when |reported growth rate| &gt; growthBand: the grid error cannot flip the verdict
 * @param warnings   findings that qualify the study (poor mode matches, orders outside the band, ...)
 */
public record GridStudyResult(List<Level> levels, int reported, List<Tracked> tracked, Map<String, Quantity> baseMax,
                              double growthBand, boolean resolved, List<String> warnings) {

    public GridStudyResult {
        levels = List.copyOf(levels);
        tracked = List.copyOf(tracked);
        baseMax = Map.copyOf(baseMax);
        warnings = List.copyOf(warnings);
    }

    /**
     * One grid level.
     *
     * @param cells     cells along the coordinate
     * @param unknowns  unknowns of the discretization
     * @param check     the full stability check on this level (base state, modes with residuals, assessment)
     */
    public record Level(int cells, int unknowns, CheckResult check) {
    }

    /**
     * One eigenvalue of the finest level followed across the levels.
     *
     * @param re        Re λ on each level (coarsest first), the coarse values taken from the mode of largest overlap
     * @param im        |Im λ| on each level
     * @param overlap   the normalised overlap of the matched mode with the finest mode on each level (1 on the finest)
     * @param residual  eigenpair residual of the matched mode on each level
     * @param orders    observed order of each consecutive triple of levels (NaN when undefined), coarsest triple first
     * @param estimate  Richardson/GCI estimate of Re λ from the three finest levels
     */
    public record Tracked(double[] re, double[] im, double[] overlap, double[] residual, double[] orders,
                          RichardsonEstimate estimate) {
    }

    /**
     * A scalar followed across levels.
     *
     * @param values    value on each level, coarsest first
     * @param orders    observed order of each consecutive triple (NaN when undefined)
     * @param estimate  Richardson/GCI estimate from the three finest levels
     */
    public record Quantity(double[] values, double[] orders, RichardsonEstimate estimate) {
    }

    /** The reported level's check. */
    public CheckResult reportedCheck() {
        return levels.get(reported).check();
    }

    /** Re λ of the first tracked mode on the reported level. */
    public double growthRate() {
        return tracked.get(0).re()[reported];
    }
}
