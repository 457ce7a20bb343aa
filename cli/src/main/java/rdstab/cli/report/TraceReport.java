package rdstab.cli.report;

import static rdstab.cli.report.TextReport.sig;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import rdstab.solver.continuation.BranchRow;
import rdstab.solver.continuation.SpecialPoint;
import rdstab.solver.continuation.SpecialPointKind;
import rdstab.solver.continuation.TraceResult;
import rdstab.solver.model.Case;

/** The text summary and the JSON summary object of a trace. */
public final class TraceReport {

    private TraceReport() {
    }

    /** A run of consecutive rows with the same stability word. */
    public record Segment(int fromRow, int toRow, double fromParameter, double toParameter, String stability) {
    }

    /** The branch split into parts of one stability each (special-point rows end a part). */
    public static List<Segment> segments(TraceResult r) {
        List<Segment> out = new ArrayList<>();
        BranchRow first = null;
        BranchRow last = null;
        for (BranchRow row : r.rows()) {
            if (first != null && !row.stability().equals(first.stability())) {
                out.add(new Segment(first.row(), last.row(), first.parameter(), last.parameter(), first.stability()));
                first = null;
            }
            if (first == null) {
                first = row;
            }
            last = row;
        }
        if (first != null) {
            out.add(new Segment(first.row(), last.row(), first.parameter(), last.parameter(), first.stability()));
        }
        return out;
    }

    /** Writes the text summary. */
    public static void write(TraceResult r, PrintWriter w) {
        Case c = r.theCase();
        String name = r.options().name();
        w.println(c.title());
        w.println("case " + c.source() + " | " + c.shape().word() + ", " + c.mesh().cells() + " cells | traced " + name + " from "
                + pv(r, r.options().from(), 8) + " towards " + pv(r, r.options().to(), 8));
        w.printf(Locale.ROOT, "Branch: %d rows, %d steps (%d rejected and retried shorter); stopped: %s%n", r.rows().size(),
                r.steps(), r.rejected(), r.stopReason());
        w.println();
        w.println("Special points");
        if (r.specialPoints().isEmpty()) {
            w.println("  none found along the traced part");
        }
        for (SpecialPoint sp : r.specialPoints()) {
            w.printf(Locale.ROOT, "  %-20s %s = %s   %s   row %d%s%n", sp.kind().word(), name, pv(r, sp.parameter(), 10),
                    maxText(sp.max()), sp.row(), sp.located() ? "" : " (not located: between steps)");
            w.printf(Locale.ROOT, "      %s; crossing eigenvalue %s (residual %.1e)%n", meaning(sp),
                    complex(sp.critical().re(), sp.critical().im()), sp.critical().residual());
            if (sp.kind() == SpecialPointKind.HOPF) {
                w.printf(Locale.ROOT, "      frequency %s rad per time unit, period %s%n", sig(sp.frequency(), 8), sig(sp.period(), 8));
            }
        }
        w.println();
        w.println("Stability along the branch");
        for (Segment s : segments(r)) {
            w.printf(Locale.ROOT, "  rows %3d-%-3d  %s %s .. %s  %s%n", s.fromRow(), s.toRow(), name, pv(r, s.fromParameter(), 8),
                    pv(r, s.toParameter(), 8), s.stability());
        }
        w.println();
        rows(r, w);
        if (!r.warnings().isEmpty()) {
            w.println();
            w.println("Warnings");
            for (String s : r.warnings()) {
                w.println("  - " + s);
            }
        }
        w.println();
        w.println("Cautions");
        for (String s : r.cautions()) {
            w.println("  - " + s);
        }
        w.flush();
    }

    private static void rows(TraceResult r, PrintWriter w) {
        List<String> fields = r.theCase().fieldNames();
        StringBuilder h = new StringBuilder(String.format(Locale.ROOT, "  %4s %11s %14s %12s", "row", "arclength", r.options().name(),
                "M-norm"));
        for (String f : fields) {
            h.append(String.format(Locale.ROOT, " %12s", "max " + f));
        }
        h.append(String.format(Locale.ROOT, " %14s %10s  %-9s %s", "growth rate", "frequency", "stability", "label"));
        w.println(h);
        for (BranchRow row : r.rows()) {
            StringBuilder sb = new StringBuilder(String.format(Locale.ROOT, "  %4d %11s %14s %12s", row.row(), sig(row.arclength(), 6),
                    pv(r, row.parameter(), 10), sig(row.norm(), 6)));
            for (String f : fields) {
                sb.append(String.format(Locale.ROOT, " %12s", sig(row.max().get(f), 7)));
            }
            sb.append(String.format(Locale.ROOT, " %14s %10s  %-9s %s", sig(row.growthRate(), 6), sig(row.frequency(), 5),
                    row.stability(), row.label()));
            w.println(sb.toString().stripTrailing());
        }
    }

