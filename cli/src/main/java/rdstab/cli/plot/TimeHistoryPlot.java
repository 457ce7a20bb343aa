package rdstab.cli.plot;

import java.awt.Color;
import java.nio.file.Path;
import java.util.List;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * A time history of a disturbance on a logarithmic amplitude axis, where exponential growth or decay is a straight
 * line: the simulated amplitude ‖u(t) − ū‖ and, dashed, the linear prediction A(0)·e^{λt} from the leading
 * eigenvalue λ. Agreement early on checks the eigenvalue; departure later shows the nonlinearity.
 */
public final class TimeHistoryPlot {

    private TimeHistoryPlot() {
    }

    /**
     * Builds the chart.
     *
     * @param t          times, increasing
     * @param amplitude  disturbance amplitude at each time, &gt; 0
     * @param growthRate leading Re λ for the prediction line, or NaN for none
     */
    public static XYChart chart(double[] t, double[] amplitude, double growthRate) {
        int n = t.length;
        if (n < 2 || amplitude.length != n) {
            throw new IllegalArgumentException("a time history needs at least 2 times, each with an amplitude");
        }
        for (int i = 0; i < n; i++) {
            if (!(amplitude[i] > 0)) {
                throw new IllegalArgumentException("a log axis needs amplitudes > 0; at t = " + t[i] + " it is " + amplitude[i]);
            }
        }
        XYChart c = PlotStyle.xy("Disturbance amplitude", "time", "amplitude ‖u − ū‖ (log scale)");
        c.getStyler().setYAxisLogarithmic(true);
        c.getStyler().setyAxisTickLabelsFormattingFunction(null);
        XYSeries s = c.addSeries("simulated", t, amplitude);
        s.setMarker(SeriesMarkers.NONE);
        s.setLineColor(Palette.line(0));
        s.setLineStyle(PlotStyle.SOLID);
        if (Double.isFinite(growthRate)) {
            double[] pred = new double[n];
            for (int i = 0; i < n; i++) {
                pred[i] = amplitude[0] * Math.exp(growthRate * (t[i] - t[0]));
            }
            XYSeries l = c.addSeries("linear prediction e^(λt), Re λ = " + PlotStyle.number(growthRate, 4), t, pred);
            l.setMarker(SeriesMarkers.NONE);
            l.setLineColor(Color.DARK_GRAY);
            l.setLineStyle(PlotStyle.DASHED);
        }
        c.getStyler().setXAxisMin(t[0]);
        c.getStyler().setXAxisMax(t[n - 1]);
        PlotStyle.thinX(c, t[0], t[n - 1]);
        return c;
    }

    /** Writes {@code dir/time-history.png} and {@code .svg}. */
    public static List<Path> write(Path dir, double[] t, double[] amplitude, double growthRate) {
        return PlotFiles.save(chart(t, amplitude, growthRate), dir, "time-history", true);
    }
}
