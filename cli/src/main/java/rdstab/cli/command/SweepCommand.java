package rdstab.cli.command;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.concurrent.atomic.AtomicInteger;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import rdstab.cli.output.NeutralCurveFile;
import rdstab.cli.output.SweepFiles;
import rdstab.cli.output.SweepOutput;
import rdstab.cli.report.ResultJson;
import rdstab.solver.assess.SafetyCautions;
import rdstab.solver.error.InputException;
import rdstab.solver.model.Case;
import rdstab.solver.sweep.Axis;
import rdstab.solver.sweep.NeutralCurve;
import rdstab.solver.sweep.PointStatus;
import rdstab.solver.sweep.Shard;
import rdstab.solver.sweep.SweepGrid;
import rdstab.solver.sweep.SweepRunner;

/** rdstab sweep: a one- or two-parameter grid of checks, parallel, resumable and shardable. */
@Command(name = "sweep", mixinStandardHelpOptions = true,
        description = {
            "Run the stability check at every point of a grid of one or two parameters and write one row per point "
                + "(parameter values, status, verdict, growth rate, leading eigenvalues with residuals, base-state maxima, "
                + "Newton evidence, energy rates) to FILE.csv and FILE.jsonl, in point order, each row flushed to disk as "
                + "soon as it and the rows before it are done. A point that fails (no steady state, eigen-solver not "
                + "converged, case invalid there) is a row with its status; the sweep goes on.",
            "",
            "Base states are warm-started along chains of --chain-length consecutive points of the first parameter; "
                + "chains depend only on the grid, so the numbers are the same for any --threads, --shard or --resume.",
            "",
            "Examples:",
            "  rdstab sweep cases/slab-self-heating.yaml --vary delta=0.2:1.2:51 --out runs/delta.csv",
            "  rdstab sweep cases/slab-self-heating.yaml --vary Bi=0.5:500:12:log --vary delta=0.1:1.0:46 \\",
            "        --out runs/bi-delta.csv --neutral-curve runs/neutral.csv",
            "  rdstab sweep CASE --vary ... --out runs/big.csv --shard 2/8      (then: rdstab merge runs/big.shard*of8.csv --out runs/big.csv)",
            "  rdstab sweep CASE --vary ... --out runs/big.csv --resume         (after an interruption)",
            "",
            "On a Slurm job array the shard comes from SLURM_ARRAY_TASK_ID and SLURM_ARRAY_TASK_COUNT (or _MIN/_MAX) "
                + "when --shard is not given; see docs/cluster.md."},
        footer = {"", "Exit status: 0 the sweep completed, every point of it (or of the shard) is in both files (whatever the "
                + "verdicts and statuses), 2 bad input, 4 file error (also when, after the run, the files do not hold every "
                + "point)."})
public final class SweepCommand implements Callable<Integer> {

    /** Default points per warm-start chain. */
    public static final int DEFAULT_CHAIN = 8;

    @Spec
    CommandSpec spec;

    @Mixin
    CaseOptions caseOptions;

    @Option(names = "--vary", paramLabel = "NAME=FROM:TO:COUNT[:log]", required = true,
            description = "A parameter to vary: COUNT values from FROM to TO, evenly spaced (or evenly in the logarithm with "
                    + ":log). Give it once or twice; the first varies fastest.")
    List<String> vary = new ArrayList<>();

