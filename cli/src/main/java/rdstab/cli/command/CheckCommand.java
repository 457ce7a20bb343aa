package rdstab.cli.command;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import rdstab.cli.output.ResultFiles;
import java.util.Map;
import rdstab.cli.report.GridReport;
import rdstab.cli.report.ResultJson;
import rdstab.cli.report.TextReport;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.drive.StabilityCheck;
import rdstab.solver.model.Case;
import rdstab.solver.verify.GridStudy;
import rdstab.solver.verify.GridStudyResult;

/** rdstab check: one parameter point, the full report. */
@Command(name = "check", mixinStandardHelpOptions = true,
        description = {
            "Find the steady state of a case, linearize about it and report whether small disturbances die out "
                + "(stable) or grow (unstable), with the growth rate, e-folding time, where the leading mode peaks, "
                + "the energy-method rates and the evidence (Newton residual, eigenpair residuals).",
            "",
            "Examples:",
            "  rdstab check cases/slab-self-heating.yaml",
            "  rdstab check cases/slab-self-heating.yaml --set delta=0.85 --cells 400 --json",
            "  rdstab check cases/sphere-stored-powder.yaml --out results/",
            "  rdstab check cases/slab-self-heating.yaml --verify"},
        footerHeading = "%nLimits:%n",
        footer = {"  case files up to 1 MiB; formulas up to 10000 characters and 200 levels of nesting;",
            "  up to 4,000,000 cells per direction; YAML aliases limited to 20.",
            "Exit status: 0 completed (any verdict), 2 bad input, 3 numerical failure (e.g. no steady state), 4 file error."})
public final class CheckCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    CaseOptions caseOptions;

    @Option(names = "--json", description = "Print the result as one JSON object (the interface contract) instead of the text report.")
    boolean json;

    @Option(names = "--out", paramLabel = "DIR",
            description = "Write base.csv, modes.csv, eigenvalues.csv and result.json into DIR (created if needed).")
    Path out;

    @Option(names = "--force", description = "Overwrite existing result files in --out.")
    boolean force;

    @Option(names = "--verify", description = "Also run the case on a grid half as fine and one twice as fine, and judge "
            + "the growth rate against its grid error band (GCI, Fs = 1.25): printed as value ± band, the verdict "
            + "becomes marginal when |growth rate| is within the band. About 3.5 times the work of a plain check.")
    boolean verify;

    @Option(names = "--debug", description = "Show stack traces on errors.")
    boolean debug;

    @Override
    public Integer call() throws Exception {
        Case c = caseOptions.load();
        GridStudyResult study = null;
        CheckResult r;
        if (verify) {
            int[] a = GridStudy.around(c.mesh().cells(), 2.0);
            study = GridStudy.run(c, new int[] {a[0], a[1], a[2]}, a[3], null);
            r = withGridBand(study);
        } else {
            r = StabilityCheck.run(c);
        }
        PrintWriter w = spec.commandLine().getOut();
        if (json) {
            Map<String, Object> m = ResultJson.toMap(r);
            if (study != null) {
                m.put("grid", GridReport.toMap(study));
            }
            w.println(ResultJson.write(m));
        } else {
            GridStudyResult st = study;
            TextReport.write(r, w, st == null ? null : pw -> GridReport.writeSection(st, pw));
        }
        if (out != null) {
            ResultFiles.write(r, out, force);
            if (!json) {
                w.println("Files written to " + out + ": base.csv, modes.csv, eigenvalues.csv, result.json");
            }
        }
        w.flush();
        return 0;
    }

    /** The requested grid's check with its assessment re-judged on the grid band (GCI of the requested level). */
    static CheckResult withGridBand(GridStudyResult s) {
        CheckResult r = s.reportedCheck();
        double gci = Math.max(0, s.growthBand() - r.assessment().band());
        return new CheckResult(r.problem(), r.base(), r.baseNodal(), r.baseMax(), r.modes(), r.shift(),
                r.rightmostCertified(), r.energy(), r.assessment().withGridBand(gci, "GCI of 3 grids"), r.seconds());
    }
}
