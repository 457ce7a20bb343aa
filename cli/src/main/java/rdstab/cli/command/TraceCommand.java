package rdstab.cli.command;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import rdstab.cli.output.BranchFiles;
import rdstab.cli.plot.TracePlots;
import rdstab.cli.report.ResultJson;
import rdstab.cli.report.TraceReport;
import rdstab.solver.continuation.BranchTracer;
import rdstab.solver.continuation.RestartPoint;
import rdstab.solver.continuation.TraceListener;
import rdstab.solver.continuation.TraceOptions;
import rdstab.solver.continuation.TraceResult;
import rdstab.solver.error.InputException;
import rdstab.solver.model.Case;

/** rdstab trace: the whole branch of steady states through one parameter, through folds. */
@Command(name = "trace", mixinStandardHelpOptions = true,
        description = {
            "Follow the steady states of a case as one parameter changes, through folds (turning points), by "
                + "pseudo-arclength continuation. Every point gets its rightmost eigenvalues and is marked stable or "
                + "unstable; folds, stationary crossings and Hopf points (oscillatory onset, with frequency and period) "
                + "are located between the steps.",
            "",
            "Examples:",
            "  rdstab trace cases/slab-self-heating.yaml --along delta=0.2:1.5",
            "  rdstab trace cases/slab-s-curve.yaml --along delta=0.05:0.6 --out branch.csv",
            "  rdstab trace cases/slab-s-curve.yaml --along delta=0.05:0.6 --restart branch.csv.states --row 12",
            "  rdstab trace cases/slab-s-curve.yaml --along delta=0.3:1.5 --plots pics \\",
            "      --measure norm"},
        footerHeading = "%nFiles:%n",
        footer = {"  --out FILE writes the branch as CSV (JSON lines when FILE ends in .jsonl) and FILE.states: one JSON",
            "  object per row with the full state and tangent (keys row, step, arclength, parameter_name, parameter,",
            "  label, next_step, unknowns, u, tangent_u, tangent_p), which --restart reads.",
            "  --plots DIR draws branch.png/.svg (the measure against the parameter, stable solid, unstable dashed,",
            "  special points named) and branch-growth.png/.svg (the growth rate Re λ₁ along the branch).",
            "Exit status: 0 completed, 2 bad input, 3 numerical failure (e.g. no steady state at FROM), 4 file error."})
public final class TraceCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    CaseOptions caseOptions;

    @Option(names = "--along", required = true, paramLabel = "NAME=FROM:TO",
            description = "The parameter to trace and its range. The branch starts at the steady state found by Newton at FROM "
                    + "and ends when the parameter leaves the range (at either end) or the step cap is reached.")
    String along;

    @Option(names = "--out", paramLabel = "FILE", description = "Write the branch (CSV, or JSON lines for *.jsonl) and FILE.states.")
    Path out;

    @Option(names = "--plots", paramLabel = "DIR",
            description = "Draw the branch diagram and the growth rate along the branch as PNG and SVG into DIR.")
    Path plots;

    @Option(names = "--measure", paramLabel = "WHAT", defaultValue = "max",
            description = "What the branch diagram shows: max (largest value of the first field, the default), "
                    + "max:FIELD (of that field) or norm (M-norm of the whole state).")
    String measure;

    @Option(names = "--max-steps", paramLabel = "N", defaultValue = "200", description = "Cap on continuation steps (default ${DEFAULT-VALUE}).")
    int maxSteps;

    @Option(names = "--step", paramLabel = "S",
            description = "Initial arclength step (default |TO - FROM|/20); steps adapt between 1e-6 and 50 times it.")
    Double step;

    @Option(names = "--restart", paramLabel = "FILE", description = "Resume from a row of an earlier trace's state file (needs --row).")
    Path restart;

    @Option(names = "--row", paramLabel = "K", description = "The row of the --restart file to resume from.")
    Integer row;

    @Option(names = "--json", description = "Print a JSON summary object instead of the text summary.")
    boolean json;

    @Option(names = "--force", description = "Overwrite existing output files.")
    boolean force;

    @Option(names = "--debug", description = "Show stack traces on errors.")
    boolean debug;

    @Override
    public Integer call() {
        if ((restart == null) != (row == null)) {
            throw new ParameterException(spec.commandLine(), "--restart and --row go together");
        }
        Case c = caseOptions.load();
        TraceOptions o = options(c);
        TracePlots.Measure m;
        try {
            m = TracePlots.Measure.parse(measure, c);
        } catch (IllegalArgumentException e) {
            throw new ParameterException(spec.commandLine(), e.getMessage());
        }
        TraceResult r;
        if (restart != null) {
            RestartPoint p = BranchFiles.readRow(restart, row, o.name());
            try {
                r = BranchTracer.resume(c, o, p, TraceListener.NONE);
            } catch (IllegalArgumentException e) {
                throw new InputException(restart.toString(), "--row " + row, e.getMessage());
            }
        } else {
            r = BranchTracer.trace(c, o, TraceListener.NONE);
        }
        if (out != null) {
            BranchFiles.write(r, out, force);
        }
        int pictures = plots == null ? 0 : TracePlots.write(r, m, plots, force).size();
        PrintWriter w = spec.commandLine().getOut();
        if (json) {
            w.println(ResultJson.write(TraceReport.toMap(r, out == null ? null : out.toString())));
        } else {
            TraceReport.write(r, w);
            if (out != null) {
                w.println();
                w.println("Files written: " + out + ", " + BranchFiles.statesOf(out));
            }
            if (plots != null) {
                w.println(pictures + " pictures written to " + plots + " (branch, branch-growth; PNG and SVG)");
            }
        }
        w.flush();
        return 0;
    }

    private TraceOptions options(Case c) {
        int eq = along.indexOf('=');
        int colon = along.indexOf(':', eq + 1);
        if (eq <= 0 || colon < 0) {
            throw new ParameterException(spec.commandLine(), "--along expects NAME=FROM:TO, e.g. --along delta=0.2:1.5; found '" + along + "'");
        }
        String name = along.substring(0, eq).trim();
        double from;
        double to;
        // FROM and TO may carry units; a plain number is in the unit the case gave the parameter (SI inside)
        from = c.parseValue(name, along.substring(eq + 1, colon).trim());
        to = c.parseValue(name, along.substring(colon + 1).trim());
        if (step != null && !(step > 0 && Double.isFinite(step))) {
            throw new ParameterException(spec.commandLine(), "--step must be a positive number, found " + step);
        }
        try {
            return TraceOptions.of(name, from, to, maxSteps, step == null ? Double.NaN : step);
        } catch (IllegalArgumentException e) {
            throw new ParameterException(spec.commandLine(), e.getMessage());
        }
    }
}
