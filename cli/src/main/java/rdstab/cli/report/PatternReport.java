package rdstab.cli.report;

import static rdstab.cli.report.TextReport.sig;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.pattern.DispersionRelation;
import rdstab.solver.pattern.PecletNumbers;

/** The transport (Péclet) and dispersion-relation sections of the text report and the JSON. */
public final class PatternReport {

    /** Admitted modes shown: the ones of largest growth rate. */
    static final int SHOWN = 6;

    private PatternReport() {
    }

    /** Writes the sections that apply (nothing for a case without drift and with a non-uniform base state). */
    public static void write(CheckResult r, PrintWriter w) {
        PecletNumbers.Result flow = r.flow();
        if (flow != null && !flow.fields().isEmpty()) {
            w.println();
            w.println("Transport (drift scheme " + flow.scheme().name().toLowerCase(Locale.ROOT)
                    + "; Pe = max|c| L / min k, cell Pe = max |c| h / k, centred needs cell Pe ≤ 2)");
            for (PecletNumbers.Field f : flow.fields()) {
                w.printf(Locale.ROOT, "  field %-10s Pe %s, cell Pe %s, max drift speed %s%n", f.field(), sig(f.peclet(), 5),
                        sig(f.cellPeclet(), 4), sig(f.maxSpeed(), 5));
            }
        }
        DispersionRelation.Result d = r.dispersion();
        if (d == null || !d.applies()) {
            return;
        }
        w.println();
        w.println("Dispersion relation about the uniform base state (eigenvalues of R − k² diag(D), k = nπ/L)");
        DispersionRelation.Mode lead = d.leadingMode();
        w.printf(Locale.ROOT, "  leading admitted mode n = %d, k = %s: Re λ = %s, Im λ = ±%s — %s%n", lead.n(), sig(lead.k(), 6),
                sig(lead.re(), 8), sig(lead.im(), 6), d.kind());
        w.printf(Locale.ROOT, "  unbounded domain: fastest growth %s at k = %s%n", sig(d.rateFastest(), 6), sig(d.kFastest(), 6));
        w.println("     n            k        Re λ(k)       Im λ(k)");
        for (DispersionRelation.Mode m : topModes(d)) {
            w.printf(Locale.ROOT, "  %4d  %11s  %13s  %12s%n", m.n(), sig(m.k(), 6), sig(m.re(), 8), sig(m.im(), 6));
        }
    }

    static List<DispersionRelation.Mode> topModes(DispersionRelation.Result d) {
        List<DispersionRelation.Mode> all = new ArrayList<>(d.admitted());
        all.sort(Comparator.comparingDouble(DispersionRelation.Mode::re).reversed());
        return all.subList(0, Math.min(SHOWN, all.size()));
    }

    /** JSON keys "transport" and "dispersion" (added to the result map when they apply). */
    public static void put(CheckResult r, Map<String, Object> m) {
        PecletNumbers.Result flow = r.flow();
        if (flow != null) {
            Map<String, Object> t = new LinkedHashMap<>();
            t.put("drift_scheme", flow.scheme().name().toLowerCase(Locale.ROOT));
            List<Object> fields = new ArrayList<>();
            for (PecletNumbers.Field f : flow.fields()) {
                Map<String, Object> x = new LinkedHashMap<>();
                x.put("field", f.field());
                x.put("peclet", ResultJson.num(f.peclet()));
                x.put("cell_peclet", ResultJson.num(f.cellPeclet()));
                x.put("max_speed", ResultJson.num(f.maxSpeed()));
                fields.add(x);
            }
            t.put("fields", fields);
            m.put("transport", t);
        }
        DispersionRelation.Result d = r.dispersion();
        if (d != null) {
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("applies", d.applies());
            if (!d.applies()) {
                x.put("reason", d.reason());
            } else {
                x.put("kind", d.kind());
                x.put("leading", mode(d.leadingMode()));
                x.put("k_fastest_unbounded", ResultJson.num(d.kFastest()));
                x.put("rate_fastest_unbounded", ResultJson.num(d.rateFastest()));
                List<Object> modes = new ArrayList<>();
                for (DispersionRelation.Mode md : topModes(d)) {
                    modes.add(mode(md));
                }
                x.put("admitted_fastest", modes);
            }
            m.put("dispersion", x);
        }
    }

    private static Map<String, Object> mode(DispersionRelation.Mode md) {
        Map<String, Object> x = new LinkedHashMap<>();
        x.put("n", md.n());
        x.put("k", ResultJson.num(md.k()));
        x.put("re", ResultJson.num(md.re()));
        x.put("im", ResultJson.num(md.im()));
        return x;
    }
}
