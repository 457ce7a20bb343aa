package rdstab.cli.plot;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.knowm.xchart.HeatMapChart;
import org.knowm.xchart.HeatMapChartBuilder;
import org.knowm.xchart.style.HeatMapStyler;
import org.knowm.xchart.style.Styler;

/**
 * A 2D field as a colour map with a colour bar, drawn by the plotting library's heat-map facility from a
 * {@link Raster} (the P1 / bilinear interpolant sampled on a fine pixel grid; pixels outside the body stay
 * white). Sequential data (base states) use {@link Palette#SEQUENTIAL}; signed data (modes, growth rates) use
 * {@link Palette#DIVERGING} on a range symmetric about zero, so zero is white.
 *
 * <p>Axis ticks: the heat map labels pixel columns, so each "nice" tick value (1, 2, 5 × 10^k steps) is written
 * under the column whose centre is nearest to it — off by at most half a pixel column (0.25 % of the width at
 * the PNG resolution of {@link #PNG_PIXELS}).
 */
public final class FieldMapPlot {

    /** Pixels along the longer side of the body for PNG pictures. */
    public static final int PNG_PIXELS = 200;
    /** Pixels along the longer side for SVG pictures (each pixel is one SVG rectangle; this keeps files near 1 MB). */
    public static final int SVG_PIXELS = 90;

    private FieldMapPlot() {
    }

    /**
     * Builds the chart.
     *
     * @param title     chart title (say what is shown and its unit)
     * @param xTitle    x axis title with unit
     * @param yTitle    y axis title with unit
     * @param r         the sampled field
     * @param diverging true for signed data (diverging palette, symmetric range), false for the sequential one
     */
    public static HeatMapChart chart(String title, String xTitle, String yTitle, Raster r, boolean diverging) {
        int plotW = PlotStyle.WIDTH - 260;
        double aspect = (r.ymax() - r.ymin()) / (r.xmax() - r.xmin());
        int height = (int) Math.max(380, Math.min(900, plotW * aspect + 150));
        return chart(title, xTitle, yTitle, r, diverging, height);
    }

    /**
     * Builds the chart with a given picture height (for parameter maps, whose axes have unrelated units; the
     * other form sizes the picture so the body keeps its proportions).
     */
    public static HeatMapChart chart(String title, String xTitle, String yTitle, Raster r, boolean diverging, int height) {
        double[] range = r.range();
        if (Double.isNaN(range[0])) {
            throw new IllegalArgumentException("the colour map of '" + title + "' has no pixel inside the body");
        }
        double lo;
        double hi;
        if (diverging) {
            hi = roundAway(Math.max(Math.abs(range[0]), Math.abs(range[1])));
            hi = hi > 0 ? hi : 1;
            lo = -hi;
        } else {
            lo = roundAway(range[0]);
            hi = roundAway(range[1]);
            if (!(hi > lo)) {
                double pad = Math.max(1e-12, Math.abs(lo) * 1e-6);
                lo -= pad;
                hi += pad;
            }
        }
        HeatMapChart c = new HeatMapChartBuilder().width(PlotStyle.WIDTH).height(height).title(title)
                .xAxisTitle(xTitle).yAxisTitle(yTitle).build();
        HeatMapStyler s = c.getStyler();
        PlotStyle.apply(s);
        s.setRangeColors(diverging ? Palette.DIVERGING : Palette.SEQUENTIAL);
        s.setMin(lo);
        s.setMax(hi);
        s.setDrawBorder(false);
        s.setShowValue(false);
        s.setPlotGridLinesVisible(false);
        s.setAxisTicksMarksVisible(false);
        s.setPlotBorderVisible(false);
        s.setAntiAlias(false);
        s.setLegendPosition(Styler.LegendPosition.OutsideE);
        s.setGradientColorColumnHeight(Math.max(120, height - 220));
        List<String> xs = labels(r.columns(), r.xmin(), r.xmax());
        List<String> ys = labels(r.rows(), r.ymin(), r.ymax());
        List<Number[]> data = new ArrayList<>();
        for (int i = 0; i < r.columns(); i++) {
            for (int j = 0; j < r.rows(); j++) {
                double v = r.value()[i][j];
                if (!Double.isNaN(v)) {
                    data.add(new Number[] {i, j, v});
                }
            }
        }
        c.addSeries(title, xs, ys, data);
        return c;
    }

    /**
     * Samples the nodal field twice (PNG and SVG resolution) and writes {@code dir/name.png} and {@code .svg}.
     *
     * @return the two paths written
     */
    public static List<Path> write(Path dir, String name, String title, String xTitle, String yTitle, double[] x,
                                   double[] y, int[][] cells, double[] values, boolean diverging, boolean overwrite) {
        Path png = dir.resolve(name + ".png");
        Path svg = dir.resolve(name + ".svg");
        HeatMapChart fine = chart(title, xTitle, yTitle, Raster.sample(x, y, cells, values, PNG_PIXELS), diverging);
        HeatMapChart coarse = chart(title, xTitle, yTitle, Raster.sample(x, y, cells, values, SVG_PIXELS), diverging);
        rdstab.cli.output.AtomicFiles.write(png, PlotFiles.png(fine), overwrite);
        rdstab.cli.output.AtomicFiles.write(svg, PlotFiles.svg(coarse), overwrite);
        return List.of(png, svg);
    }

    /** Column (or row) labels: blank except under the columns nearest the nice tick values. */
    static List<String> labels(int n, double lo, double hi) {
        List<String> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            out.add(" ");
        }
        double step = niceStep((hi - lo) / 6);
        double d = (hi - lo) / n;
        for (double t = Math.ceil(lo / step - 1e-9) * step; t <= hi + 1e-9 * step; t += step) {
            int i = Math.max(0, Math.min(n - 1, (int) Math.round((t - lo) / d - 0.5)));
            if (Math.abs(lo + (i + 0.5) * d - t) <= 0.5 * d * (1 + 1e-9)) {
                out.set(i, PlotStyle.tick(Math.abs(t) < 1e-9 * step ? 0 : t));
            }
        }
        return out;
    }

    /** The 1, 2, 5 × 10^k step nearest above {@code raw}. */
    static double niceStep(double raw) {
        double p = Math.pow(10, Math.floor(Math.log10(raw)));
        double m = raw / p;
        return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * p;
    }

    /** Rounds a colour-bar end away from zero to 3 significant digits, so the bar's labels are short. */
    static double roundAway(double v) {
        if (v == 0 || !Double.isFinite(v)) {
            return v;
        }
        double p = Math.pow(10, Math.floor(Math.log10(Math.abs(v))) - 2);
        double r = (v > 0 ? Math.ceil(v / p - 1e-9) : Math.floor(v / p + 1e-9)) * p;
        return Double.parseDouble(PlotStyle.number(r, 3));
    }
}
