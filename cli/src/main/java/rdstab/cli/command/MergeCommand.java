package rdstab.cli.command;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import rdstab.cli.Main;
import rdstab.cli.output.AtomicFiles;
import rdstab.cli.output.NeutralCurveFile;
import rdstab.cli.output.SweepFiles;
import rdstab.cli.report.ResultJson;
import rdstab.solver.error.InputException;
import rdstab.solver.sweep.Axis;
import rdstab.solver.sweep.NeutralCurve;
import rdstab.solver.sweep.SweepGrid;

/** rdstab merge: joins the shard files of one sweep into one file in point order. */
@Command(name = "merge", mixinStandardHelpOptions = true,
        description = {
            "Join the files of the shards of one sweep (rdstab sweep --shard I/N, or a Slurm job array) into one pair "
                + "FILE.csv / FILE.jsonl in point order. Every file must hold the same sweep (same case file, overrides, "
                + "ranges and chain length: the first line of each file says), and every point must be present exactly once; "
                + "otherwise nothing is written and the missing or duplicated points are listed (exit 2).",
            "",
            "Example:",
            "  rdstab merge runs/big.shard*of8.csv --out runs/big.csv"},
        footer = {"", "Exit status: 0 merged, 2 different sweeps or missing/duplicate points, 4 file error."})
