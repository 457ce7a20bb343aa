package rdstab.cli.plot;

import java.awt.Color;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * A one-parameter sweep: growth rate (max Re λ) against the swept parameter, with the stable ranges (growth &lt; 0)
 * shaded blue and the unstable ranges (growth &gt; 0) shaded orange. Between two neighbouring points of opposite
 * sign the range is split at the linear-interpolation zero, the sweep's own estimate of the neutral point.
 * Points without a result (status other than ok / stable / unstable / marginal, or a non-finite growth rate) are
 * drawn as crosses on the zero line and no range is shaded across them: the picture claims nothing where the
 * sweep found nothing.
 */
public final class GrowthCurvePlot {

    private GrowthCurvePlot() {
    }

    /**
     * Builds the chart.
     *
     * @param paramName the swept parameter as the x axis title (with unit if any)
     * @param p         parameter values, increasing
     * @param growth    growth rate at each value (NaN where none)
     * @param status    status word of each point (null = ok)
     */
    public static XYChart chart(String paramName, double[] p, double[] growth, String[] status) {
        int n = p.length;
        if (n < 2 || growth.length != n || (status != null && status.length != n)) {
            throw new IllegalArgumentException("a growth curve needs at least 2 points and as many growth rates and statuses");
        }
        boolean[] ok = new boolean[n];
        double lo = 0;
        double hi = 0;
        List<Double> badP = new ArrayList<>();
        List<Double> goodP = new ArrayList<>();
        List<Double> goodG = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            ok[i] = Double.isFinite(growth[i]) && valid(status == null ? null : status[i]);
            if (ok[i]) {
                lo = Math.min(lo, growth[i]);
                hi = Math.max(hi, growth[i]);
                goodP.add(p[i]);
                goodG.add(growth[i]);
            } else {
                badP.add(p[i]);
            }
        }
        double pad = 0.08 * (hi - lo > 0 ? hi - lo : 1);
        double top = hi + pad;
        double bottom = lo - pad;
        XYChart c = PlotStyle.xy("Growth rate across the sweep", paramName, "growth rate max Re λ (per unit time)");
        bands(c, p, growth, ok, bottom, top);
        XYSeries zero = c.addSeries("neutral: growth rate 0", new double[] {p[0], p[n - 1]}, new double[] {0, 0});
        zero.setMarker(SeriesMarkers.NONE);
        zero.setLineColor(Color.DARK_GRAY);
        zero.setLineStyle(PlotStyle.THIN);
        zero.setShowInLegend(false);
        if (!goodP.isEmpty()) {
            XYSeries s = c.addSeries("growth rate", goodP, goodG);
            s.setMarker(SeriesMarkers.CIRCLE);
            s.setMarkerColor(Color.BLACK);
            s.setLineColor(Color.BLACK);
            s.setLineStyle(PlotStyle.SOLID);
        }
        if (!badP.isEmpty()) {
            XYSeries b = c.addSeries("no steady state or not converged", badP, new ArrayList<>(java.util.Collections.nCopies(badP.size(), 0.0)));
            b.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
            b.setMarker(SeriesMarkers.CROSS);
            b.setMarkerColor(Palette.line(3));
        }
        c.getStyler().setXAxisMin(p[0]);
        c.getStyler().setXAxisMax(p[n - 1]);
        c.getStyler().setYAxisMin(bottom);
        c.getStyler().setYAxisMax(top);
        PlotStyle.thinX(c, p[0], p[n - 1]);
        return c;
    }

    /** Writes {@code dir/growth.png} and {@code .svg}. */
    public static List<Path> write(Path dir, String paramName, double[] p, double[] growth, String[] status) {
        return PlotFiles.save(chart(paramName, p, growth, status), dir, "growth", true);
    }

    static boolean valid(String status) {
        if (status == null) {
            return true;
        }
        String s = status.toLowerCase(Locale.ROOT);
        return s.equals("ok") || s.equals("stable") || s.equals("unstable") || s.equals("marginal");
    }

    /** Adds one filled area per stable or unstable range. */
    private static void bands(XYChart c, double[] p, double[] g, boolean[] ok, double bottom, double top) {
        List<double[]> ranges = new ArrayList<>(); // {from, to, sign}
        for (int i = 0; i + 1 < p.length; i++) {
            if (!ok[i] || !ok[i + 1]) {
                continue;
            }
            double a = p[i];
            double b = p[i + 1];
            double sa = Math.signum(g[i]);
            double sb = Math.signum(g[i + 1]);
            if (sa == sb || sa == 0 || sb == 0) {
                add(ranges, a, b, sa != 0 ? sa : sb);
            } else {
                double z = a - g[i] * (b - a) / (g[i + 1] - g[i]);
                add(ranges, a, z, sa);
                add(ranges, z, b, sb);
            }
        }
        boolean stableShown = false;
        boolean unstableShown = false;
        int k = 0;
        for (double[] r : ranges) {
            if (r[2] == 0) {
                continue;
            }
            boolean unstable = r[2] > 0;
            boolean show = unstable ? !unstableShown : !stableShown;
            Color fill = unstable ? Palette.UNSTABLE_FILL : Palette.STABLE_FILL;
            // XChart fills an area series between its line and y = 0: one series above and one below zero
            // cover the whole height of the plot area.
            for (double edge : new double[] {top, bottom}) {
                String name = (unstable ? "unstable range" : "stable range") + (k++ == 0 ? "" : "#" + k);
                XYSeries s = c.addSeries(name, new double[] {r[0], r[1]}, new double[] {edge, edge});
                s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Area);
                s.setMarker(SeriesMarkers.NONE);
                s.setFillColor(fill);
                s.setLineColor(new Color(fill.getRed(), fill.getGreen(), fill.getBlue(), 160));
                s.setLineWidth(6f);
                s.setShowInLegend(show && edge == top);
                if (show && edge == top) {
                    s.setLabel(unstable ? "unstable range (growth rate > 0)" : "stable range (growth rate < 0)");
                }
            }
            stableShown |= !unstable;
            unstableShown |= unstable;
        }
    }

    private static void add(List<double[]> ranges, double a, double b, double sign) {
        if (!ranges.isEmpty()) {
            double[] last = ranges.get(ranges.size() - 1);
            if (last[2] == sign && last[1] == a) {
                last[1] = b;
                return;
            }
        }
        ranges.add(new double[] {a, b, sign});
    }
}
