package rdstab.cli.plot;

import java.awt.Color;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import javax.measure.Unit;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;
import rdstab.solver.continuation.BranchRow;
import rdstab.solver.continuation.SpecialPoint;
import rdstab.solver.continuation.SpecialPointKind;
import rdstab.solver.continuation.TraceResult;
import rdstab.solver.model.Case;
import rdstab.solver.model.FieldSpec;
import rdstab.solver.units.QuantityParser;

/**
 * The pictures of a trace (rdstab trace --plots DIR):
 * <ul>
 *   <li>{@code branch}: the chosen measure of the steady state against the parameter, stable stretches solid, unstable
 *       dashed, folds, stationary crossings and Hopf points marked and named in words;</li>
 *   <li>{@code branch-growth}: the growth rate Re λ₁ along the branch against the parameter, same line styles and
 *       marks, with Re λ = 0 drawn: it passes through zero at every marked point.</li>
 * </ul>
 * The parameter is shown in the unit the case gave it in (the trace itself runs in SI).
 *
 * <p>Stability of a row: "unstable" is unstable; "stable" is stable; a "marginal" row (a special point, where the
 * crossing eigenvalue is within its band of zero) takes the stability of the next non-marginal row, so the stretch
 * after the point gets the style it has, and the stretch before it ends exactly at the point.
 */
public final class TracePlots {

    private TracePlots() {
    }

    /**
     * What the branch diagram draws on its y axis.
     *
     * @param field the field whose maximum is drawn, or null for the M-norm of the whole state
     */
    public record Measure(String field) {

        /**
         * Reads a measure: "norm" (the M-norm), "max" (the maximum of the first field) or "max:NAME".
         *
         * @throws IllegalArgumentException with a plain message naming the choices
         */
        public static Measure parse(String text, Case c) {
            String t = text == null ? "max" : text.trim();
            if (t.equals("norm")) {
                return new Measure(null);
            }
            if (t.equals("max")) {
                return new Measure(c.fieldNames().get(0));
            }
            if (t.startsWith("max:") && c.fieldNames().contains(t.substring(4).trim())) {
                return new Measure(t.substring(4).trim());
            }
            throw new IllegalArgumentException("--measure expects norm, max or max:FIELD with FIELD one of "
                    + String.join(", ", c.fieldNames()) + "; found '" + text + "'");
        }

        /** The measure of one row. */
        public double of(BranchRow r) {
            return field == null ? r.norm() : r.max().get(field);
        }

        /** The y axis title, with the field's unit when it has one. */
        public String title(Case c) {
            if (field == null) {
                return "M-norm of the state, √(Σ wᵢuᵢ² / Σ wᵢ)";
            }
            for (FieldSpec f : c.fields()) {
                if (f.name().equals(field)) {
                    return PlotStyle.withUnit("max " + field, f.unit());
                }
            }
            return "max " + field;
        }
    }

    /** Writes {@code branch} and {@code branch-growth} (PNG and SVG) into dir; returns the paths written. */
    public static List<Path> write(TraceResult r, Measure m, Path dir, boolean overwrite) {
        List<Path> out = new ArrayList<>(PlotFiles.save(branch(r, m), dir, "branch", overwrite));
        out.addAll(PlotFiles.save(growth(r), dir, "branch-growth", overwrite));
        return out;
    }

    /** The branch diagram. */
    public static XYChart branch(TraceResult r, Measure m) {
        List<BranchRow> rows = r.rows();
        double[] y = new double[rows.size()];
        for (int i = 0; i < y.length; i++) {
            y[i] = m.of(rows.get(i));
        }
        XYChart c = BranchPlot.chart(parameterTitle(r), m.title(r.theCase()), parameters(r), y, stability(rows),
                labels(r, y));
        c.setTitle("Steady states along " + r.options().name());
        return c;
    }

    /** Growth rate along the branch against the parameter, with the line Re λ = 0. */
    public static XYChart growth(TraceResult r) {
        List<BranchRow> rows = r.rows();
        double[] g = new double[rows.size()];
        for (int i = 0; i < g.length; i++) {
            g[i] = rows.get(i).growthRate();
        }
        double[] p = parameters(r);
        XYChart c = BranchPlot.chart(parameterTitle(r), "growth rate Re λ₁ (per unit time)", p, g, stability(rows),
                labels(r, g));
        c.setTitle("Growth rate along the branch");
        double lo = p[0];
        double hi = p[0];
        for (double v : p) {
            lo = Math.min(lo, v);
            hi = Math.max(hi, v);
        }
        XYSeries zero = c.addSeries("Re λ = 0 (above it a disturbance grows)", new double[] {lo, hi}, new double[] {0, 0});
        zero.setMarker(SeriesMarkers.NONE);
        zero.setLineColor(Color.GRAY);
        zero.setLineStyle(PlotStyle.THIN);
        return c;
    }

    /** The parameter of each row in the unit the case gave it in. */
    static double[] parameters(TraceResult r) {
        Unit<?> u = r.theCase().physical().units().get(r.options().name());
        double[] p = new double[r.rows().size()];
        for (int i = 0; i < p.length; i++) {
            double si = r.rows().get(i).parameter();
            p[i] = u == null ? si : QuantityParser.fromSi(si, u);
        }
        return p;
    }

    static String parameterTitle(TraceResult r) {
        return PlotStyle.withUnit(r.options().name(), r.theCase().unitText(r.options().name()));
    }

    /** Stability per row, marginal rows taking that of the next decided row (else the previous; else stable). */
    static boolean[] stability(List<BranchRow> rows) {
        int n = rows.size();
        Boolean[] next = new Boolean[n];
        Boolean seen = null;
        for (int i = n - 1; i >= 0; i--) {
            String st = rows.get(i).stability();
            if (!"marginal".equals(st)) {
                seen = !"unstable".equals(st);
            }
            next[i] = seen;
        }
        boolean[] s = new boolean[n];
        Boolean prev = null;
        for (int i = 0; i < n; i++) {
            String st = rows.get(i).stability();
            if (!"marginal".equals(st)) {
                prev = !"unstable".equals(st);
            }
            s[i] = next[i] != null ? next[i] : prev == null || prev;
        }
        return s;
    }

    /** Labels of the special points at the plotted value y of their rows. */
    static List<BranchPlot.Label> labels(TraceResult r, double[] y) {
        double[] p = parameters(r);
        List<BranchPlot.Label> out = new ArrayList<>();
        for (SpecialPoint sp : r.specialPoints()) {
            int i = indexOf(r.rows(), sp.row());
            if (i >= 0) {
                out.add(new BranchPlot.Label(p[i], y[i], words(sp)));
            }
        }
        return out;
    }

    static String words(SpecialPoint sp) {
        String w = sp.kind().word();
        if (sp.kind() == SpecialPointKind.HOPF && Double.isFinite(sp.frequency())) {
            w += ", ω = " + PlotStyle.number(sp.frequency(), 3);
        }
        return sp.located() ? w : w + " (not located)";
    }

    private static int indexOf(List<BranchRow> rows, int row) {
        for (int i = 0; i < rows.size(); i++) {
            if (rows.get(i).row() == row) {
                return i;
            }
        }
        return -1;
    }
}
