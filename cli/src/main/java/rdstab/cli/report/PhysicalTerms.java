package rdstab.cli.report;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import javax.measure.Unit;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.model.Case;
import rdstab.solver.model.SelfHeatingModel;
import rdstab.solver.units.QuantityParser;

/**
 * The answer of a case written in physical units, in the engineer's own terms: the dimensionless
 * groups formed, temperatures in the unit the ambient was given in, growth rates in 1/s and the
 * e-folding time in s, min, h or days.
 */
public final class PhysicalTerms {

    private PhysicalTerms() {
    }

    /** True when the case has a physical self-heating model. */
    public static boolean applies(CheckResult r) {
        return r.problem().theCase().physical().selfHeating() != null;
    }

    /** Readable duration: seconds, minutes, hours or days. */
    public static String duration(double seconds) {
        if (!Double.isFinite(seconds)) {
            return "infinite";
        }
        if (seconds < 120) {
            return TextReport.sig(seconds, 3) + " s";
        }
        if (seconds < 7200) {
            return TextReport.sig(seconds / 60, 3) + " min";
        }
        if (seconds < 3 * 86400) {
            return TextReport.sig(seconds / 3600, 3) + " h";
        }
        return TextReport.sig(seconds / 86400, 3) + " days";
    }

    /** A temperature in kelvin shown in the model's temperature unit. */
    public static String temperature(double kelvin, SelfHeatingModel m) {
        Unit<?> u = m.temperatureUnit();
        return TextReport.sig(QuantityParser.fromSi(kelvin, u), 5) + " " + QuantityParser.display(u);
    }

    /** Key numbers for JSON. */
    public static Map<String, Object> toMap(CheckResult r) {
        Case c = r.problem().theCase();
        SelfHeatingModel m = c.physical().selfHeating();
        Map<String, Double> p = c.parameters();
        Map<String, Object> out = new LinkedHashMap<>();
        Map<String, Object> groups = new LinkedHashMap<>();
        groups.put("delta", p.get("delta"));
        groups.put("eps", p.get("eps"));
        if (p.containsKey("Bi")) {
            groups.put("Bi", p.get("Bi"));
        }
        out.put("groups", groups);
        out.put("ambient_temperature", QuantityParser.fromSi(p.get("Ta"), m.temperatureUnit()));
        out.put("temperature_unit", QuantityParser.display(m.temperatureUnit()));
        double thetaMax = r.baseMax().values().iterator().next();
        out.put("max_temperature", QuantityParser.fromSi(m.temperature(thetaMax, p), m.temperatureUnit()));
        out.put("time_scale_s", m.timeScale(p));
        double g = m.growthPerSecond(r.assessment().growthRate(), p);
        out.put("growth_rate_per_s", g);
        out.put("e_folding_time_s", g == 0 ? null : 1.0 / Math.abs(g));
        out.put("kinetics", m.arrhenius() ? "arrhenius" : "exponential");
        return out;
    }

    /** The text block. */
    public static void write(CheckResult r, java.io.PrintWriter w) {
        Case c = r.problem().theCase();
        SelfHeatingModel m = c.physical().selfHeating();
        Map<String, Double> p = c.parameters();
        double thetaMax = r.baseMax().values().iterator().next();
        double g = m.growthPerSecond(r.assessment().growthRate(), p);
        String ta = temperature(p.get("Ta"), m);
        w.println("In physical terms");
        w.printf(Locale.ROOT, "  %s at ambient %s: hottest point %s (%s above ambient)%n",
                r.assessment().verdict().word(), ta, temperature(m.temperature(thetaMax, p), m),
                TextReport.sig(thetaMax * m.temperatureScale(p), 4) + " K");
        w.printf(Locale.ROOT, "  growth rate %s 1/s; e-folding time %s (%s)%n", TextReport.sig(g, 4),
                duration(1.0 / Math.abs(g)), g > 0 ? "growth" : "decay");
        w.printf(Locale.ROOT, "  groups: Frank-Kamenetskii delta = %s, eps = R*Ta/E = %s%s; conduction time %s%n",
                TextReport.sig(p.get("delta"), 5), TextReport.sig(p.get("eps"), 4),
                p.containsKey("Bi") ? ", Biot Bi = h*L/k = " + TextReport.sig(p.get("Bi"), 4) : " (fixed surface temperature)",
                duration(m.timeScale(p)));
        w.printf(Locale.ROOT, "  kinetics: %s%n", m.arrhenius() ? "exp(theta/(1 + eps*theta)) (Arrhenius)"
                : "exp(theta) (large-activation-energy limit)");
        w.println();
    }
}
