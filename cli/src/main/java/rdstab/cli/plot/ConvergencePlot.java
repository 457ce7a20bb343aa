package rdstab.cli.plot;

import java.awt.Color;
import java.nio.file.Path;
import java.util.List;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * A grid study on log–log axes (plotted as log₁₀ values on linear axes, so every axis carries readable ticks
 * even when the levels span less than a decade, and a slope reads directly as an order): the error (against the
 * extrapolated value) per mesh spacing, with a dashed
 * slope-2 reference line through the finest level (the order expected of the second-order schemes) and, in the
 * legend, the order observed between the two finest levels, p = ln(e₁/e₂) / ln(h₁/h₂).
 */
public final class ConvergencePlot {

    private ConvergencePlot() {
    }

    /**
     * Builds the chart.
     *
     * @param h     mesh spacings (any order), all &gt; 0
     * @param error error at each spacing, all &gt; 0 (log axis)
     */
    public static XYChart chart(double[] h, double[] error) {
        int n = h.length;
        if (n < 2 || error.length != n) {
            throw new IllegalArgumentException("a convergence plot needs at least 2 levels, each with an error");
        }
        int fine = 0;
        int next = -1;
        for (int i = 0; i < n; i++) {
            if (!(h[i] > 0) || !(error[i] > 0)) {
                throw new IllegalArgumentException("log axes need h > 0 and error > 0; level " + (i + 1) + " has h = "
                        + h[i] + ", error = " + error[i]);
            }
            if (h[i] < h[fine]) {
                fine = i;
            }
        }
        for (int i = 0; i < n; i++) {
            if (i != fine && (next < 0 || h[i] < h[next])) {
                next = i;
            }
        }
        double order = Math.log(error[next] / error[fine]) / Math.log(h[next] / h[fine]);
        XYChart c = PlotStyle.xy("Grid convergence", "log₁₀ of mesh spacing h", "log₁₀ of error");
        double[] lh = new double[n];
        double[] le = new double[n];
        double hMax = h[0];
        for (int i = 0; i < n; i++) {
            lh[i] = Math.log10(h[i]);
            le[i] = Math.log10(error[i]);
            hMax = Math.max(hMax, h[i]);
        }
        XYSeries s = c.addSeries("error (observed order " + PlotStyle.number(order, 3) + ")", lh, le);
        s.setMarker(SeriesMarkers.CIRCLE);
        s.setMarkerColor(Palette.line(0));
        s.setLineColor(Palette.line(0));
        s.setLineStyle(PlotStyle.SOLID);
        XYSeries ref = c.addSeries("slope 2 (reference)", new double[] {lh[fine], Math.log10(hMax)},
                new double[] {le[fine], le[fine] + 2 * (Math.log10(hMax) - lh[fine])});
        ref.setMarker(SeriesMarkers.NONE);
        ref.setLineColor(Color.DARK_GRAY);
        ref.setLineStyle(PlotStyle.DASHED);
        return c;
    }

    /** Writes {@code dir/convergence.png} and {@code .svg}. */
    public static List<Path> write(Path dir, double[] h, double[] error) {
        return PlotFiles.save(chart(h, error), dir, "convergence", true);
    }

    /** How far (decades) the slope-2 reference of the several-quantity chart lies below the data. */
    static final double REFERENCE_GAP = 0.3;

    /**
     * One quantity of a grid study.
     *
     * @param name      what it is, e.g. "Re λ₁" or "max T"
     * @param h         mesh spacing of each level, all &gt; 0
     * @param error     error of each level, all &gt; 0
     * @param orderText the order as the legend should give it, e.g. "observed order 2.01" (the caller knows whether
     *                  the order was confirmed)
     */
    public record Series(String name, double[] h, double[] error, String orderText) {
    }

    /**
     * Several quantities of one study on shared log₁₀ axes, each with markers and its own colour, and a dashed
     * slope-2 reference starting {@value #REFERENCE_GAP} decades below the lowest finest-level point (below the data,
     * so that a quantity converging at order 2 is not hidden under it).
     *
     * @param xTitle x axis title (the log₁₀ is added)
     * @param yTitle y axis title (the log₁₀ is added)
     */
    public static XYChart chart(List<Series> series, String xTitle, String yTitle) {
        if (series.isEmpty()) {
            throw new IllegalArgumentException("a convergence plot needs at least one quantity");
        }
        XYChart c = PlotStyle.xy("Grid convergence", "log₁₀ of " + xTitle, "log₁₀ of " + yTitle);
        double refX0 = Double.NaN;
        double refY0 = Double.NaN;
        double hMax = Double.NEGATIVE_INFINITY;
        for (int k = 0; k < series.size(); k++) {
            Series q = series.get(k);
            int n = q.h().length;
            if (n < 2 || q.error().length != n) {
                throw new IllegalArgumentException(q.name() + ": a convergence plot needs at least 2 levels, each with an error");
            }
            double[] lh = new double[n];
            double[] le = new double[n];
            int fine = 0;
            for (int i = 0; i < n; i++) {
                if (!(q.h()[i] > 0) || !(q.error()[i] > 0)) {
                    throw new IllegalArgumentException(q.name() + ": log axes need h > 0 and error > 0; level " + (i + 1)
                            + " has h = " + q.h()[i] + ", error = " + q.error()[i]);
                }
                lh[i] = Math.log10(q.h()[i]);
                le[i] = Math.log10(q.error()[i]);
                hMax = Math.max(hMax, q.h()[i]);
                fine = q.h()[i] < q.h()[fine] ? i : fine;
            }
            if (k == 0 || le[fine] < refY0) {
                refX0 = lh[fine];
                refY0 = le[fine];
            }
            XYSeries s = c.addSeries(q.name() + " (" + q.orderText() + ")", lh, le);
            s.setMarker(k % 2 == 0 ? SeriesMarkers.CIRCLE : SeriesMarkers.DIAMOND);
            s.setMarkerColor(Palette.line(k));
            s.setLineColor(Palette.line(k));
            s.setLineStyle(PlotStyle.SOLID);
        }
        double lhMax = Math.log10(hMax);
        refY0 -= REFERENCE_GAP;
        XYSeries ref = c.addSeries("slope 2 (reference)", new double[] {refX0, lhMax},
                new double[] {refY0, refY0 + 2 * (lhMax - refX0)});
        ref.setMarker(SeriesMarkers.NONE);
        ref.setLineColor(Color.DARK_GRAY);
        ref.setLineStyle(PlotStyle.DASHED);
        return c;
    }

    /** Writes {@code dir/convergence.png} and {@code .svg} for several quantities. */
    public static List<Path> write(Path dir, List<Series> series, String xTitle, String yTitle, boolean overwrite) {
        return PlotFiles.save(chart(series, xTitle, yTitle), dir, "convergence", overwrite);
    }
}
