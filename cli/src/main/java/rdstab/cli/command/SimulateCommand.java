package rdstab.cli.command;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import rdstab.cli.output.AtomicFiles;
import rdstab.cli.plot.SimulatePlots;
import rdstab.cli.report.ResultJson;
import rdstab.cli.report.SimulationReport;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.drive.StabilityCheck;
import rdstab.solver.error.InputException;
import rdstab.solver.model.Case;
import rdstab.solver.timestep.DisturbanceSimulation;
import rdstab.solver.timestep.SimulationResult;

/** rdstab simulate: nonlinear time integration from base state + a mode, against the linear prediction. */
@Command(name = "simulate", mixinStandardHelpOptions = true,
        description = {
            "Check the linear prediction against the full nonlinear equations: start from the base state plus A times "
                + "a mode (real part, scaled so its largest value is 1), integrate M du/dt = F(u) in time with an "
                + "error-controlled stiff integrator (ROS2 Rosenbrock, order 2), measure the growth rate of the "
                + "disturbance and compare it with Re λ of the mode. Reports where each run ends: back to the base "
                + "state, another steady state, or runaway.",
            "",
            "Examples:",
            "  rdstab simulate cases/rod-upper-branch.yaml",
            "  rdstab simulate cases/rod-upper-branch.yaml --amplitudes 1e-4,1e-2,0.1,-0.1,0.5 --out runs.csv",
            "  rdstab simulate cases/slab-self-heating.yaml --mode 2 --amplitude 0.01 --time 5 --json",
            "  rdstab simulate cases/rod-upper-branch.yaml --amplitudes 1e-4,0.01,-0.1 \\",
            "      --plots pics"},
        footer = {"", "Exit status: 0 completed (any outcome), 2 bad input, 3 numerical failure, 4 file error."})
public final class SimulateCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    CaseOptions caseOptions;

    @Option(names = "--mode", paramLabel = "J", defaultValue = "1", description = "Which mode, 1 = rightmost (default 1).")
    int mode;

    @Option(names = "--amplitude", paramLabel = "A",
            description = "Amplitude of the initial disturbance in the field's units; the sign matters (default 1e-3).")
    Double amplitude;

    @Option(names = "--amplitudes", paramLabel = "A1,A2,...", split = ",",
            description = "Several amplitudes, one run each; reports the smallest at which the measured rate departs from "
                    + "the linear one by more than 10%%.")
    List<Double> amplitudes;

    @Option(names = "--time", paramLabel = "T",
            description = "End time (default (|ln|A|| + 30)/|Re λ|; runs stop earlier on runaway or once steady).")
    Double time;

    @Option(names = "--runaway-above", paramLabel = "U",
            description = "A run is a runaway when any field exceeds U (default 10 times max(base-state maximum, 1)).")
    Double runawayAbove;

    @Option(names = "--tolerance", paramLabel = "RTOL", description = "Relative tolerance of the time integrator (default 1e-5).")
    Double tolerance;

    @Option(names = "--json", description = "Print the result as one JSON object instead of the text report.")
    boolean json;

    @Option(names = "--out", paramLabel = "FILE.csv", description = "Write the time histories (one row per time step) to this file.")
    Path out;

    @Option(names = "--plots", paramLabel = "DIR",
            description = "Draw time-history.png/.svg into DIR: the distance from the base state of every run on a log "
                    + "scale, with the linear prediction e^(Re λ t) dashed beside each.")
    Path plots;

    @Option(names = "--force", description = "Overwrite existing --out and --plots files.")
    boolean force;

    @Option(names = "--debug", description = "Show stack traces on errors.")
    boolean debug;

    @Override
    public Integer call() {
        if (amplitude != null && amplitudes != null) {
            throw new InputException("command line", "--amplitude", "give either --amplitude or --amplitudes, not both");
        }
        List<Double> amps = new ArrayList<>();
        if (amplitudes != null) {
            amps.addAll(amplitudes);
        } else {
            amps.add(amplitude == null ? 1e-3 : amplitude);
        }
        Case c = caseOptions.load();
        CheckResult check = StabilityCheck.run(c);
        DisturbanceSimulation.Options o = new DisturbanceSimulation.Options(mode, amps,
                time == null ? Double.NaN : time, runawayAbove == null ? Double.NaN : runawayAbove,
                tolerance == null ? DisturbanceSimulation.DEFAULT_RTOL : tolerance);
        SimulationResult s = DisturbanceSimulation.run(check, o, null);
        PrintWriter w = spec.commandLine().getOut();
        if (json) {
            w.println(ResultJson.write(SimulationReport.toMap(s)));
        } else {
            SimulationReport.write(s, w);
        }
        if (out != null) {
            AtomicFiles.write(out, SimulationReport.csv(s), force);
            if (!json) {
                w.println("Time histories written to " + out);
            }
        }
        if (plots != null) {
            SimulatePlots.write(s, plots, force);
            if (!json) {
                w.println("Time-history plot written to " + plots + " (time-history.png, time-history.svg)");
            }
        }
        w.flush();
        return 0;
    }
}