    @Option(names = "--out", paramLabel = "FILE",
            description = "Output name: writes FILE.csv (or FILE when it ends in .csv) and FILE.jsonl. With a shard I/N "
                    + "the name gets .shardIofN before the extension. Default: <case name>-sweep.csv.")
    Path out;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (default: all available processors). Large 2D points "
            + "already factorize and solve on two cores each, so there --threads 1 can be as fast (a 400x200 plate, 4 points: "
            + "9.4 s with 1 thread, 10.8 s with 2); small 1D points gain from more threads.")
    Integer threads;

    @Option(names = "--shard", paramLabel = "I/N",
            description = "Compute only shard I of N (0 <= I < N): every N-th chain, starting with chain I.")
    String shard;

    @Option(names = "--resume", description = "Continue an interrupted sweep: keep the finished rows of FILE, cut a torn last "
            + "line, compute the rest. The options must be the same as in the first run.")
    boolean resume;

    @Option(names = "--force", description = "Start again even if FILE exists (its rows are discarded).")
    boolean force;

    @Option(names = "--quiet", description = "No progress bar (it is also off when stderr is not a terminal).")
    boolean quiet;

    @Option(names = "--chain-length", paramLabel = "L",
            description = "Points per warm-start chain along the first parameter (default: " + DEFAULT_CHAIN + ").")
    int chainLength = DEFAULT_CHAIN;

    @Option(names = "--neutral-curve", paramLabel = "FILE.csv",
            description = "Two-parameter sweeps: write the neutral curve, the critical value of the second parameter "
                    + "(first sign change of the growth rate, or first point without a steady state) for each value of the "
                    + "first, interpolated between grid points (see docs/cluster.md). Needs the whole sweep.")
    Path neutralCurve;

    @Option(names = "--plots", paramLabel = "DIR",
            description = "Draw the growth rate against the parameter with stable and unstable ranges shaded (one --vary), "
                    + "or the growth-rate map and the neutral curve (two --vary), as PNG and SVG into DIR. Needs the whole sweep.")
    Path plots;

    @Option(names = "--debug", description = "Show stack traces on errors.")
    boolean debug;

    @Override
    public Integer call() throws Exception {
        Case c = caseOptions.load();
        List<Axis> axes = new ArrayList<>();
        for (String v : vary) {
            axes.add(Axis.parse(v, c));
        }
        SweepGrid grid = new SweepGrid(axes, chainLength);
        Shard sh = shard != null ? Shard.parse(shard) : SlurmShard.fromEnvironment(System.getenv());
        if (threads != null && (threads < 1 || threads > 4096)) {
            throw new InputException("command line", "--threads", "expected 1 to 4096, found " + threads);
        }
        if (neutralCurve != null && axes.size() != 2) {
            throw new InputException("command line", "--neutral-curve", "a neutral curve needs two --vary options");
        }
        for (Axis a : axes) {
            c.parameter(a.name());
        }
        Path[] paths = SweepFiles.paths(shardName(out != null ? out : defaultOut(), sh));
        List<String> columns = SweepFiles.columns(grid.names(), c.fieldNames());
        Map<String, Object> specMap = specification(c, grid, sh);
        int[] points = grid.pointsOf(sh);
        PrintWriter w = spec.commandLine().getOut();
        Map<PointStatus, Integer> counts = new EnumMap<>(PointStatus.class);
        try (SweepOutput o = SweepOutput.open(paths, SweepFiles.csvHeader(ResultJson.write(specMap), columns),
                SweepFiles.jsonHeader(specMap), columns.size(), points, resume, force);
             Progress bar = Progress.start(points.length, o.written(), quiet)) {
            AtomicInteger computed = new AtomicInteger();
            int n = threads != null ? threads : Runtime.getRuntime().availableProcessors();
            SweepRunner.run(c, grid, grid.chainsOf(sh), o::earlier, n, outcome -> {
                String csvRow = SweepFiles.csvRow(outcome, c.fieldNames());
                String jsonRow = SweepFiles.jsonRow(outcome, grid.names());
                o.accept(outcome.point(), csvRow, jsonRow);
                synchronized (counts) {
                    counts.merge(outcome.status(), 1, Integer::sum);
                }
                computed.incrementAndGet();
                bar.step();
            });
            o.verifyComplete();
            summary(w, grid, sh, points.length, o, computed.get(), counts);
        }
        if (neutralCurve != null) {
            writeCurve(w, paths[1], grid, sh);
        }
        if (plots != null) {
            if (sh.count() > 1) {
                w.println("Pictures not drawn: this run is one shard; merge the shards first.");
            } else {
                int k = rdstab.cli.plot.SweepPlots.write(c, grid, paths[1], plots).size();
                w.println(k + " pictures written to " + plots + " (PNG and SVG)");
            }
        }
        w.println();
        w.println("Cautions");
        for (String s : SafetyCautions.STANDARD) {
            w.println("  - " + s);
        }
        w.flush();
        return 0;
    }

    private void writeCurve(PrintWriter w, Path jsonl, SweepGrid grid, Shard sh) throws IOException {
        if (sh.count() > 1) {
            w.println("Neutral curve not written: this run is one shard; merge the shards with "
                    + "'rdstab merge ... --neutral-curve FILE.csv'.");
            return;
        }
        List<NeutralCurve.Entry> curve = NeutralCurveFile.write(jsonl, grid, neutralCurve);
        NeutralCurveReport.print(w, grid, curve, neutralCurve);
    }

    private static void summary(PrintWriter w, SweepGrid grid, Shard sh, int shardPoints, SweepOutput o, int computed,
                                Map<PointStatus, Integer> counts) {
        w.printf("Sweep of %s: %d points%s; %d computed now%s.%n", String.join(" x ", grid.names()), grid.points(),
                sh.count() > 1 ? " (shard " + sh.text() + ": " + shardPoints + " of them)" : "", computed,
                o.resumed() > 0 ? ", " + o.resumed() + " kept from the earlier run" : "");
        if (!counts.isEmpty()) {
            StringBuilder sb = new StringBuilder("  status of the points computed now:");
            counts.forEach((k, v) -> sb.append(' ').append(k.word()).append(' ').append(v).append(';'));
            w.println(sb.substring(0, sb.length() - 1));
        }
        w.println("  rows in point order: " + o.csvPath() + " and " + o.jsonPath());
        if (counts.getOrDefault(PointStatus.NO_STEADY_STATE, 0) > 0) {
            w.println("  'no steady state' rows: beyond a fold there is none; 'rdstab critical' locates the limit.");
        }
    }

    private Path defaultOut() {
        String n = caseOptions.file().getFileName().toString().replaceFirst("\\.ya?ml$", "");
        return Path.of(n + "-sweep.csv");
    }

    /** FILE.csv → FILE.shardIofN.csv when the sweep is split. */
    static Path shardName(Path out, Shard sh) {
        if (sh.count() == 1) {
            return out;
        }
        String name = out.getFileName().toString();
        String ext = name.endsWith(".csv") ? ".csv" : name.endsWith(".jsonl") ? ".jsonl" : "";
        String stem = name.substring(0, name.length() - ext.length());
        return out.resolveSibling(stem + ".shard" + sh.index() + "of" + sh.count() + ext);
    }

    /** What makes two runs the same sweep (written as the first line of both files). */
    private Map<String, Object> specification(Case c, SweepGrid grid, Shard sh) throws IOException {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("format", 1);
        m.put("case", caseOptions.file().getFileName().toString());
        m.put("case_sha256", sha256(caseOptions.file()));
        Map<String, Object> params = new LinkedHashMap<>();
        c.parameters().forEach((k, v) -> params.put(k, v));
        m.put("parameters", params);
        m.put("cells", c.mesh().cells());
        m.put("modes", c.analysis().modes());
        m.put("shift", ResultJson.num(c.analysis().shift()));
        List<String> v = new ArrayList<>();
        for (Axis a : grid.axes()) {
            v.add(a.text());
        }
        m.put("vary", v);
        m.put("chain_length", grid.chainLength());
        m.put("points", grid.points());
        m.put("shard", sh.text());
        return m;
    }

    static String sha256(Path file) throws IOException {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(file)));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }
}
