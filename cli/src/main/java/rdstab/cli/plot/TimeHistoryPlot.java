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

    /**
     * One simulated run.
     *
     * @param label     legend text, e.g. "A = 0.01: runaway"
     * @param t         times, increasing
     * @param amplitude the disturbance amplitude at each time (samples with amplitude &le; 0 are left out: a log
     *                  axis cannot show them)
     */
    public record History(String label, double[] t, double[] amplitude) {
    }

    /** How far beyond the simulated amplitudes a prediction line is drawn (factor; it is cut there). */
    static final double PREDICTION_MARGIN = 3;

    /**
     * Several runs on one log axis, each solid in its own colour with its linear prediction a(0)·e^{λt} dashed in the
     * same colour over the run's time span. Prediction lines are cut where they leave the simulated amplitude range by
     * more than {@value #PREDICTION_MARGIN} times, so a fast-growing prediction does not squash the data into a corner.
     *
     * @param yTitle     y axis title
     * @param growthRate Re λ of the mode (NaN: no predictions)
     */
    public static XYChart chart(List<History> runs, String yTitle, double growthRate) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        double t0 = Double.POSITIVE_INFINITY;
        double t1 = Double.NEGATIVE_INFINITY;
        List<double[][]> kept = new java.util.ArrayList<>();
        for (History h : runs) {
            double[][] d = positive(h);
            kept.add(d);
            for (int i = 0; i < d[0].length; i++) {
                lo = Math.min(lo, d[1][i]);
                hi = Math.max(hi, d[1][i]);
                t0 = Math.min(t0, d[0][i]);
                t1 = Math.max(t1, d[0][i]);
            }
        }
        if (!(hi > 0) || !(t1 > t0)) {
            throw new IllegalArgumentException("a time history needs at least 2 times with a positive amplitude");
        }
        XYChart c = PlotStyle.xy("Disturbance amplitude over time", "time t", yTitle);
        c.getStyler().setYAxisLogarithmic(true);
        c.getStyler().setyAxisTickLabelsFormattingFunction(null); // a custom function breaks XChart's log ticks
        if (runs.size() > 1) {
            c.getStyler().setLegendLayout(org.knowm.xchart.style.Styler.LegendLayout.Vertical);
        }
        boolean predictionNamed = false;
        for (int k = 0; k < runs.size(); k++) {
            double[][] d = kept.get(k);
            if (d[0].length < 2) {
                continue;
            }
            XYSeries s = c.addSeries(runs.get(k).label(), d[0], d[1]);
            s.setMarker(SeriesMarkers.NONE);
            s.setLineColor(Palette.line(k));
            s.setLineStyle(PlotStyle.SOLID);
            if (Double.isFinite(growthRate)) {
                double[][] pr = prediction(d, growthRate, lo / PREDICTION_MARGIN, hi * PREDICTION_MARGIN);
                XYSeries l = c.addSeries(predictionNamed ? "prediction " + k
                        : "dashed, same colour: linear prediction a(0)·e^(Re λ t), Re λ = " + PlotStyle.number(growthRate, 4),
                        pr[0], pr[1]);
                l.setMarker(SeriesMarkers.NONE);
                l.setLineColor(Palette.line(k));
                l.setLineStyle(PlotStyle.DASHED);
                l.setShowInLegend(!predictionNamed);
                predictionNamed = true;
            }
        }
        c.getStyler().setXAxisMin(t0);
        c.getStyler().setXAxisMax(t1);
        PlotStyle.thinX(c, t0, t1);
        return c;
    }

    /** Writes {@code dir/time-history.png} and {@code .svg} for several runs. */
    public static List<Path> write(Path dir, List<History> runs, String yTitle, double growthRate, boolean overwrite) {
        return PlotFiles.save(chart(runs, yTitle, growthRate), dir, "time-history", overwrite);
    }

    private static double[][] positive(History h) {
        int n = Math.min(h.t().length, h.amplitude().length);
        int m = 0;
        for (int i = 0; i < n; i++) {
            m += h.amplitude()[i] > 0 && Double.isFinite(h.amplitude()[i]) ? 1 : 0;
        }
        double[][] d = new double[2][m];
        m = 0;
        for (int i = 0; i < n; i++) {
            if (h.amplitude()[i] > 0 && Double.isFinite(h.amplitude()[i])) {
                d[0][m] = h.t()[i];
                d[1][m++] = h.amplitude()[i];
            }
        }
        return d;
    }

    /**
     * The line a(t₀)·e^{λ(t − t₀)} from the run's first to its last time, as its two end points (on a log axis the
     * exponential is straight, so two points draw it exactly and the dash pattern stays even); where it would leave
     * [lo, hi] it ends exactly on the bound, at the time t₀ + ln(bound/a(t₀))/λ where the exponential reaches it.
     */
    static double[][] prediction(double[][] d, double rate, double lo, double hi) {
        int n = d[0].length;
        double t0 = d[0][0];
        double a0 = d[1][0];
        double t1 = d[0][n - 1];
        double a1 = a0 * Math.exp(rate * (t1 - t0));
        if (a1 > hi || a1 < lo) {
            a1 = a1 > hi ? hi : lo;
            t1 = t0 + Math.log(a1 / a0) / rate;
        }
        return new double[][] {{t0, t1}, {a0, a1}};
    }

    /** A number to 3 significant digits in the shortest form: "1e-4" rather than "1.00e-04", "0.01", "-0.1". */
    public static String compact(double v) {
        double a = Math.abs(v);
        if (v == 0 || (a >= 1e-3 && a < 1e6)) {
            return PlotStyle.number(v, 3);
        }
        String s = String.format(java.util.Locale.ROOT, "%.2e", v);
        int e = s.indexOf('e');
        String mant = s.substring(0, e).replaceAll("\\.?0+$", "");
        int exp = Integer.parseInt(s.substring(e + 1));
        return mant + "e" + exp;
    }
}
