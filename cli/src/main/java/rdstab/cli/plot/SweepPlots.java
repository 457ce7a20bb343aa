package rdstab.cli.plot;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import javax.measure.Unit;
import rdstab.cli.output.SweepFiles;
import rdstab.solver.model.Case;
import rdstab.solver.sweep.Axis;
import rdstab.solver.sweep.CriticalPoint;
import rdstab.solver.sweep.SweepGrid;
import rdstab.solver.units.QuantityParser;

/**
 * Pictures of sweeps and critical-value searches: the growth rate against the swept parameter with
 * stable and unstable ranges shaded (one parameter), or the growth-rate map with the neutral curve
 * (two parameters). Parameter values are shown in the unit the case gave them.
 */
public final class SweepPlots {

    private SweepPlots() {
    }

    /** Axis title of a parameter, with its unit when the case gives one. */
    static String title(Case c, String name) {
        String u = c.unitText(name);
        return u.isEmpty() ? name : name + " [" + u + "]";
    }

    /** A parameter value in the case's unit. */
    static double display(Case c, String name, double si) {
        Unit<?> u = c.physical().units().get(name);
        return u == null ? si : QuantityParser.fromSi(si, u);
    }

    /**
     * Draws a finished sweep from its JSON-lines file.
     *
     * @return the files written
     * @throws IllegalArgumentException when points are missing (a shard: merge first)
     */
    public static List<Path> write(Case c, SweepGrid grid, Path jsonl, Path dir) throws IOException {
        int n = grid.points();
        double[] growth = new double[n];
        String[] status = new String[n];
        Arrays.fill(growth, Double.NaN);
        for (SweepFiles.Line l : SweepFiles.read(jsonl, false, 0).lines()) {
            JsonNode row = new com.fasterxml.jackson.databind.ObjectMapper().readTree(l.text());
            int p = l.point();
            if (p < 0 || p >= n) {
                continue;
            }
            String st = row.get("status").asText();
            status[p] = "ok".equals(st) ? row.path("verdict").asText("ok") : st;
            if ("ok".equals(st)) {
                growth[p] = row.get("growth_rate").asDouble();
            }
        }
        for (int p = 0; p < n; p++) {
            if (status[p] == null) {
                throw new IllegalArgumentException("pictures need every point of the sweep; point " + p + " is missing from "
                        + jsonl + " (run the whole sweep, or merge the shards first)");
            }
        }
        List<Axis> axes = grid.axes();
        Axis a = axes.get(0);
        double[] av = new double[a.count()];
        for (int i = 0; i < av.length; i++) {
            av[i] = display(c, a.name(), a.value(i));
        }
        if (axes.size() == 1) {
            return GrowthCurvePlot.write(dir, title(c, a.name()), av, growth, status);
        }
        Axis b = axes.get(1);
        double[] bv = new double[b.count()];
        for (int j = 0; j < bv.length; j++) {
            bv[j] = display(c, b.name(), b.value(j));
        }
        double[][] g = new double[av.length][bv.length];
        for (int i = 0; i < av.length; i++) {
            for (int j = 0; j < bv.length; j++) {
                g[i][j] = growth[i + av.length * j];
            }
        }
        return GrowthMapPlot.write(dir, title(c, a.name()), title(c, b.name()), av, bv, g);
    }

    /** Draws the coarse scan of a critical-value search (growth rate against the parameter). */
    public static List<Path> write(Case c, CriticalPoint r, Path dir) {
        List<CriticalPoint.ScanPoint> scan = r.scan();
        double[] p = new double[scan.size()];
        double[] g = new double[scan.size()];
        String[] st = new String[scan.size()];
        for (int i = 0; i < p.length; i++) {
            CriticalPoint.ScanPoint s = scan.get(i);
            p[i] = display(c, r.parameter(), s.value());
            g[i] = s.exists() ? s.growthRate() : Double.NaN;
            st[i] = !s.exists() ? "no steady state" : s.growthRate() > 0 ? "unstable" : "stable";
        }
        return GrowthCurvePlot.write(dir, title(c, r.parameter()), p, g, st);
    }
}
