package rdstab.cli.output;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import rdstab.cli.report.ResultJson;
import rdstab.solver.continuation.BranchPoint;
import rdstab.solver.continuation.BranchRow;
import rdstab.solver.continuation.Eigenvalue;
import rdstab.solver.continuation.RestartPoint;
import rdstab.solver.continuation.TraceResult;
import rdstab.solver.error.InputException;

/**
 * The files of a trace.
 *
 * <p><b>Branch file</b> ({@code --out FILE}): CSV unless FILE ends in {@code .jsonl}, then one JSON object per row.
 * CSV columns: {@code row, step, arclength, <parameter>, m_norm, max_<field>..., growth_rate, frequency, stability,
 * label, eigen_residual} (the largest residual among the row's eigenpairs); numbers in Java's round-trip decimal
 * form. JSON lines carry the same keys with {@code max} as an object and {@code eigenvalues} as a list of
 * {@code {re, im, residual}}.
 *
 * <p><b>State file</b> ({@code FILE.states}, written beside the branch file): JSON lines, one per row, each
 * self-contained: {@code {"row", "step", "arclength", "parameter_name", "parameter", "label", "next_step",
 * "unknowns", "u": [n numbers], "tangent_u": [n numbers], "tangent_p"}} — the unknown vector (fixed-value nodes
 * excluded, node-major), the unit tangent in the scaled inner product, and the step the tracer would try next.
 * Numbers round-trip exactly. {@code rdstab trace CASE --along ... --restart FILE.states --row K} resumes from row K.
 */
public final class BranchFiles {

    private static final ObjectMapper MAPPER = new ObjectMapper();

    private BranchFiles() {
    }

    /** The state file that belongs to a branch file. */
    public static Path statesOf(Path branch) {
        return branch.resolveSibling(branch.getFileName() + ".states");
    }

    /** Writes the branch file and its state file. */
    public static void write(TraceResult r, Path out, boolean overwrite) {
        String text = out.getFileName().toString().endsWith(".jsonl") ? jsonLines(r) : csv(r);
        AtomicFiles.write(out, text, overwrite);
        AtomicFiles.write(statesOf(out), states(r), overwrite);
    }

    /** The branch as CSV. */
    public static String csv(TraceResult r) {
        List<String> fields = r.theCase().fieldNames();
        StringBuilder sb = new StringBuilder("row,step,arclength,").append(r.options().name()).append(",m_norm");
        for (String f : fields) {
            sb.append(",max_").append(f);
        }
        sb.append(",growth_rate,frequency,stability,label,eigen_residual\n");
        for (BranchRow row : r.rows()) {
            sb.append(row.row()).append(',').append(row.step()).append(',').append(row.arclength()).append(',')
                    .append(row.parameter()).append(',').append(row.norm());
            for (String f : fields) {
                sb.append(',').append(row.max().get(f));
            }
            sb.append(',').append(row.growthRate()).append(',').append(row.frequency()).append(',').append(row.stability())
                    .append(',').append(row.label()).append(',').append(worstResidual(row)).append('\n');
        }
        return sb.toString();
    }

    /** The branch as JSON lines. */
    public static String jsonLines(TraceResult r) {
        StringBuilder sb = new StringBuilder();
        for (BranchRow row : r.rows()) {
            sb.append(ResultJson.write(rowMap(r, row))).append('\n');
        }
        return sb.toString();
    }

