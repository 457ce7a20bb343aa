package rdstab.cli.plot;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.knowm.xchart.XYChart;
import rdstab.solver.verify.GridStudyResult;
import rdstab.solver.verify.RichardsonEstimate;

/**
 * The picture of a grid study (rdstab converge --plots DIR): {@code convergence}, the relative error
 * |f_h − f_ext| / |f_ext| of the growth rate Re λ₁ and of the base-state maximum of each field against the mesh
 * spacing h/L = 1/cells, on log₁₀ axes, where f_ext is the Richardson-extrapolated value of the study.
 *
 * <p>Why this error: with f_ext = f₁ + (f₁ − f₂)/(r^p − 1) the two finest errors are |f₁ − f₂|/(r^p − 1) and
 * |f₁ − f₂|·r^p/(r^p − 1), so the slope between them is exactly the order p used for the extrapolation; the coarser
 * levels show whether the error follows that slope over the whole range (the asymptotic range). Dividing by |f_ext|
 * shifts each line vertically only (slopes unchanged) and puts quantities of different units on one axis; when
 * f_ext = 0 the absolute error is drawn instead and the legend says so.
 *
 * <p>A quantity that does not change with the grid above round-off (status ROUND_OFF) has no error to draw and is left
 * out, as is one with a zero error on some level (its values coincide with the extrapolation there); {@link #write}
 * returns the reasons with the files.
 */
public final class ConvergePlots {

    private ConvergePlots() {
    }

    /**
     * What was drawn.
     *
     * @param files   the files written (empty when nothing could be drawn)
     * @param omitted one plain sentence per quantity left out
     */
    public record Written(List<Path> files, List<String> omitted) {
    }

    /** Writes {@code convergence.png} and {@code .svg} into dir. */
    public static Written write(GridStudyResult r, Path dir, boolean overwrite) {
        List<String> omitted = new ArrayList<>();
        List<ConvergencePlot.Series> s = series(r, omitted);
        if (s.isEmpty()) {
            return new Written(List.of(), omitted);
        }
        return new Written(PlotFiles.save(chart(s), dir, "convergence", overwrite), omitted);
    }

    /** The chart of the given series. */
    public static XYChart chart(List<ConvergencePlot.Series> s) {
        return ConvergencePlot.chart(s, "mesh spacing h/L = 1/cells", "relative error |f_h − f_ext| / |f_ext|");
    }

    /** The quantities that can be drawn: Re λ₁ first, then the base maximum of each field in case order. */
    public static List<ConvergencePlot.Series> series(GridStudyResult r, List<String> omitted) {
        double[] h = new double[r.levels().size()];
        for (int i = 0; i < h.length; i++) {
            h[i] = 1.0 / r.levels().get(i).cells();
        }
        List<ConvergencePlot.Series> out = new ArrayList<>();
        GridStudyResult.Tracked t = r.tracked().get(0);
        add(out, omitted, "growth rate Re λ₁", h, t.re(), t.estimate());
        List<String> fields = r.reportedCheck().problem().theCase().fieldNames();
        for (String f : fields) {
            GridStudyResult.Quantity q = r.baseMax().get(f);
            if (q != null) {
                add(out, omitted, "max " + f, h, q.values(), q.estimate());
            }
        }
        for (Map.Entry<String, GridStudyResult.Quantity> e : r.baseMax().entrySet()) {
            if (!fields.contains(e.getKey())) {
                add(out, omitted, "max " + e.getKey(), h, e.getValue().values(), e.getValue().estimate());
            }
        }
        return out;
    }

    private static void add(List<ConvergencePlot.Series> out, List<String> omitted, String name, double[] h,
                            double[] values, RichardsonEstimate e) {
        if (e.status() == RichardsonEstimate.Status.ROUND_OFF) {
            omitted.add(name + " does not change with the grid above round-off: not drawn");
            return;
        }
        double ext = e.extrapolated();
        double scale = ext == 0 ? 1 : Math.abs(ext);
        double[] err = new double[values.length];
        for (int i = 0; i < err.length; i++) {
            err[i] = Math.abs(values[i] - ext) / scale;
            if (!(err[i] > 0)) {
                omitted.add(name + " equals its extrapolated value on the " + (int) Math.round(1 / h[i])
                        + "-cell grid (no error to draw on a log axis): not drawn");
                return;
            }
        }
        String label = ext == 0 ? name + ", absolute error" : name;
        out.add(new ConvergencePlot.Series(label, h, err, orderText(e)));
    }

    /** "observed order 2.003", or the order used and why when the observed one was not accepted. */
    static String orderText(RichardsonEstimate e) {
        String p = Double.isNaN(e.observed()) ? "undefined" : String.format(java.util.Locale.ROOT, "%.3f", e.observed());
        return switch (e.status()) {
            case OBSERVED -> "observed order " + p;
            case OSCILLATORY -> "values oscillate; formal order " + PlotStyle.number(e.order(), 3) + " used";
            case OUT_OF_BAND -> "observed order " + p + " not accepted; formal order " + PlotStyle.number(e.order(), 3) + " used";
            case ROUND_OFF -> "unchanged above round-off";
        };
    }
}
