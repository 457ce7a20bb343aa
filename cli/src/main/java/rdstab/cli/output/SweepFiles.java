package rdstab.cli.output;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import rdstab.cli.report.ResultJson;
import rdstab.solver.assess.SafetyCautions;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.sweep.PointOutcome;
import rdstab.solver.sweep.PointStatus;

/**
 * The two files of a sweep, one row per point, in point order:
 *
 * <ul>
 *   <li>CSV: line 1 is {@code # rdstab sweep } followed by the specification as JSON; line 2 the
 *       column names; then one row per point. Numbers in Java's shortest round-trip decimal form,
 *       empty where there is no value; the message is the last column, quoted.</li>
 *   <li>JSON lines: line 1 is {@code {"sweep": specification}}; then one object per point: "point",
 *       "status", the result JSON of the interface contract (verdict, growth_rate, leading, base,
 *       energy, unknowns, parameters, cautions, ...) and "message".</li>
 * </ul>
 *
 * <p>A line is complete when it ends with a line feed and parses (CSV: the right number of columns
 * and the expected point number first; JSON: an object with that "point"). Anything after the
 * last complete line is a torn write and is cut off when a sweep resumes.
 */
public final class SweepFiles {

    /** Prefix of the first CSV line. */
    public static final String CSV_MARK = "# rdstab sweep ";
    /** Leading modes written per CSV row. */
    public static final int CSV_MODES = 3;

    static final ObjectMapper MAPPER = new ObjectMapper();

    private SweepFiles() {
    }

    /** The CSV and JSON-lines paths of an output name: FILE.csv (or FILE when it ends in .csv) and FILE.jsonl. */
    public static Path[] paths(Path out) {
        String name = out.getFileName().toString();
        String stem = name.endsWith(".csv") ? name.substring(0, name.length() - 4)
                : name.endsWith(".jsonl") ? name.substring(0, name.length() - 6) : name;
        return new Path[] {out.resolveSibling(stem + ".csv"), out.resolveSibling(stem + ".jsonl")};
    }

    /** The CSV column names. */
    public static List<String> columns(List<String> parameters, List<String> fields) {
        List<String> c = new ArrayList<>();
        c.add("point");
        c.addAll(parameters);
        c.add("status");
        c.add("verdict");
        c.add("growth_rate");
        for (int k = 1; k <= CSV_MODES; k++) {
            c.add("mode" + k + "_re");
            c.add("mode" + k + "_im");
            c.add("mode" + k + "_residual");
        }
        for (String f : fields) {
            c.add("base_max_" + f);
        }
        c.addAll(List.of("newton_iterations", "newton_residual", "energy_bound", "numerical_abscissa", "unknowns", "message"));
        return c;
    }

    /** First CSV line (with its line feed). */
    public static String csvHeader(String specJson, List<String> columns) {
        return CSV_MARK + specJson + "\n" + String.join(",", columns) + "\n";
    }

