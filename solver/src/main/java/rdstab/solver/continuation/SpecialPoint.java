package rdstab.solver.continuation;

import java.util.Map;

/**
 * A located special point of a branch.
 *
 * @param kind          what it is
 * @param row           its row in the branch output
 * @param arclength     arclength s at the point
 * @param parameter     parameter value p at the point
 * @param max           largest nodal value of each field there
 * @param critical      the eigenvalue that crosses (for a fold or stationary crossing, the real one nearest 0;
 *                      for a Hopf point, the member of the pair with Im λ &gt; 0), with its residual
 * @param frequency     for a Hopf point, ω = Im λ (radians per time unit); NaN otherwise
 * @param period        for a Hopf point, 2π/ω; NaN otherwise
 * @param located       true when the root finder bracketed the point and met its tolerance; false when only the
 *                      interval between two steps is known (then the values are those of the step point after it)
 * @param tolerance     the arclength tolerance of the location
 * @param evaluations   corrector solves spent on the location
 * @param direction     for a fold: "turns back" (always); for crossings: "stable to unstable" or "unstable to stable"
 *                      for the crossing eigenvalue as s increases
 */
public record SpecialPoint(SpecialPointKind kind, int row, double arclength, double parameter, Map<String, Double> max,
                           Eigenvalue critical, double frequency, double period, boolean located, double tolerance,
                           int evaluations, String direction) {

    public SpecialPoint {
        max = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(max));
    }
}
