package rdstab.cli.report;

import static rdstab.cli.report.ResultJson.num;
import static rdstab.cli.report.TextReport.sig;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.verify.GridStudyResult;
import rdstab.solver.verify.RichardsonEstimate;

/** Text and JSON of a grid-convergence study (rdstab converge, and the grid part of check --verify). */
public final class GridReport {

    private GridReport() {
    }

    /** The full text report of rdstab converge. */
    public static void write(GridStudyResult r, PrintWriter w) {
        var c = r.reportedCheck().problem().theCase();
        w.println(c.title());
        w.println("case " + c.source() + " | " + c.shape().word() + " | " + TextReport.parameters(c));
        w.println();
        w.printf(Locale.ROOT, "GRID STUDY: %d levels, growth rate %s ± %.2e on the %d-cell grid — %s%n", r.levels().size(),
                sig(r.growthRate(), 8), r.growthBand(), r.levels().get(r.reported()).cells(), resolvedWords(r));
        w.println();
        levels(r, w);
        w.println();
        estimates(r, w);
        w.println();
        w.println("Formulas: p = ln((f3 − f2)/(f2 − f1))/ln r; extrapolated f1 + (f1 − f2)/(r^p − 1); "
                + "GCI = Fs |f2 − f1|/(r^p − 1), Fs = 1.25 (Roache 1994; ASME V&V 20).");
        w.println("Eigenvalues are followed from the finest grid by mode overlap |<a,b>_M|/(|a||b|), not by position.");
        trailer(r.warnings(), r.reportedCheck().assessment().cautions(), w);
        w.flush();
    }

    /** The short grid section printed under a check --verify report. */
    public static void writeSection(GridStudyResult r, PrintWriter w) {
        w.println();
        RichardsonEstimate e = r.tracked().get(0).estimate();
        w.printf(Locale.ROOT, "Grid convergence (levels %s cells; the requested grid is the %s)%n", cellsList(r),
                r.reported() == r.levels().size() - 2 ? "middle one" : r.reported() == r.levels().size() - 1 ? "finest" : "coarsest");
        w.printf(Locale.ROOT, "  growth rate      %s ± %.2e  (grid error band: GCI plus the eigenvalue band) — %s%n",
                sig(r.growthRate(), 8), r.growthBand(), resolvedWords(r));
        w.printf(Locale.ROOT, "  observed order   %s%s%n", Double.isNaN(e.observed()) ? "undefined" : String.format(Locale.ROOT, "%.3f", e.observed()),
                e.note().isEmpty() ? "" : "  (" + e.note() + ")");
        w.printf(Locale.ROOT, "  extrapolated     %s   (Richardson, from the three levels)%n", sig(e.extrapolated(), 10));
        for (String s : r.warnings()) {
            w.println("  - " + s);
        }
        w.flush();
    }

    static String resolvedWords(GridStudyResult r) {
        return r.resolved() ? "resolved: the grid error cannot change the sign of the growth rate"
                : "NOT resolved: the growth rate lies within its grid error band; refine the grid";
    }

    static String cellsList(GridStudyResult r) {
        List<String> s = new ArrayList<>();
        for (GridStudyResult.Level l : r.levels()) {
            s.add(Integer.toString(l.cells()));
        }
        return String.join(", ", s);
    }

    private static void levels(GridStudyResult r, PrintWriter w) {
        List<String> fields = r.reportedCheck().problem().theCase().fieldNames();
        StringBuilder head = new StringBuilder("    cells  unknowns");
        for (int t = 1; t <= r.tracked().size(); t++) {
            head.append(String.format(Locale.ROOT, "  %16s  %7s", "Re λ" + t, "overlap"));
        }
        for (String f : fields) {
            head.append(String.format(Locale.ROOT, "  %14s", "max " + f));
        }
        w.println(head);
        for (int k = 0; k < r.levels().size(); k++) {
            GridStudyResult.Level l = r.levels().get(k);
            StringBuilder row = new StringBuilder(String.format(Locale.ROOT, "  %7d  %8d", l.cells(), l.unknowns()));
            for (GridStudyResult.Tracked t : r.tracked()) {
                row.append(String.format(Locale.ROOT, "  %16s  %7.4f", sig(t.re()[k], 10), t.overlap()[k]));
            }
            for (String f : fields) {
                row.append(String.format(Locale.ROOT, "  %14s", sig(r.baseMax().get(f).values()[k], 9)));
            }
            w.println(row);
        }
    }

    private static void estimates(GridStudyResult r, PrintWriter w) {
        w.println("  quantity          observed p   order used   extrapolated        GCI (finest)   note");
        int i = 1;
        for (GridStudyResult.Tracked t : r.tracked()) {
            estimateRow("Re λ" + i++, t.estimate(), w);
        }
        r.baseMax().forEach((f, q) -> estimateRow("max " + f, q.estimate(), w));
    }

