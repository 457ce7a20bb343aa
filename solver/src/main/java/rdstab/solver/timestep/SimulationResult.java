package rdstab.solver.timestep;

import java.util.List;
import rdstab.solver.drive.CheckResult;

/**
 * What a nonlinear disturbance simulation found: one run per amplitude, each with its time history (the data
 * record plots draw from), its measured growth rate beside the linear prediction, and where it ended.
 *
 * @param check              the stability check that gave the base state and the mode
 * @param mode               1-based index of the mode in the check's list (rightmost first)
 * @param linearRate         Re λ of that mode: the linear prediction of the growth rate of ‖u − ū‖
 * @param runawayAbove       the runaway threshold used (any nodal value of any field above it)
 * @param runs               one run per amplitude, in the order given
 * @param departureLimit     relative departure of the measured from the linear rate counted as "nonlinear" (0.1)
 * @param departureAmplitude smallest |amplitude| whose measured rate departs by more than the limit (NaN: none did)
 * @param method             the integrator, its order and error norm, in words
 * @param notes              how the rate was measured and the outcome classified, in words
 * @param cautions           safety cautions
 */
public record SimulationResult(CheckResult check, int mode, double linearRate, double runawayAbove, List<Run> runs,
                               double departureLimit, double departureAmplitude, String method, List<String> notes,
                               List<String> cautions) {

    public SimulationResult {
        runs = List.copyOf(runs);
        notes = List.copyOf(notes);
        cautions = List.copyOf(cautions);
    }

    /** Where a run ended. */
    public enum Outcome {
        /** The disturbance died out: back to the base state. */
        RETURNED("back to the base state"),
        /** It settled on another steady state (‖F‖ small, ‖u − ū‖ not small). */
        OTHER_STEADY_STATE("another steady state"),
        /** A field exceeded the runaway threshold. */
        RUNAWAY("runaway"),
        /** The end time came first: still moving. */
        UNDECIDED("still moving at the end time");

        private final String words;

        Outcome(String words) {
            this.words = words;
        }

        /** Plain words for reports. */
        public String words() {
            return words;
        }
    }

    /**
     * One point of a time history.
     *
     * @param t           time
     * @param distance    ‖u − ū‖_M (lumped energy norm, √(Σ w_i (u_i − ū_i)²))
     * @param maxDistance max over nodes and fields of |u − ū|
     * @param fieldMax    max over nodes of each field
     * @param residual    scaled residual max_i |F_i(u) − F_i(ū)| / w_i (how far from steady)
     */
    public record Sample(double t, double distance, double maxDistance, double[] fieldMax, double residual) {
    }

    /**
     * One run from ū + amplitude·(normalised mode).
     *
     * @param amplitude     signed amplitude (max |initial disturbance|, with the mode's largest entry positive)
     * @param measuredRate  least-squares slope of ln ‖u − ū‖_M over the fit window
     * @param fitEnd        end of the fit window [0, fitEnd]
     * @param fitSamples    samples in the fit
     * @param outcome       where it ended
     * @param endTime       time the run stopped
     * @param runawayTime   time the threshold was exceeded (NaN unless runaway)
     * @param finalMax      max of each field at the end (for another steady state: after a Newton polish)
     * @param finalDistance max |u − ū| at the end
     * @param finalResidual scaled residual at the end (for another steady state: Newton's residual)
     * @param accepted      accepted time steps
     * @param rejected      rejected time steps
     * @param history       the time history, starting at t = 0
     */
    public record Run(double amplitude, double measuredRate, double fitEnd, int fitSamples, Outcome outcome,
                      double endTime, double runawayTime, double[] finalMax, double finalDistance, double finalResidual,
                      int accepted, int rejected, List<Sample> history) {

        public Run {
            history = List.copyOf(history);
        }

        /** |measured − linear| / |linear|. */
        public double departure(double linearRate) {
            return Math.abs(measuredRate - linearRate) / Math.abs(linearRate);
        }
    }
}
