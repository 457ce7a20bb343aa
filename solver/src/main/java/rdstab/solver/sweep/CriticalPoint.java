package rdstab.solver.sweep;

import java.util.List;
import rdstab.solver.drive.CheckResult;

/**
 * Where a case stops being stable along one parameter, as found by {@link CriticalFinder}.
 *
 * @param parameter  the parameter varied
 * @param value      the critical value (midpoint of the final bracket); NaN when kind is NONE
 * @param tolerance  half the width of the final bracket: the true critical value of this
 *                   discretization lies within value ± tolerance (the grid error is not included)
 * @param low        end of the final bracket on the side of FROM
 * @param high       end of the final bracket on the side of TO
 * @param kind       what happens there
 * @param frequency  |Im λ| of the crossing pair (oscillatory crossing), else 0
 * @param atCritical the full check at the critical value (fold: at the last value with a steady
 *                   state; NONE: at TO or the last point reached)
 * @param scan       the coarse scan, in scan order
 * @param checks     how many base states were computed in total
 */
public record CriticalPoint(String parameter, double value, double tolerance, double low, double high, Kind kind,
                            double frequency, CheckResult atCritical, List<ScanPoint> scan, int checks) {

    /** What happens at the critical value. */
    public enum Kind {
        /** The steady state ceases to exist beyond it (a turning point of the steady branch). */
        FOLD("fold"),
        /** A real eigenvalue crosses zero while the steady state continues. */
        REAL_CROSSING("real crossing"),
        /** A complex pair crosses the imaginary axis (onset of oscillation, Hopf) while the state continues. */
        OSCILLATORY_CROSSING("oscillatory crossing"),
        /** Neither happens between FROM and TO (at the scan's resolution). */
        NONE("none in range");

        private final String word;

        Kind(String word) {
            this.word = word;
        }

        /** The word used in reports and JSON. */
        public String word() {
            return word;
        }
    }

    /**
     * One point of the coarse scan.
     *
     * @param value       parameter value
     * @param exists      true when a steady state was found (continued from the previous point)
     * @param growthRate  rightmost Re λ (NaN when no steady state)
     * @param frequency   Im λ of the rightmost eigenvalue (NaN when no steady state)
     */
    public record ScanPoint(double value, boolean exists, double growthRate, double frequency) {
    }
}
