package rdstab.cli.command;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import rdstab.cli.report.ResultJson;
import rdstab.cli.report.TextReport;
import rdstab.solver.assess.SafetyCautions;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.model.Case;
import rdstab.solver.sweep.Axis;
import rdstab.solver.sweep.CriticalFinder;
import rdstab.solver.sweep.CriticalPoint;

/** rdstab critical: the first neutral point or fold along one parameter. */
@Command(name = "critical", mixinStandardHelpOptions = true,
        description = {
            "Find the value of one parameter, going from FROM toward TO, where the case stops being what it is at FROM: "
                + "the rightmost eigenvalue crosses zero while the steady state continues (real crossing, or oscillatory "
                + "crossing with its frequency), or the steady state ceases to exist (fold) — whichever comes first.",
            "",
            "Method: a coarse scan (--scan intervals) with each steady state continued from the previous one brackets the "
                + "change; Brent's method on the growth rate then narrows a crossing, and bisection on the existence of the "
                + "continued steady state narrows a fold, to --tolerance. At a fold the growth rate tends to 0 (exchange of "
                + "stability), so the growth rate there is near zero by nature.",
            "",
            "Examples:",
            "  rdstab critical cases/slab-self-heating.yaml --vary delta=0.2:1.5",
            "  rdstab critical cases/slab-self-heating.yaml --vary delta=0.2:1.5 --set Bi=20 --cells 400 --json"},
        footer = {"", "Exit status: 0 completed (also when nothing is found in the range), 2 bad input, 3 no steady state at FROM "
            + "or an eigen-solver failure."})
