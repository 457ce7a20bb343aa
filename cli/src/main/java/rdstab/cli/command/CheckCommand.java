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
import rdstab.cli.output.VtkWriter;
import rdstab.cli.plot.CheckPlots;
import rdstab.cli.report.HtmlReport;
import java.util.Map;
import rdstab.cli.report.GridReport;
import rdstab.cli.report.ResultJson;
import rdstab.cli.report.TextReport;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.drive.StabilityCheck;
import rdstab.solver.error.ConvergenceException;
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
            "  rdstab check cases/rod-upper-branch.yaml --plots pictures/ --report rod.html --vtk results/",
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

    @Option(names = "--plots", paramLabel = "DIR",
            description = "Draw the base state, the leading modes and the spectrum as PNG and SVG pictures into DIR "
                    + "(1D: profiles; 2D: colour maps).")
    Path plots;

    @Option(names = "--report", paramLabel = "FILE.html",
            description = "Write one self-contained HTML report (verdict, pictures, tables, cautions; readable offline).")
    Path report;

    @Option(names = "--vtk", paramLabel = "DIR",
            description = "Write DIR/check.vtk (legacy VTK, ASCII): the mesh with the base state and every mode "
                    + "(modeK_FIELD_re / _im) as point data, for open-source visualisation tools.")
    Path vtk;

    @Option(names = "--force", description = "Overwrite existing result files (--out, --plots, --vtk, --report).")
    boolean force;

    @Option(names = "--amplification-budget", paramLabel = "N",
            description = "Largest number of linear solves (time steps) spent on the peak energy amplification when the "
                + "spectrum decays but the energy can grow; 0 skips it (default: the case's analysis key, else 20000).")
    Integer amplificationBudget;

    @Option(names = "--verify", description = "Also run the case on a grid half as fine and one twice as fine, and judge "
            + "the growth rate against its grid error band (GCI, Fs = 1.25): printed as value ± band, the verdict "
            + "becomes marginal when |growth rate| is within the band. About 3.5 times the work of a plain check.")
    boolean verify;

    @Option(names = "--debug", description = "Show stack traces on errors.")
    boolean debug;

    @Override
    public Integer call() throws Exception {
        Case c = caseOptions.load();
        if (amplificationBudget != null) {
            if (amplificationBudget < 0) {
                throw new rdstab.solver.error.InputException("command line", "--amplification-budget",
                        "expected a whole number >= 0, found " + amplificationBudget);
            }
            c = c.withAnalysis(c.analysis().withAmplificationBudget(amplificationBudget));
        }
        PrintWriter w = spec.commandLine().getOut();
        GridStudyResult study = null;
        CheckResult r;
        try {
            if (verify) {
                if (c.mesh().cells() <= 0) {
                    throw new rdstab.solver.error.InputException("command line", "--cells", "a grid study refines by cell "
                            + "count; this case gives an element size or its own mesh: pass --cells N (elements across the body)");
                }
                int[] a = GridStudy.around(c.mesh().cells(), 2.0);
                study = GridStudy.run(c, new int[] {a[0], a[1], a[2]}, a[3], null);
                r = withGridBand(study);
            } else {
                r = StabilityCheck.run(c);
            }
        } catch (ConvergenceException e) {
            if (!json && e.reason() == ConvergenceException.Reason.NO_STEADY_STATE) {
                TextReport.writeNoSteadyState(c, w);
            }
            throw e;
        }
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
        if (plots != null) {
            int n = CheckPlots.write(r, plots, force).size();
            if (!json) {
                w.println(n + " pictures written to " + plots + " (PNG and SVG)");
            }
        }
        if (vtk != null) {
            Path p = VtkWriter.write(r, vtk, force);
            if (!json) {
                w.println("VTK file written: " + p);
            }
        }
        if (report != null) {
            HtmlReport.write(r, report, force);
            if (!json) {
                w.println("HTML report written: " + report);
            }
        }
        w.flush();
        return 0;
    }

    /** The requested grid's check with its assessment re-judged on the grid band (GCI of the requested level). */
    static CheckResult withGridBand(GridStudyResult s) {
        CheckResult r = s.reportedCheck();
        double gci = Math.max(0, s.growthBand() - r.assessment().band());
        return r.withAssessment(r.assessment().withGridBand(gci, "GCI of 3 grids"));
    }
}
