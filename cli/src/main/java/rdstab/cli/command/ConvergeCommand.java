package rdstab.cli.command;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import rdstab.cli.output.AtomicFiles;
import rdstab.cli.plot.ConvergePlots;
import rdstab.cli.report.GridReport;
import rdstab.cli.report.ResultJson;
import rdstab.solver.model.Case;
import rdstab.solver.verify.GridStudy;
import rdstab.solver.verify.GridStudyResult;

/** rdstab converge: grid-convergence study with Richardson extrapolation and the Grid Convergence Index. */
@Command(name = "converge", mixinStandardHelpOptions = true,
        description = {
            "Run the case on systematically refined grids and report, per level, the rightmost eigenvalues (followed "
                + "across grids by mode shape) and the base-state maximum; then the observed order of convergence, the "
                + "Richardson-extrapolated value and the Grid Convergence Index (Fs = 1.25), and whether the verdict is "
                + "resolved: the growth rate larger than its grid error band.",
            "",
            "The case's cell count (or --cells) is the COARSEST level; each further level has --ratio times the cells, so "
                + "the finest has cells·ratio^(levels−1) (at most 4,000,000). The estimates use the three finest levels.",
            "",
            "Examples:",
            "  rdstab converge cases/slab-self-heating.yaml --cells 50",
            "  rdstab converge cases/slab-self-heating.yaml --cells 50 --levels 4 --out grid.csv --json",
            "  rdstab converge cases/slab-self-heating.yaml --cells 50 --plots pictures/"},
        footer = {"", "Exit status: 0 completed, 2 bad input, 3 numerical failure on some level, 4 file error."})
public final class ConvergeCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    CaseOptions caseOptions;

    @Option(names = "--levels", paramLabel = "L", defaultValue = "3", description = "Number of grid levels, 3 to 12 (default 3).")
    int levels;

    @Option(names = "--ratio", paramLabel = "R", defaultValue = "2",
            description = "Refinement ratio between levels, 1.1 to 16 (default 2: cells double per level).")
    double ratio;

    @Option(names = "--json", description = "Print the study as one JSON object instead of the text report.")
    boolean json;

    @Option(names = "--out", paramLabel = "FILE.csv", description = "Write one CSV row per level to this file.")
    Path out;

    @Option(names = "--plots", paramLabel = "DIR",
            description = "Draw convergence.png/.svg into DIR: the relative error against the Richardson-extrapolated "
                    + "value of the growth rate and of each base-state maximum versus the mesh spacing, on log axes, "
                    + "with the observed orders in the legend.")
    Path plots;

    @Option(names = "--force", description = "Overwrite existing --out and --plots files.")
    boolean force;

    @Option(names = "--debug", description = "Show stack traces on errors.")
    boolean debug;

    @Override
    public Integer call() {
        Case c = caseOptions.load();
        if (c.mesh().cells() <= 0) {
            throw new rdstab.solver.error.InputException("command line", "--cells", "a grid study refines by cell "
                    + "count; this case gives an element size or its own mesh: pass --cells N (elements across the body)");
        }
        int[] cells = GridStudy.refined(c.mesh().cells(), levels, ratio);
        GridStudyResult r = GridStudy.run(c, cells, cells.length - 1, null);
        ConvergePlots.Written pictures = plots == null ? null : ConvergePlots.write(r, plots, force);
        PrintWriter w = spec.commandLine().getOut();
        if (json) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("growth_rate", ResultJson.num(r.growthRate()));
            m.put("verdict", r.reportedCheck().assessment().withGridBand(
                    Math.max(0, r.growthBand() - r.reportedCheck().assessment().band()), "GCI").verdict().word());
            m.put("grid", GridReport.toMap(r));
            m.put("parameters", r.reportedCheck().problem().theCase().parameters());
            m.put("cautions", r.reportedCheck().assessment().cautions());
            w.println(ResultJson.write(m));
        } else {
            GridReport.write(r, w);
        }
        if (out != null) {
            AtomicFiles.write(out, GridReport.csv(r), force);
            if (!json) {
                w.println("Levels written to " + out);
            }
        }
        if (pictures != null && !json) {
            for (String o : pictures.omitted()) {
                w.println("Convergence plot: " + o);
            }
            w.println(pictures.files().isEmpty() ? "No convergence plot: nothing changes with the grid above round-off"
                    : "Convergence plot written to " + plots + " (convergence.png, convergence.svg)");
        }
        w.flush();
        return 0;
    }
}