public final class CriticalCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    CaseOptions caseOptions;

    @Option(names = "--vary", paramLabel = "NAME=FROM:TO", required = true,
            description = "The parameter and the range to search, from FROM (where the case is as it is) toward TO.")
    String vary;

    @Option(names = "--tolerance", paramLabel = "T",
            description = "Bracket the critical value to within ± T (default 1e-6 max(1, |FROM|, |TO|)). This is the "
                    + "solver's tolerance on this grid; the grid error comes on top (rerun with --cells doubled to see it).")
    Double tolerance;

    @Option(names = "--scan", paramLabel = "N", description = "Intervals of the coarse scan (default "
            + CriticalFinder.DEFAULT_SCAN + "). More intervals catch changes that reverse within one interval.")
    int scan = CriticalFinder.DEFAULT_SCAN;

    @Option(names = "--json", description = "Print the result JSON of the check at the critical value with a \"critical\" member.")
    boolean json;

    @Option(names = "--plots", paramLabel = "DIR",
            description = "Draw the growth rate of the coarse scan against the parameter (stable and unstable ranges shaded, "
                    + "points without a steady state marked) as PNG and SVG into DIR.")
    java.nio.file.Path plots;

    @Option(names = "--debug", description = "Show stack traces on errors.")
    boolean debug;

    @Override
    public Integer call() {
        Case c = caseOptions.load();
        Axis range = Axis.parseRange(vary, c);
        c.parameter(range.name());
        double tol = tolerance != null ? tolerance : CriticalFinder.defaultTolerance(range);
        CriticalPoint r = CriticalFinder.find(c, range, tol, scan);
        PrintWriter w = spec.commandLine().getOut();
        if (plots != null) {
            rdstab.cli.plot.SweepPlots.write(c, r, plots);
        }
        if (json) {
            w.println(ResultJson.write(toMap(r)));
        } else {
            text(r, c, range, w);
        }
        w.flush();
        return 0;
    }

    static Map<String, Object> toMap(CriticalPoint r) {
        Map<String, Object> m = ResultJson.toMap(r.atCritical());
        Map<String, Object> crit = new LinkedHashMap<>();
        crit.put("parameter", r.parameter());
        crit.put("value", ResultJson.num(r.value()));
        crit.put("tolerance", ResultJson.num(r.tolerance()));
        crit.put("kind", r.kind().word());
        if (r.kind() == CriticalPoint.Kind.OSCILLATORY_CROSSING) {
            crit.put("frequency", r.frequency());
        }
        crit.put("bracket", List.of(r.low(), r.high()));
        crit.put("cells", r.atCritical().problem().theCase().mesh().cells());
        crit.put("grid_error", "not included: rerun with --cells doubled to estimate it");
        List<Object> scan = new ArrayList<>();
        for (CriticalPoint.ScanPoint s : r.scan()) {
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("value", s.value());
            x.put("steady_state", s.exists());
            x.put("growth_rate", ResultJson.num(s.growthRate()));
            x.put("im", ResultJson.num(s.frequency()));
            scan.add(x);
        }
        crit.put("scan", scan);
        crit.put("checks", r.checks());
        Case c = r.atCritical().problem().theCase();
        javax.measure.Unit<?> unit = c.physical().units().get(r.parameter());
        if (unit != null) {
            Map<String, Object> disp = new LinkedHashMap<>();
            disp.put("value", rdstab.solver.units.QuantityParser.fromSi(r.value(), unit));
            disp.put("unit", c.unitText(r.parameter()));
            crit.put("in_case_units", disp);
        }
        m.put("critical", crit);
        return m;
    }

    private static void text(CriticalPoint r, Case c, Axis range, PrintWriter w) {
        String p = r.parameter();
        CheckResult at = r.atCritical();
        w.println(c.title());
        w.printf("case %s | %d cells, %d unknowns | searching %s from %s to %s%n%n", c.source(), c.mesh().cells(),
                at.problem().full().unknowns(), p, v(c, p, range.from(), 6),
                v(c, p, range.to(), 6));
        switch (r.kind()) {
            case FOLD -> w.printf(Locale.ROOT, "CRITICAL VALUE: %s = %s ± %s — fold: no steady state beyond it%n", p,
                    v(c, p, r.value(), 9), tol(c, p, r.value(), r.tolerance()));
            case REAL_CROSSING -> w.printf(Locale.ROOT, "CRITICAL VALUE: %s = %s ± %s — real crossing: a real eigenvalue "
                    + "crosses zero, the steady state continues%n", p, v(c, p, r.value(), 9), tol(c, p, r.value(), r.tolerance()));
            case OSCILLATORY_CROSSING -> w.printf(Locale.ROOT, "CRITICAL VALUE: %s = %s ± %s — oscillatory crossing: a "
                    + "complex pair crosses, onset of oscillations with frequency %s (period %s)%n", p,
                    v(c, p, r.value(), 9), tol(c, p, r.value(), r.tolerance()), TextReport.sig(r.frequency(), 6),
                    TextReport.sig(2 * Math.PI / r.frequency(), 6));
            default -> w.printf("NO CRITICAL VALUE between %s and %s: the growth rate keeps its sign and the steady state "
                    + "exists at every scanned value%n", v(c, p, range.from(), 6), v(c, p, range.to(), 6));
        }
        if (r.kind() != CriticalPoint.Kind.NONE) {
            w.printf("  bracket          %s .. %s%n", v(c, p, r.low(), 10), v(c, p, r.high(), 10));
        }
        EigenPair lead = at.modes().get(0);
        w.printf("  at %s = %s: growth rate %s (residual %.1e), max %s, Newton %d steps, residual %.2e%n", p,
                v(c, p, at.problem().theCase().parameter(p), 9), TextReport.sig(lead.re(), 6), lead.residual(),
                maxes(at), at.base().iterations(), at.base().residual());
        if (r.kind() == CriticalPoint.Kind.FOLD) {
            w.println("  (at a fold the growth rate tends to 0: exchange of stability; the value shown is at the last "
                    + "steady state found)");
        }
        w.println();
        w.println("Coarse scan (each steady state continued from the previous one)");
        w.printf("  %14s  %16s  %s%n", p, "growth rate", "steady state");
        for (CriticalPoint.ScanPoint s : r.scan()) {
            w.printf("  %14s  %16s  %s%n", v(c, p, s.value(), 8), s.exists() ? TextReport.sig(s.growthRate(), 8) : "-",
                    s.exists() ? "yes" : "none found");
        }
        w.println();
        w.println("Notes");
        w.printf("  - The critical value is that of this grid (%d cells), found to ± the tolerance above; the grid error comes "
                + "on top: rerun with --cells %d and compare (the scheme is second order, so the error falls about 4x).%n",
                c.mesh().cells(), 2 * c.mesh().cells());
        w.println("  - A change that starts and reverses within one scan interval is missed: raise --scan if in doubt.");
        w.println("  - A critical value is a limit, not an operating point: keep a margin from it that covers the "
                + "uncertainty of every input.");
        w.println();
        w.println("Cautions");
        for (String s : SafetyCautions.STANDARD) {
            w.println("  - " + s);
        }
    }

    /** A value of the parameter in the unit the case gave it. */
    private static String v(Case c, String p, double si, int digits) {
        String u = c.unitText(p);
        if (u.isEmpty()) {
            return TextReport.sig(si, digits);
        }
        javax.measure.Unit<?> unit = c.physical().units().get(p);
        return TextReport.sig(rdstab.solver.units.QuantityParser.fromSi(si, unit), digits) + " " + u;
    }

    /** A tolerance (a difference) in the unit of the parameter. */
    private static String tol(Case c, String p, double si, double t) {
        javax.measure.Unit<?> unit = c.physical().units().get(p);
        double d = unit == null ? t : Math.abs(rdstab.solver.units.QuantityParser.fromSi(si + t, unit)
                - rdstab.solver.units.QuantityParser.fromSi(si, unit));
        return String.format(Locale.ROOT, "%.1e", d) + (unit == null ? "" : " " + c.unitText(p));
    }

    private static String maxes(CheckResult at) {
        StringBuilder sb = new StringBuilder();
        at.baseMax().forEach((k, v) -> sb.append(sb.length() > 0 ? ", " : "").append(k).append(' ').append(TextReport.sig(v, 6)));
        return sb.toString();
    }
}
