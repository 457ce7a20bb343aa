package rdstab.cli.output;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import rdstab.solver.sweep.NeutralCurve;
import rdstab.solver.sweep.PointStatus;
import rdstab.solver.sweep.SweepGrid;

/**
 * The neutral curve of a complete two-parameter sweep as CSV: one row per value of the first
 * parameter with the critical value of the second, its kind and the grid bracket it came from
 * (see {@link NeutralCurve} for the refinement and its error).
 */
public final class NeutralCurveFile {

    private NeutralCurveFile() {
    }

    /**
     * Reads the rows of a complete sweep's JSON-lines file, computes the curve and writes it.
     *
     * @return the curve
     * @throws IllegalArgumentException when a point is missing (an unfinished sweep or a single shard)
     */
    public static List<NeutralCurve.Entry> write(Path jsonl, SweepGrid grid, Path target) throws IOException {
        int n = grid.points();
        PointStatus[] status = new PointStatus[n];
        double[] growth = new double[n];
        double[] freq = new double[n];
        Arrays.fill(growth, Double.NaN);
        Arrays.fill(freq, Double.NaN);
        for (SweepFiles.Line l : SweepFiles.read(jsonl, false, 0).lines()) {
            JsonNode row = SweepFiles.MAPPER.readTree(l.text());
            int p = l.point();
            if (p < 0 || p >= n) {
                continue;
            }
            status[p] = PointStatus.of(row.get("status").asText());
            if (status[p] == PointStatus.OK) {
                growth[p] = row.get("growth_rate").asDouble();
                freq[p] = row.path("leading").path(0).path("im").asDouble(0);
            }
        }
        for (int p = 0; p < n; p++) {
            if (status[p] == null) {
                throw new IllegalArgumentException("the neutral curve needs every point of the sweep; point " + p
                        + " is missing from " + jsonl + " (run the whole sweep, or merge the shards first)");
            }
        }
        List<NeutralCurve.Entry> curve = NeutralCurve.compute(grid, status, growth, freq);
        String a = grid.axes().get(0).name();
        String b = grid.axes().get(1).name();
        StringBuilder sb = new StringBuilder(a + "," + b + "_critical,kind," + b + "_low," + b + "_high\n");
        for (NeutralCurve.Entry e : curve) {
            sb.append(e.first()).append(',').append(num(e.value())).append(',').append(e.kind()).append(',')
                    .append(num(e.low())).append(',').append(num(e.high())).append('\n');
        }
        AtomicFiles.write(target, sb.toString(), true);
        return curve;
    }

    private static String num(double v) {
        return Double.isFinite(v) ? Double.toString(v) : "";
    }
}
