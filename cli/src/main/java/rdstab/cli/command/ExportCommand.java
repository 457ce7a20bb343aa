package rdstab.cli.command;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.ejml.data.DMatrixSparseCSC;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import rdstab.cli.output.AtomicFiles;
import rdstab.cli.output.MatrixMarket;
import rdstab.mesh.assembly.Discretization;
import rdstab.solver.drive.StabilityCheck;
import rdstab.solver.model.Case;
import rdstab.solver.newton.BaseState;
import rdstab.solver.setup.Problem;
import rdstab.solver.setup.ProblemBuilder;

/** rdstab export: the linearized operators at the base state as Matrix Market files, with the field layout. */
@Command(name = "export", mixinStandardHelpOptions = true,
        description = {
            "Find the steady state of a case and write the stability operators there, so that any eigen-solver can "
                + "reproduce rdstab's eigenvalues: J.mtx (Jacobian) and M.mtx (weight matrix) as Matrix Market files "
                + "(the eigenproblem is J x = lambda M x), unknowns.csv (unknown index from 1 as in the .mtx files, "
                + "field, node, coordinates) and nodes.csv (node, coordinates).",
            "",
            "Examples:",
            "  rdstab export cases/slab-self-heating.yaml --out ops/",
            "  rdstab spectrum ops/J.mtx ops/M.mtx --modes 6"},
        footer = {"", "Exit status: 0 completed, 2 bad input, 3 no steady state found, 4 file error."})
public final class ExportCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    CaseOptions caseOptions;

    @Option(names = "--out", paramLabel = "DIR", required = true, description = "Folder for J.mtx, M.mtx, unknowns.csv, nodes.csv (created if needed).")
    Path out;

    @Option(names = "--force", description = "Overwrite existing files in --out.")
    boolean force;

    @Option(names = "--debug", description = "Show stack traces on errors.")
    boolean debug;

    @Override
    public Integer call() {
        Case c = caseOptions.load();
        Problem p = ProblemBuilder.build(c);
        BaseState base = StabilityCheck.steadyState(p, p.initial());
        Discretization d = p.full();
        DMatrixSparseCSC j = d.jacobian(base.u());
        DMatrixSparseCSC m = d.mass();
        String origin = "rdstab export of " + caseOptions.file().getFileName() + " at its base state (Newton residual "
                + String.format(Locale.ROOT, "%.3e", base.residual()) + ")";
        MatrixMarket.write(out.resolve("J.mtx"), j, false, origin + ": Jacobian J", force);
        MatrixMarket.write(out.resolve("M.mtx"), m, false, origin + ": weight matrix M", force);
        AtomicFiles.write(out.resolve("unknowns.csv"), unknowns(c, d), force);
        AtomicFiles.write(out.resolve("nodes.csv"), nodes(d), force);
        PrintWriter w = spec.commandLine().getOut();
        w.printf(Locale.ROOT, "Base state found in %d Newton steps (residual %.3e); %d unknowns, %d entries in J.%n",
                base.iterations(), base.residual(), d.unknowns(), j.nz_length);
        w.println("Files written to " + out + ": J.mtx, M.mtx, unknowns.csv, nodes.csv");
        w.println("Eigenproblem: J x = lambda M x (Re lambda > 0 grows). Reproduce with:");
        w.println("  rdstab spectrum " + out.resolve("J.mtx") + " " + out.resolve("M.mtx") + " --modes "
                + c.analysis().modes());
        w.flush();
        return 0;
    }

    private static String axes(Discretization d) {
        return d.dimension() == 1 ? "x" : "x,y";
    }

    private static String coords(Discretization d, int node) {
        StringBuilder s = new StringBuilder();
        for (int dir = 0; dir < d.dimension(); dir++) {
            s.append(dir == 0 ? "" : ",").append(d.coordinate(node, dir));
        }
        return s.toString();
    }

    static String unknowns(Case c, Discretization d) {
        StringBuilder s = new StringBuilder("unknown,field,node," + axes(d) + "\n");
        String[] rows = new String[d.unknowns()];
        for (int f = 0; f < d.fieldCount(); f++) {
            for (int node = 0; node < d.nodes(); node++) {
                int u = d.unknownIndex(f, node);
                if (u >= 0) {
                    rows[u] = (u + 1) + "," + c.fields().get(f).name() + "," + node + "," + coords(d, node) + "\n";
                }
            }
        }
        for (String r : rows) {
            s.append(r);
        }
        return s.toString();
    }

    static String nodes(Discretization d) {
        StringBuilder s = new StringBuilder("node," + axes(d) + "\n");
        for (int node = 0; node < d.nodes(); node++) {
            s.append(node).append(',').append(coords(d, node)).append('\n');
        }
        return s.toString();
    }
}