    /** One row as an ordered map. */
    public static Map<String, Object> rowMap(TraceResult r, BranchRow row) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("row", row.row());
        m.put("step", row.step());
        m.put("arclength", ResultJson.num(row.arclength()));
        m.put(r.options().name(), ResultJson.num(row.parameter()));
        m.put("m_norm", ResultJson.num(row.norm()));
        Map<String, Object> max = new LinkedHashMap<>();
        row.max().forEach((k, v) -> max.put(k, ResultJson.num(v)));
        m.put("max", max);
        m.put("growth_rate", ResultJson.num(row.growthRate()));
        m.put("frequency", ResultJson.num(row.frequency()));
        m.put("stability", row.stability());
        m.put("label", row.label());
        List<Object> ev = new ArrayList<>();
        for (Eigenvalue e : row.eigenvalues()) {
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("re", ResultJson.num(e.re()));
            x.put("im", ResultJson.num(e.im()));
            x.put("residual", ResultJson.num(e.residual()));
            ev.add(x);
        }
        m.put("eigenvalues", ev);
        return m;
    }

    static double worstResidual(BranchRow row) {
        double w = 0;
        for (Eigenvalue e : row.eigenvalues()) {
            w = Math.max(w, e.residual());
        }
        return w;
    }

    /** The state file text. */
    public static String states(TraceResult r) {
        StringBuilder sb = new StringBuilder();
        for (BranchRow row : r.rows()) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("row", row.row());
            m.put("step", row.step());
            m.put("arclength", row.arclength());
            m.put("parameter_name", r.options().name());
            m.put("parameter", row.parameter());
            m.put("label", row.label());
            m.put("next_step", row.nextStep());
            m.put("unknowns", row.point().u().length);
            m.put("u", row.point().u());
            m.put("tangent_u", row.point().tangentU());
            m.put("tangent_p", row.point().tangentP());
            sb.append(ResultJson.write(m)).append('\n');
        }
        return sb.toString();
    }

    /**
     * Reads row {@code k} of a state file.
     *
     * @param file      the state file (or a branch file whose state file sits beside it)
     * @param parameter the parameter being traced (must match the file's)
     */
    public static RestartPoint readRow(Path file, int k, String parameter) {
        Path f = file;
        if (!f.getFileName().toString().endsWith(".states") && Files.exists(statesOf(f))) {
            f = statesOf(f);
        }
        List<String> lines;
        try {
            lines = Files.readAllLines(f);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + f + ": " + e.getMessage(), e);
        }
        for (int i = 0; i < lines.size(); i++) {
            String line = lines.get(i);
            if (line.isBlank()) {
                continue;
            }
            JsonNode n;
            try {
                n = MAPPER.readTree(line);
            } catch (IOException e) {
                throw new InputException(f.toString(), "line " + (i + 1), "a JSON object of a trace state file");
            }
            if (n.path("row").asInt(-1) != k) {
                continue;
            }
            String where = "line " + (i + 1);
            if (!parameter.equals(n.path("parameter_name").asText())) {
                throw new InputException(f.toString(), where, "a state of parameter '" + parameter + "', found '"
                        + n.path("parameter_name").asText() + "'");
            }
            double[] u = numbers(n, "u", f, where);
            double[] t = numbers(n, "tangent_u", f, where);
            if (u.length != t.length || u.length != n.path("unknowns").asInt(-1)) {
                throw new InputException(f.toString(), where, "u and tangent_u of length 'unknowns'");
            }
            BranchPoint p = new BranchPoint(u, number(n, "parameter", f, where), t, number(n, "tangent_p", f, where), 0, Double.NaN);
            return new RestartPoint(k, n.path("step").asInt(), number(n, "arclength", f, where), p,
                    number(n, "next_step", f, where), n.path("label").asText(""));
        }
        throw new InputException(f.toString(), "--row " + k, "a row number present in the file");
    }

    private static double number(JsonNode n, String key, Path f, String where) {
        JsonNode v = n.get(key);
        if (v == null || !v.isNumber()) {
            throw new InputException(f.toString(), where + " key " + key, "a number");
        }
        return v.asDouble();
    }

    private static double[] numbers(JsonNode n, String key, Path f, String where) {
        JsonNode v = n.get(key);
        if (v == null || !v.isArray()) {
            throw new InputException(f.toString(), where + " key " + key, "a list of numbers");
        }
        double[] a = new double[v.size()];
        for (int i = 0; i < a.length; i++) {
            if (!v.get(i).isNumber()) {
                throw new InputException(f.toString(), where + " key " + key + "[" + i + "]", "a number");
            }
            a[i] = v.get(i).asDouble();
        }
        return a;
    }
}
