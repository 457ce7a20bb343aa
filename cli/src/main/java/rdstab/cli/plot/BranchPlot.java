package rdstab.cli.plot;

import java.awt.Color;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.knowm.xchart.AnnotationText;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * The branch diagram of a continuation: a measure of the steady state (its norm or maximum) against the
 * parameter, stable stretches solid, unstable stretches dashed (same colour, so the difference survives grey-scale
 * print and colour blindness), special points as black squares labelled in words ("fold", "Hopf") just above them.
 * Where stability changes between two points, both neighbouring stretches share the switching segment's end points
 * so the curve stays connected.
 */
public final class BranchPlot {

    /**
     * A special point.
     *
     * @param parameter parameter value
     * @param value     the measure there
     * @param text      its name in words, e.g. "fold" or "Hopf"
     */
    public record Label(double parameter, double value, String text) {
    }

    private BranchPlot() {
    }

    /**
     * Builds the chart.
     *
     * @param paramName   x axis title (with unit if any)
     * @param measureName y axis title, e.g. "max u [K]"
     * @param p           parameter along the branch (in arclength order; may turn back at folds)
     * @param measure     the measure at each point
     * @param stable      stability of each point
     * @param special     special points to mark (may be empty)
     */
    public static XYChart chart(String paramName, String measureName, double[] p, double[] measure, boolean[] stable,
                                List<Label> special) {
        int n = p.length;
        if (n < 2 || measure.length != n || stable.length != n) {
            throw new IllegalArgumentException("a branch needs at least 2 points with a measure and a stability each");
        }
        XYChart c = PlotStyle.xy("Steady branch", paramName, measureName);
        boolean stableShown = false;
        boolean unstableShown = false;
        int start = 0;
        int piece = 0;
        for (int i = 1; i <= n; i++) {
            if (i == n || stable[i] != stable[start]) {
                int end = Math.min(i, n - 1); // include the next point so stretches join
                boolean st = stable[start];
                List<Double> xs = new ArrayList<>();
                List<Double> ys = new ArrayList<>();
                for (int k = start; k <= end; k++) {
                    xs.add(p[k]);
                    ys.add(measure[k]);
                }
                XYSeries s = c.addSeries("piece " + piece++, xs, ys);
                s.setMarker(SeriesMarkers.NONE);
                s.setLineColor(Palette.line(0));
                s.setLineStyle(st ? PlotStyle.SOLID : PlotStyle.DASHED);
                boolean show = st ? !stableShown : !unstableShown;
                s.setShowInLegend(show);
                s.setLabel(st ? "stable (solid)" : "unstable (dashed)");
                stableShown |= st;
                unstableShown |= !st;
                start = i;
            }
        }
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (double v : measure) {
            lo = Math.min(lo, v);
            hi = Math.max(hi, v);
        }
        double span = hi - lo > 0 ? hi - lo : Math.max(1, Math.abs(hi));
        c.getStyler().setYAxisMin(lo - 0.05 * span);
        c.getStyler().setYAxisMax(hi + 0.12 * span);
        if (!special.isEmpty()) {
            double[] sx = new double[special.size()];
            double[] sy = new double[special.size()];
            for (int k = 0; k < sx.length; k++) {
                Label l = special.get(k);
                sx[k] = l.parameter();
                sy[k] = l.value();
                c.addAnnotation(new AnnotationText(l.text(), l.parameter(), l.value() + 0.05 * span, false));
            }
            XYSeries s = c.addSeries("special points", sx, sy);
            s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
            s.setMarker(SeriesMarkers.SQUARE);
            s.setMarkerColor(Color.BLACK);
        }
        return c;
    }

    /** Writes {@code dir/branch.png} and {@code .svg} with the y axis titled "max of the base state". */
    public static List<Path> write(Path dir, String paramName, double[] p, double[] measure, boolean[] stable,
                                   List<Label> specialPoints) {
        return write(dir, paramName, "max of the base state", p, measure, stable, specialPoints, true);
    }

    /** Writes {@code dir/branch.png} and {@code .svg}. */
    public static List<Path> write(Path dir, String paramName, String measureName, double[] p, double[] measure,
                                   boolean[] stable, List<Label> specialPoints, boolean overwrite) {
        return PlotFiles.save(chart(paramName, measureName, p, measure, stable, specialPoints), dir, "branch", overwrite);
    }
}
