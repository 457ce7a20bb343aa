package rdstab.cli.plot;

import java.awt.Color;
import java.nio.file.Path;
import java.util.List;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * The computed eigenvalues in the complex plane: the stability boundary Re λ = 0 drawn as a dashed vertical line,
 * every eigenvalue as a circle and the rightmost one (the growth rate) as a larger diamond named in the legend.
 * The horizontal range always includes 0, so the distance of the rightmost eigenvalue from the boundary (the
 * margin) is visible.
 */
public final class SpectrumPlot {

    private SpectrumPlot() {
    }

    /**
     * Builds the chart.
     *
     * @param re real parts, rightmost first
     * @param im imaginary parts
     */
    public static XYChart chart(String title, double[] re, double[] im) {
        if (re.length == 0 || re.length != im.length) {
            throw new IllegalArgumentException("a spectrum plot needs eigenvalues with as many real as imaginary parts");
        }
        int lead = 0;
        double x0 = 0;
        double x1 = 0;
        double ymax = 0;
        for (int i = 0; i < re.length; i++) {
            if (re[i] > re[lead]) {
                lead = i;
            }
            x0 = Math.min(x0, re[i]);
            x1 = Math.max(x1, re[i]);
            ymax = Math.max(ymax, Math.abs(im[i]));
        }
        double padX = 0.08 * (x1 - x0 > 0 ? x1 - x0 : Math.max(1, Math.abs(x0)));
        double yTop = ymax > 0 ? 1.15 * ymax : 1;
        XYChart c = PlotStyle.xy(title, "Re λ (growth rate, per unit time)", "Im λ (angular frequency)");
        XYSeries all = c.addSeries("eigenvalues", re, im);
        all.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        all.setMarker(SeriesMarkers.CIRCLE);
        all.setMarkerColor(Palette.line(0));
        XYSeries top = c.addSeries("rightmost: λ = " + PlotStyle.eigenvalue(re[lead], im[lead]),
                new double[] {re[lead]}, new double[] {im[lead]});
        top.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        top.setMarker(SeriesMarkers.DIAMOND);
        top.setMarkerColor(Palette.line(1));
        XYSeries zero = c.addSeries("stability boundary Re λ = 0", new double[] {0, 0}, new double[] {-yTop, yTop});
        zero.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        zero.setMarker(SeriesMarkers.NONE);
        zero.setLineColor(Color.BLACK);
        zero.setLineStyle(PlotStyle.THIN);
        c.getStyler().setMarkerSize(11);
        c.getStyler().setXAxisMin(x0 - padX);
        c.getStyler().setXAxisMax(x1 + padX);
        c.getStyler().setYAxisMin(-yTop);
        c.getStyler().setYAxisMax(yTop);
        PlotStyle.thinX(c, x0 - padX, x1 + padX);
        return c;
    }

    /** Writes {@code dir/spectrum.png} and {@code .svg}. */
    public static List<Path> write(Path dir, double[] re, double[] im, boolean overwrite) {
        return PlotFiles.save(chart("Rightmost eigenvalues of J x = λ M x", re, im), dir, "spectrum", overwrite);
    }
}
