package rdstab.cli.plot;

import java.nio.file.Path;
import java.util.List;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * Curves over one coordinate: a base-state profile per field, or several modes on one chart (each curve a
 * colour of {@link Palette#LINES}, the legend below the plot area). The x axis spans the data exactly, so the
 * first and last drawn points sit on the left and right edges of the plot area.
 */
public final class ProfilePlot {

    /**
     * One curve.
     *
     * @param label legend text (e.g. "mode 1, λ = −2.47")
     * @param y     values at the shared x positions
     */
    public record Curve(String label, double[] y) {
    }

    private ProfilePlot() {
    }

    /**
     * Builds the chart.
     *
     * @param title  chart title
     * @param xTitle x axis title with unit
     * @param yTitle y axis title with unit
     * @param x      positions, increasing
     * @param curves at least one curve, each as long as x
     */
    public static XYChart chart(String title, String xTitle, String yTitle, double[] x, List<Curve> curves) {
        if (curves.isEmpty()) {
            throw new IllegalArgumentException("a profile plot needs at least one curve");
        }
        XYChart c = PlotStyle.xy(title, xTitle, yTitle);
        int k = 0;
        for (Curve cv : curves) {
            if (cv.y().length != x.length) {
                throw new IllegalArgumentException("curve '" + cv.label() + "' has " + cv.y().length + " values for "
                        + x.length + " positions");
            }
            XYSeries s = c.addSeries(cv.label(), x, cv.y());
            s.setMarker(SeriesMarkers.NONE);
            s.setLineColor(Palette.line(k++));
            s.setLineStyle(PlotStyle.SOLID);
        }
        c.getStyler().setLegendVisible(curves.size() > 1);
        c.getStyler().setXAxisMin(x[0]);
        c.getStyler().setXAxisMax(x[x.length - 1]);
        PlotStyle.thinX(c, x[0], x[x.length - 1]);
        return c;
    }

    /** Builds the chart and writes {@code dir/name.png} and {@code .svg}; returns the paths. */
    public static List<Path> write(Path dir, String name, String title, String xTitle, String yTitle, double[] x,
                                   List<Curve> curves, boolean overwrite) {
        return PlotFiles.save(chart(title, xTitle, yTitle, x, curves), dir, name, overwrite);
    }
}