    /** First JSON-lines line (with its line feed). */
    public static String jsonHeader(Map<String, Object> spec) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("sweep", spec);
        return ResultJson.write(m) + "\n";
    }

    /** One CSV row (with its line feed). */
    public static String csvRow(PointOutcome o, List<String> fields) {
        StringBuilder sb = new StringBuilder();
        sb.append(o.point());
        for (double v : o.values()) {
            sb.append(',').append(v);
        }
        sb.append(',').append(o.status().word());
        CheckResult r = o.result();
        sb.append(',').append(r == null ? "" : r.assessment().verdict().word());
        sb.append(',').append(r == null ? "" : num(r.assessment().growthRate()));
        for (int k = 0; k < CSV_MODES; k++) {
            EigenPair e = r != null && k < r.modes().size() ? r.modes().get(k) : null;
            sb.append(',').append(e == null ? "" : num(e.re())).append(',').append(e == null ? "" : num(e.im()))
                    .append(',').append(e == null ? "" : num(e.residual()));
        }
        for (String f : fields) {
            sb.append(',').append(r == null ? "" : num(r.baseMax().get(f)));
        }
        sb.append(',').append(o.newtonIterations() < 0 ? "" : Integer.toString(o.newtonIterations()));
        sb.append(',').append(num(o.newtonResidual()));
        sb.append(',').append(r == null ? "" : num(r.energy().bound()));
        sb.append(',').append(r == null ? "" : num(r.energy().numericalAbscissa()));
        sb.append(',').append(r == null ? "" : Integer.toString(r.problem().full().unknowns()));
        sb.append(",\"").append(oneLine(o.message()).replace("\"", "\"\"")).append("\"\n");
        return sb.toString();
    }

    /** One JSON-lines row (with its line feed). */
    public static String jsonRow(PointOutcome o, List<String> parameterNames) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("point", o.point());
        m.put("status", o.status().word());
        if (o.result() != null) {
            m.putAll(ResultJson.toMap(o.result()));
        } else {
            m.put("verdict", null);
            m.put("growth_rate", null);
            m.put("leading", List.of());
            Map<String, Object> base = new LinkedHashMap<>();
            base.put("newton_iterations", o.newtonIterations() < 0 ? null : o.newtonIterations());
            base.put("residual", ResultJson.num(o.newtonResidual()));
            m.put("base", base);
            Map<String, Object> params = new LinkedHashMap<>();
            if (o.theCase() != null) {
                o.theCase().parameters().forEach((k, v) -> params.put(k, ResultJson.num(v)));
            } else {
                for (int a = 0; a < o.values().length; a++) {
                    params.put(parameterNames.get(a), ResultJson.num(o.values()[a]));
                }
            }
            m.put("parameters", params);
            m.put("cautions", SafetyCautions.STANDARD);
        }
        m.put("message", oneLine(o.message()));
        return ResultJson.write(m) + "\n";
    }

    private static String oneLine(String s) {
        return s == null ? "" : s.replaceAll("\\s*\\R\\s*", " ");
    }

    private static String num(Double v) {
        return v == null || !Double.isFinite(v) ? "" : Double.toString(v);
    }

    /**
     * A complete line of a sweep file.
     *
     * @param point the point number it holds
     * @param text  the line with its line feed
     * @param end   byte offset just after it
     */
    public record Line(int point, String text, long end) {
    }

    /**
     * The complete, well-formed lines of a sweep file.
     *
     * @param header    the header as found ("" when the file is shorter than a full header)
     * @param headerEnd byte offset after the header (0 when incomplete)
     * @param lines     complete data lines, in file order, up to the first bad or torn one
     * @param torn      true when something follows the last complete line
     */
    public record Contents(String header, long headerEnd, List<Line> lines, boolean torn) {
    }

    /**
     * Reads a sweep file and keeps its complete lines.
     *
     * @param file        the file
     * @param csv         true for the CSV file (two header lines), false for JSON lines (one)
     * @param columnCount CSV: columns per row (ignored for JSON)
     */
    public static Contents read(Path file, boolean csv, int columnCount) throws IOException {
        byte[] bytes = Files.readAllBytes(file);
        int headerLines = csv ? 2 : 1;
        int pos = 0;
        for (int h = 0; h < headerLines; h++) {
            int nl = indexOf(bytes, pos);
            if (nl < 0) {
                return new Contents("", 0, List.of(), bytes.length > 0);
            }
            pos = nl + 1;
        }
        String header = new String(bytes, 0, pos, StandardCharsets.UTF_8);
        List<Line> lines = new ArrayList<>();
        while (pos < bytes.length) {
            int nl = indexOf(bytes, pos);
            if (nl < 0) {
                break;
            }
            String text = new String(bytes, pos, nl + 1 - pos, StandardCharsets.UTF_8);
            int p = csv ? csvPoint(text, columnCount) : jsonPoint(text);
            if (p < 0) {
                break;
            }
            lines.add(new Line(p, text, nl + 1));
            pos = nl + 1;
        }
        return new Contents(header, headerEnd(header), lines, pos < bytes.length);
    }

    private static long headerEnd(String header) {
        return header.getBytes(StandardCharsets.UTF_8).length;
    }

    private static int indexOf(byte[] b, int from) {
        for (int i = from; i < b.length; i++) {
            if (b[i] == '\n') {
                return i;
            }
        }
        return -1;
    }

    /** The point number of a CSV row, or −1 when the row is not well formed. */
    static int csvPoint(String line, int columnCount) {
        int fields = 1;
        boolean quoted = false;
        for (int i = 0; i < line.length() - 1; i++) {
            char ch = line.charAt(i);
            if (ch == '"') {
                quoted = !quoted;
            } else if (ch == ',' && !quoted) {
                fields++;
            }
        }
        int comma = line.indexOf(',');
        if (quoted || fields != columnCount || comma <= 0 || !line.endsWith("\"\n")) {
            return -1;
        }
        try {
            return Integer.parseInt(line.substring(0, comma));
        } catch (NumberFormatException e) {
            return -1;
        }
    }

    /** The point number of a JSON row, or −1 when it does not parse. */
    static int jsonPoint(String line) {
        try {
            JsonNode n = MAPPER.readTree(line);
            return n != null && n.isObject() && n.path("point").isInt() ? n.get("point").asInt() : -1;
        } catch (IOException e) {
            return -1;
        }
    }

    /** The specification object of a JSON-lines header line (its "sweep" member), or null. */
    public static JsonNode spec(String jsonHeader) {
        try {
            JsonNode n = MAPPER.readTree(jsonHeader);
            return n == null ? null : n.get("sweep");
        } catch (IOException e) {
            return null;
        }
    }
}