public final class MergeCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(paramLabel = "FILE", arity = "1..*", description = "Shard files (FILE.csv or FILE.jsonl; both must exist).")
    List<Path> files = new ArrayList<>();

    @Option(names = "--out", paramLabel = "FILE", required = true, description = "The merged FILE.csv and FILE.jsonl.")
    Path out;

    @Option(names = "--force", description = "Overwrite an existing merged file.")
    boolean force;

    @Option(names = "--neutral-curve", paramLabel = "FILE.csv",
            description = "Also write the neutral curve of a two-parameter sweep (see rdstab sweep --help).")
    Path neutralCurve;

    @Option(names = "--debug", description = "Show stack traces on errors.")
    boolean debug;

    /** One shard file pair as read. */
    private record Part(Path csv, JsonNode spec, String columns, SweepFiles.Contents csvRows, SweepFiles.Contents jsonRows) {
    }

    @Override
    public Integer call() throws Exception {
        List<Part> parts = new ArrayList<>();
        for (Path f : files) {
            parts.add(read(f));
        }
        ObjectNode common = withoutShard(parts.get(0).spec());
        for (Part p : parts) {
            if (!withoutShard(p.spec()).equals(common) || !p.columns().equals(parts.get(0).columns())) {
                throw new InputException(p.csv().toString(), "line 1", "holds another sweep than " + parts.get(0).csv()
                        + " (case file, overrides, ranges or chain length differ); merge only shards of one sweep");
            }
        }
        int n = common.get("points").asInt();
        String[] csvRows = new String[n];
        String[] jsonRows = new String[n];
        List<Integer> duplicate = new ArrayList<>();
        for (Part p : parts) {
            java.util.Map<Integer, String> json = new java.util.HashMap<>();
            for (SweepFiles.Line l : p.jsonRows().lines()) {
                json.put(l.point(), l.text());
            }
            for (SweepFiles.Line l : p.csvRows().lines()) {
                int pt = l.point();
                if (pt < 0 || pt >= n || !json.containsKey(pt)) {
                    continue;
                }
                if (csvRows[pt] != null) {
                    duplicate.add(pt);
                }
                csvRows[pt] = l.text();
                jsonRows[pt] = json.get(pt);
            }
        }
        List<Integer> missing = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            if (csvRows[i] == null) {
                missing.add(i);
            }
        }
        PrintWriter err = spec.commandLine().getErr();
        if (!missing.isEmpty() || !duplicate.isEmpty()) {
            err.println("rdstab: merge: " + (missing.isEmpty() ? "" : missing.size() + " of " + n + " points missing: "
                    + ranges(missing)) + (missing.isEmpty() || duplicate.isEmpty() ? "" : "; ")
                    + (duplicate.isEmpty() ? "" : duplicate.size() + " points present more than once: " + ranges(duplicate))
                    + ". Nothing written: rerun the shards that lack points (with --resume), or leave out the repeated file.");
            err.flush();
            return Main.BAD_INPUT;
        }
        ObjectNode merged = parts.get(0).spec().deepCopy();
        merged.put("shard", "0/1");
        String specJson = ResultJson.write(merged);
        StringBuilder csv = new StringBuilder(SweepFiles.CSV_MARK).append(specJson).append('\n').append(parts.get(0).columns());
        StringBuilder jsonl = new StringBuilder("{\"sweep\":").append(specJson).append("}\n");
        for (int i = 0; i < n; i++) {
            csv.append(csvRows[i]);
            jsonl.append(jsonRows[i]);
        }
        Path[] target = SweepFiles.paths(out);
        if (!force && (Files.exists(target[0]) || Files.exists(target[1]))) {
            throw new java.io.UncheckedIOException(new java.nio.file.FileAlreadyExistsException(target[0] + " or " + target[1]
                    + " exists; pass --force to overwrite it"));
        }
        AtomicFiles.write(target[0], csv.toString(), true);
        AtomicFiles.write(target[1], jsonl.toString(), true);
        PrintWriter w = spec.commandLine().getOut();
        w.println("Merged " + parts.size() + " files, " + n + " points, into " + target[0] + " and " + target[1]);
        if (neutralCurve != null) {
            SweepGrid grid = grid(common);
            if (grid.axes().size() != 2) {
                throw new InputException("command line", "--neutral-curve", "a neutral curve needs a two-parameter sweep");
            }
            List<NeutralCurve.Entry> curve = NeutralCurveFile.write(target[1], grid, neutralCurve);
            NeutralCurveReport.print(w, grid, curve, neutralCurve);
        }
        w.flush();
        return 0;
    }

    private static Part read(Path f) throws IOException {
        Path[] p = SweepFiles.paths(f);
        for (Path x : p) {
            if (!Files.isRegularFile(x)) {
                throw new java.io.UncheckedIOException(new java.nio.file.NoSuchFileException(x
                        + ": no such sweep file (a shard writes FILE.csv and FILE.jsonl side by side)"));
            }
        }
        SweepFiles.Contents jh = SweepFiles.read(p[1], false, 0);
        JsonNode s = jh.headerEnd() > 0 ? SweepFiles.spec(jh.header()) : null;
        if (s == null || !s.isObject()) {
            throw new InputException(p[1].toString(), "line 1", "is not the first line of an rdstab sweep file");
        }
        String firstCsv = Files.readString(p[0]).lines().findFirst().orElse("");
        String columns = Files.readString(p[0]).lines().skip(1).findFirst().orElse("") + "\n";
        if (!firstCsv.equals(SweepFiles.CSV_MARK + ResultJson.write(s))) {
            throw new InputException(p[0].toString(), "line 1", "does not hold the same sweep as " + p[1]);
        }
        int cols = columns.split(",", -1).length;
        return new Part(p[0], s, columns, SweepFiles.read(p[0], true, cols), jh);
    }

    private static ObjectNode withoutShard(JsonNode spec) {
        ObjectNode o = spec.deepCopy();
        o.remove("shard");
        o.remove("case");
        return o;
    }

    /** The grid of a specification. */
    static SweepGrid grid(JsonNode spec) {
        List<Axis> axes = new ArrayList<>();
        for (JsonNode v : spec.get("vary")) {
            axes.add(Axis.parse(v.asText()));
        }
        return new SweepGrid(axes, spec.get("chain_length").asInt());
    }

    /** "0-3, 7, 9-12" (at most 40 runs, then "..."). */
    static String ranges(List<Integer> pts) {
        List<Integer> s = new ArrayList<>(new java.util.TreeSet<>(pts));
        StringBuilder sb = new StringBuilder();
        int runs = 0;
        for (int i = 0; i < s.size(); i++) {
            int a = s.get(i);
            int b = a;
            while (i + 1 < s.size() && s.get(i + 1) == b + 1) {
                b = s.get(++i);
            }
            if (runs++ == 40) {
                sb.append(", ...");
                break;
            }
            sb.append(sb.length() > 0 ? ", " : "").append(a).append(a == b ? "" : "-" + b);
        }
        return sb.toString();
    }
}
