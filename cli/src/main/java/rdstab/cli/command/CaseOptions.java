package rdstab.cli.command;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.error.InputException;
import rdstab.solver.model.AnalysisSpec;
import rdstab.solver.model.Case;

/** The options every command that reads a case shares: the file, parameter overrides, mesh and modes. */
public final class CaseOptions {

    @Parameters(index = "0", paramLabel = "CASE", description = "The case file (YAML). See cases/README.md for its keys.")
    Path caseFile;

    @Option(names = "--set", paramLabel = "NAME=VALUE",
            description = {"Override a parameter of the case without editing the file (repeatable), e.g. --set delta=0.8.",
                "A value may carry a unit when the parameter has one: --set Ta=40degC, --set L=0.3m;",
                "a plain number is taken in the unit the case gave the parameter in."})
    List<String> sets = new ArrayList<>();

    @Option(names = "--cells", paramLabel = "N",
            description = "Cells along the coordinate (overrides the case's mesh; 2D: along x, y scaled alike).")
    Integer cells;

    @Option(names = "--modes", paramLabel = "K",
            description = "Number of rightmost eigenvalues to compute (default: the case's, else 6).")
    Integer modes;

    @Option(names = "--shift", paramLabel = "S",
            description = "Shift for shift-invert (default: automatic, placed right of every eigenvalue by a Gershgorin bound).")
    Double shift;

    /** Reads the case and applies the overrides. */
    public Case load() {
        Case c = CaseReader.read(caseFile);
        for (String s : sets) {
            int eq = s.indexOf('=');
            if (eq <= 0 || eq == s.length() - 1) {
                throw new InputException("command line", "--set " + s, "expected NAME=VALUE, e.g. --set delta=0.8");
            }
            String name = s.substring(0, eq).trim();
            String text = s.substring(eq + 1).trim();
            double v = c.parseValue(name, text);
            c = c.withParameter(name, v);
        }
        if (cells != null) {
            if (cells < 2 || cells > CaseReader.MAX_CELLS) {
                throw new InputException("command line", "--cells", "expected 2 to " + CaseReader.MAX_CELLS + " cells, found " + cells);
            }
            c = c.withMesh(c.mesh().withCells(cells));
        }
        AnalysisSpec a = c.analysis();
        if (modes != null) {
            if (modes < 1 || modes > 200) {
                throw new InputException("command line", "--modes", "expected 1 to 200 modes, found " + modes);
            }
            a = a.withModes(modes);
        }
        if (shift != null) {
            if (!Double.isFinite(shift)) {
                throw new InputException("command line", "--shift", "expected a finite number, found " + shift);
            }
            a = a.withShift(shift);
        }
        return c.withAnalysis(a);
    }

    /** The case file as given. */
    public Path file() {
        return caseFile;
    }

    static String fmt(double v) {
        return String.format(Locale.ROOT, "%.6g", v);
    }
}