    static String complex(double re, double im) {
        if (im == 0) {
            return sig(re, 4);
        }
        return sig(re, 4) + (im < 0 ? " - " : " + ") + sig(Math.abs(im), 8) + "i";
    }

    static String maxText(Map<String, Double> max) {
        List<String> parts = new ArrayList<>();
        max.forEach((k, v) -> parts.add("max " + k + " = " + sig(v, 9)));
        return String.join(", ", parts);
    }

    static String meaning(SpecialPoint sp) {
        return switch (sp.kind()) {
            case FOLD -> "the branch turns back: no steady state of this branch beyond it; stability changes here";
            case STATIONARY_CROSSING -> "a real eigenvalue crosses zero without a turn (another branch may meet this one), "
                    + sp.direction();
            case HOPF -> "a complex pair crosses the imaginary axis: oscillations grow on the far side, " + sp.direction();
        };
    }

    /** The JSON summary object. */
    public static Map<String, Object> toMap(TraceResult r, String outFile) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("parameter", r.options().name());
        m.put("from", ResultJson.num(r.options().from()));
        m.put("to", ResultJson.num(r.options().to()));
        m.put("rows", r.rows().size());
        m.put("steps", r.steps());
        m.put("rejected_steps", r.rejected());
        m.put("stop_reason", r.stopReason());
        List<Object> sps = new ArrayList<>();
        for (SpecialPoint sp : r.specialPoints()) {
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("kind", sp.kind().word());
            x.put("row", sp.row());
            x.put("value", ResultJson.num(sp.parameter()));
            x.put("arclength", ResultJson.num(sp.arclength()));
            Map<String, Object> max = new LinkedHashMap<>();
            sp.max().forEach((k, v) -> max.put(k, ResultJson.num(v)));
            x.put("max", max);
            Map<String, Object> ev = new LinkedHashMap<>();
            ev.put("re", ResultJson.num(sp.critical().re()));
            ev.put("im", ResultJson.num(sp.critical().im()));
            ev.put("residual", ResultJson.num(sp.critical().residual()));
            x.put("eigenvalue", ev);
            x.put("frequency", ResultJson.num(sp.frequency()));
            x.put("period", ResultJson.num(sp.period()));
            x.put("located", sp.located());
            x.put("arclength_tolerance", ResultJson.num(sp.tolerance()));
            x.put("direction", sp.direction());
            sps.add(x);
        }
        m.put("special_points", sps);
        List<Object> segs = new ArrayList<>();
        for (Segment s : segments(r)) {
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("from_row", s.fromRow());
            x.put("to_row", s.toRow());
            x.put("from", ResultJson.num(s.fromParameter()));
            x.put("to", ResultJson.num(s.toParameter()));
            x.put("stability", s.stability());
            segs.add(x);
        }
        m.put("segments", segs);
        m.put("cells", r.theCase().mesh().cells());
        m.put("unknowns", r.rows().isEmpty() ? 0 : r.rows().get(0).point().u().length);
        Map<String, Object> params = new LinkedHashMap<>();
        r.theCase().parameters().forEach((k, v) -> params.put(k, ResultJson.num(v)));
        m.put("parameters", params);
        m.put("out", outFile);
        m.put("warnings", r.warnings());
        m.put("cautions", r.cautions());
        return m;
    }

    /** A value of the traced parameter in the unit the case gave it (with the unit), else plain. */
    static String pv(TraceResult r, double si, int digits) {
        Case c = r.theCase();
        String name = r.options().name();
        javax.measure.Unit<?> u = c.physical().units().get(name);
        if (u == null) {
            return sig(si, digits);
        }
        return sig(rdstab.solver.units.QuantityParser.fromSi(si, u), digits) + " " + c.unitText(name);
    }

    /** The stop reason with a "reached NAME = value" shown in the case's unit. */
    static String stopText(TraceResult r) {
        String text = r.stopReason();
        String prefix = "reached " + r.options().name() + " = ";
        if (text != null && text.startsWith(prefix) && r.theCase().physical().units().containsKey(r.options().name())) {
            try {
                return prefix + pv(r, Double.parseDouble(text.substring(prefix.length()).trim()), 8);
            } catch (NumberFormatException e) {
                return text;
            }
        }
        return text;
    }
}
