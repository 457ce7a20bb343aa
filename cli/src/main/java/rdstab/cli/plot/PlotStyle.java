package rdstab.cli.plot;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.math.BigDecimal;
import java.math.MathContext;
import java.util.Locale;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.style.AxesChartStyler;
import org.knowm.xchart.style.Styler;

/**
 * The look shared by every plot: white background, sans-serif fonts large enough to read on a printed page
 * (title 18 px, axis titles 16 px, ticks and legend 14 px at the default 900 × 560 size), light grid, legend
 * outside the plot area so it never covers data, and axis titles that carry units.
 */
public final class PlotStyle {

    /** Default picture width in pixels. */
    public static final int WIDTH = 900;
    /** Default picture height in pixels. */
    public static final int HEIGHT = 560;

    /** Dashed stroke for unstable branches and reference lines. */
    public static final BasicStroke DASHED = new BasicStroke(2.5f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f,
            new float[] {9f, 6f}, 0f);
    /** Solid stroke for data lines. */
    public static final BasicStroke SOLID = new BasicStroke(2.5f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND);
    /** Thin dotted stroke for boundaries and zero lines. */
    public static final BasicStroke THIN = new BasicStroke(1.5f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f,
            new float[] {4f, 4f}, 0f);

    private PlotStyle() {
    }

    /** A new XY chart with the shared style. */
    public static XYChart xy(String title, String xTitle, String yTitle) {
        XYChart c = new XYChartBuilder().width(WIDTH).height(HEIGHT).title(title).xAxisTitle(xTitle).yAxisTitle(yTitle).build();
        apply(c.getStyler());
        c.getStyler().setLegendPosition(Styler.LegendPosition.OutsideS);
        c.getStyler().setLegendLayout(Styler.LegendLayout.Horizontal);
        c.getStyler().setMarkerSize(8);
        c.getStyler().setXAxisTickMarkSpacingHint(160);
        c.getStyler().setYAxisTickMarkSpacingHint(60);
        c.getStyler().setxAxisTickLabelsFormattingFunction(PlotStyle::tick);
        c.getStyler().setyAxisTickLabelsFormattingFunction(PlotStyle::tick);
        return c;
    }

    /**
     * Labels only the x ticks on a coarse 1-2-5 step (about six labels over [lo, hi]); the library places ticks
     * about every 40 pixels whatever its spacing hint, which crowds the labels. Grid lines stay at every tick.
     */
    public static void thinX(XYChart c, double lo, double hi) {
        if (!(hi > lo)) {
            return;
        }
        double step = FieldMapPlot.niceStep((hi - lo) / 6);
        double eps = 1e-9 * (hi - lo);
        c.getStyler().setxAxisTickLabelsFormattingFunction(v -> {
            if (Math.abs(v - lo) <= eps || Math.abs(v - hi) <= eps) {
                return tick(v); // the library sizes its tick spacing from the labels of the axis ends
            }
            double k = v / step;
            return Math.abs(k - Math.rint(k)) < 1e-6 ? tick(Math.abs(v) < 1e-9 * step ? 0 : v) : "";
        });
    }

    /** Applies fonts, colours and borders. */
    public static void apply(AxesChartStyler s) {
        s.setChartBackgroundColor(Color.WHITE);
        s.setPlotBackgroundColor(Color.WHITE);
        s.setPlotBorderColor(Color.GRAY);
        s.setPlotGridLinesColor(new Color(0xdddddd));
        s.setChartFontColor(Color.BLACK);
        s.setChartTitleFont(new Font(Font.SANS_SERIF, Font.BOLD, 18));
        s.setAxisTitleFont(new Font(Font.SANS_SERIF, Font.PLAIN, 16));
        s.setAxisTickLabelsFont(new Font(Font.SANS_SERIF, Font.PLAIN, 14));
        s.setLegendFont(new Font(Font.SANS_SERIF, Font.PLAIN, 14));
        s.setAnnotationTextFont(new Font(Font.SANS_SERIF, Font.BOLD, 14));
        s.setAnnotationTextFontColor(Color.BLACK);
        s.setLegendBorderColor(Color.LIGHT_GRAY);
        s.setChartPadding(12);
        s.setAxisTickMarkLength(4);
    }

    /** "name [unit]", or the name alone when the unit is empty or null. */
    public static String withUnit(String name, String unit) {
        return unit == null || unit.isBlank() ? name : name + " [" + unit.trim() + "]";
    }

    /** A tick label: up to 4 significant digits, no exponent clutter in the usual range. */
    public static String tick(double v) {
        return number(v, 4);
    }

    /** A number to the given significant digits (plain in 1e-3 .. 1e6, else scientific). */
    public static String number(double v, int digits) {
        if (v == 0 || Math.abs(v) < 1e-300) {
            return "0";
        }
        if (!Double.isFinite(v)) {
            return Double.toString(v);
        }
        double a = Math.abs(v);
        if (a >= 1e-3 && a < 1e6) {
            return new BigDecimal(v).round(new MathContext(digits)).stripTrailingZeros().toPlainString();
        }
        return String.format(Locale.ROOT, "%." + (digits - 1) + "e", v);
    }

    /** An eigenvalue as "a", "a ± b i" style text for legends (conjugate pairs are shown once). */
    public static String eigenvalue(double re, double im) {
        if (im == 0 || Math.abs(im) <= 1e-12 * Math.max(1, Math.abs(re))) {
            return number(re, 5);
        }
        return number(re, 5) + (im < 0 ? " − " : " + ") + number(Math.abs(im), 4) + "i";
    }
}