    private static void estimateRow(String name, RichardsonEstimate e, PrintWriter w) {
        w.printf(Locale.ROOT, "  %-16s  %10s   %10s   %-18s  %.2e       %s%n", name,
                Double.isNaN(e.observed()) ? "-" : String.format(Locale.ROOT, "%.3f", e.observed()),
                Double.isNaN(e.order()) ? "-" : String.format(Locale.ROOT, "%.3f", e.order()),
                sig(e.extrapolated(), 12), e.gciFine(), e.note().isEmpty() ? "" : e.note());
    }

    static void trailer(List<String> warnings, List<String> cautions, PrintWriter w) {
        if (!warnings.isEmpty()) {
            w.println();
            w.println("Warnings");
            for (String s : warnings) {
                w.println("  - " + s);
            }
        }
        w.println();
        w.println("Cautions");
        for (String s : cautions) {
            w.println("  - " + s);
        }
    }

    /** The "grid" object (also the body of converge --json, with cautions added there). */
    public static Map<String, Object> toMap(GridStudyResult r) {
        Map<String, Object> m = new LinkedHashMap<>();
        List<Object> levels = new ArrayList<>();
        for (int k = 0; k < r.levels().size(); k++) {
            GridStudyResult.Level l = r.levels().get(k);
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("cells", l.cells());
            x.put("unknowns", l.unknowns());
            x.put("growth_rate", num(r.tracked().get(0).re()[k]));
            List<Object> eig = new ArrayList<>();
            for (GridStudyResult.Tracked t : r.tracked()) {
                Map<String, Object> e = new LinkedHashMap<>();
                e.put("re", num(t.re()[k]));
                e.put("im", num(t.im()[k]));
                e.put("overlap", num(t.overlap()[k]));
                e.put("residual", num(t.residual()[k]));
                eig.add(e);
            }
            x.put("tracked", eig);
            Map<String, Object> max = new LinkedHashMap<>();
            l.check().baseMax().forEach((f, v) -> max.put(f, num(v)));
            x.put("base_max", max);
            x.put("newton_residual", num(l.check().base().residual()));
            x.put("worst_eigen_residual", num(l.check().modes().stream().mapToDouble(EigenPair::residual).max().orElse(Double.NaN)));
            levels.add(x);
        }
        m.put("levels", levels);
        m.put("reported_cells", r.levels().get(r.reported()).cells());
        RichardsonEstimate lead = r.tracked().get(0).estimate();
        m.put("order", num(lead.order()));
        m.put("observed_order", num(lead.observed()));
        m.put("extrapolated", num(lead.extrapolated()));
        m.put("gci", num(lead.gciFine()));
        m.put("band", num(r.growthBand()));
        m.put("resolved", r.resolved());
        List<Object> tracked = new ArrayList<>();
        for (GridStudyResult.Tracked t : r.tracked()) {
            tracked.add(estimate(t.estimate(), t.orders()));
        }
        m.put("eigenvalues", tracked);
        Map<String, Object> max = new LinkedHashMap<>();
        r.baseMax().forEach((f, q) -> max.put(f, estimate(q.estimate(), q.orders())));
        m.put("base_max", max);
        m.put("warnings", r.warnings());
        return m;
    }

    static Map<String, Object> estimate(RichardsonEstimate e, double[] orders) {
        Map<String, Object> x = new LinkedHashMap<>();
        x.put("finest", num(e.f1()));
        x.put("observed_order", num(e.observed()));
        List<Object> o = new ArrayList<>();
        for (double v : orders) {
            o.add(num(v));
        }
        x.put("orders_per_triple", o);
        x.put("order", num(e.order()));
        x.put("status", e.status().name().toLowerCase(Locale.ROOT).replace('_', ' '));
        x.put("safety_factor", e.safetyFactor());
        x.put("extrapolated", num(e.extrapolated()));
        x.put("gci_finest", num(e.gciFine()));
        x.put("gci_medium", num(e.gciMedium()));
        x.put("note", e.note());
        return x;
    }

    /** CSV: one row per level: cells, unknowns, then Re, Im, overlap, residual of each followed eigenvalue, then base maxima. */
    public static String csv(GridStudyResult r) {
        List<String> fields = r.reportedCheck().problem().theCase().fieldNames();
        StringBuilder sb = new StringBuilder("level,cells,unknowns");
        for (int t = 1; t <= r.tracked().size(); t++) {
            sb.append(",re").append(t).append(",im").append(t).append(",overlap").append(t).append(",residual").append(t);
        }
        for (String f : fields) {
            sb.append(",max_").append(f);
        }
        sb.append('\n');
        for (int k = 0; k < r.levels().size(); k++) {
            GridStudyResult.Level l = r.levels().get(k);
            sb.append(k + 1).append(',').append(l.cells()).append(',').append(l.unknowns());
            for (GridStudyResult.Tracked t : r.tracked()) {
                sb.append(',').append(t.re()[k]).append(',').append(t.im()[k]).append(',').append(t.overlap()[k])
                  .append(',').append(String.format(Locale.ROOT, "%.3e", t.residual()[k]));
            }
            for (String f : fields) {
                sb.append(',').append(r.baseMax().get(f).values()[k]);
            }
            sb.append('\n');
        }
        return sb.toString();
    }
}
