package rdstab.cli.report;

import java.nio.file.Path;
import java.util.Base64;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import rdstab.cli.output.AtomicFiles;
import rdstab.cli.plot.CheckPlots;
import rdstab.cli.plot.PlotFiles;
import rdstab.solver.assess.Assessment;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.energy.EnergyRates;
import rdstab.solver.model.Case;
import rdstab.solver.model.FieldSpec;

/**
 * One self-contained HTML file for a check (rdstab check --report FILE.html): the verdict first, then the
 * pictures (PNG embedded as base64 data, so the file works offline and can be mailed as one attachment), then the
 * tables — base state, eigenvalues with residuals, energy rates, parameters — the warnings and the safety cautions.
 * The markup is well-formed XML (every tag closed, text escaped) and loads nothing from anywhere: no scripts, no
 * fonts, no style sheets, no links.
 */
public final class HtmlReport {

    private HtmlReport() {
    }

    /** Writes the report to {@code file}. */
    public static void write(CheckResult r, Path file, boolean overwrite) {
        AtomicFiles.write(file, html(r, true), overwrite);
    }

    /**
     * The report's text.
     *
     * @param pictures embed the plots (false gives the tables alone, e.g. for quick tests)
     */
    public static String html(CheckResult r, boolean pictures) {
        Case c = r.problem().theCase();
        Assessment a = r.assessment();
        StringBuilder h = new StringBuilder(1 << 16);
        h.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"UTF-8\"/>\n<title>")
                .append(esc("rdstab check: " + c.title())).append("</title>\n<style>\n").append(CSS).append("</style>\n</head>\n<body>\n");
        h.append("<h1>").append(esc(c.title())).append("</h1>\n");
        h.append("<p class=\"case\">case ").append(esc(c.source())).append(" | ").append(esc(c.shape().word())).append(", ")
                .append(c.mesh().cells()).append(" cells, ").append(r.problem().full().unknowns()).append(" unknowns</p>\n");
        verdict(h, r);
        if (pictures) {
            h.append("<h2>Pictures</h2>\n");
            for (CheckPlots.Figure f : CheckPlots.figures(r)) {
                h.append("<figure><img alt=\"").append(esc(f.caption())).append("\" src=\"data:image/png;base64,")
                        .append(Base64.getEncoder().encodeToString(PlotFiles.png(f.chart()))).append("\"/>")
                        .append("<figcaption>").append(esc(f.caption())).append("</figcaption></figure>\n");
            }
        }
        base(h, r, c);
        eigen(h, r);
        energy(h, r);
        h.append("<h2>Parameters</h2>\n<table>\n<tr><th>name</th><th>value</th></tr>\n");
        for (Map.Entry<String, Double> e : c.parameters().entrySet()) {
            row(h, e.getKey(), TextReport.sig(e.getValue(), 10));
        }
        h.append("</table>\n");
        list(h, "Warnings", a.warnings().isEmpty() ? List.of("none") : a.warnings(), "warnings");
        list(h, "Cautions", a.cautions(), "cautions");
        h.append("<p class=\"foot\">Written by rdstab check. Sign convention: M du/dt = F(u), eigenproblem J x = λ M x, "
                + "Re λ &gt; 0 grows.</p>\n</body>\n</html>\n");
        return h.toString();
    }

    private static void verdict(StringBuilder h, CheckResult r) {
        Assessment a = r.assessment();
        String word = a.verdict().word();
        h.append("<div class=\"verdict ").append(word).append("\">\n<p class=\"big\">Verdict: ")
                .append(word.toUpperCase(Locale.ROOT)).append("</p>\n<p>").append(esc(TextReport.meaning(a.verdict())))
                .append("</p>\n</div>\n<table>\n");
        row(h, "growth rate (max Re λ)", TextReport.sig(a.growthRate(), 8) + " per unit time (|rate| < "
                + String.format(Locale.ROOT, "%.1e", a.band()) + " would be undecided)");
        if (Double.isFinite(a.eFoldingTime())) {
            row(h, "e-folding time", TextReport.sig(a.eFoldingTime(), 4) + " time units");
        }
        if (Math.abs(a.frequency()) > 1e-12) {
            row(h, "oscillation", "frequency " + TextReport.sig(Math.abs(a.frequency()), 6) + " rad per time unit");
        }
        row(h, "leading mode", "largest in field " + a.peakField() + " at " + TextReport.coords(a.peakX()));
        row(h, "energy method", a.energyVerdict());
        h.append("</table>\n");
    }

    private static void base(StringBuilder h, CheckResult r, Case c) {
        h.append("<h2>Base state</h2>\n<table>\n");
        row(h, "damped Newton steps", Integer.toString(r.base().iterations()));
        row(h, "final residual", String.format(Locale.ROOT, "%.2e (accepted at %.2e)", r.base().residual(), r.base().tolerance()));
        for (FieldSpec f : c.fields()) {
            Double mx = r.baseMax().get(f.name());
            String unit = f.unit() == null || f.unit().isBlank() ? "" : " " + f.unit();
            row(h, "max " + f.name(), (mx == null ? "" : TextReport.sig(mx, 8)) + unit);
        }
        h.append("</table>\n");
    }

    private static void eigen(StringBuilder h, CheckResult r) {
        h.append("<h2>Eigenvalues</h2>\n<p>Rightmost eigenvalues of J x = λ M x by shift-invert (shift ")
                .append(esc(TextReport.sig(r.shift(), 6))).append(r.rightmostCertified() ? "; rightmost set certified" : "; rightmost set not certified")
                .append("). Residual = ‖J x − λ M x‖ / (‖J‖ ‖x‖). Error estimate: of the computed eigenvalue, condition ")
                .append("number × backward error (first order). Sensitivity: condition number in the energy norm, how far a ")
                .append("change δ of the operator can move the eigenvalue (about sensitivity·δ; 1 for a self-adjoint ")
                .append("operator).").append(r.scalingSpan() > 1 ? " " + esc(TextReport.scalingNote(r)) : "").append("</p>\n");
        h.append("<table class=\"eigenvalues\">\n<tr><th>#</th><th>Re λ</th><th>Im λ</th><th>residual</th>"
                + "<th>error estimate</th><th>sensitivity</th></tr>\n");
        for (int i = 0; i < r.modes().size(); i++) {
            EigenPair e = r.modes().get(i);
            String[] cond = TextReport.conditioning(r, i);
            h.append("<tr><td>").append(i + 1).append("</td><td>").append(esc(TextReport.sig(e.re(), 10))).append("</td><td>")
                    .append(esc(TextReport.sig(e.im(), 6))).append("</td><td>")
                    .append(String.format(Locale.ROOT, "%.1e", e.residual())).append("</td><td>").append(esc(cond[0]))
                    .append("</td><td>").append(esc(cond[1])).append("</td></tr>\n");
        }
        h.append("</table>\n");
    }

    private static void energy(StringBuilder h, CheckResult r) {
        EnergyRates en = r.energy();
        h.append("<h2>Energy method</h2>\n<p>Growth rates; spectral abscissa ≤ numerical abscissa ≤ a-priori bound.</p>\n<table>\n");
        row(h, "spectral abscissa", TextReport.sig(r.assessment().growthRate(), 8));
        row(h, "numerical abscissa (sharp energy rate)", TextReport.sig(en.numericalAbscissa(), 8));
        row(h, "a-priori bound (−μ₁ + max reaction rate)", TextReport.sig(en.bound(), 8) + " = −" + TextReport.sig(en.poincare(), 6)
                + " + " + TextReport.sig(en.reactionRate(), 6));
        h.append("</table>\n");
    }

    private static void list(StringBuilder h, String title, List<String> items, String cls) {
        h.append("<h2>").append(title).append("</h2>\n<ul class=\"").append(cls).append("\">\n");
        for (String s : items) {
            h.append("<li>").append(esc(s)).append("</li>\n");
        }
        h.append("</ul>\n");
    }

    private static void row(StringBuilder h, String k, String v) {
        h.append("<tr><th>").append(esc(k)).append("</th><td>").append(esc(v)).append("</td></tr>\n");
    }

    /** Escapes text for HTML and XML. */
    static String esc(String s) {
        StringBuilder b = new StringBuilder(s.length() + 8);
        for (char ch : s.toCharArray()) {
            switch (ch) {
                case '&' -> b.append("&amp;");
                case '<' -> b.append("&lt;");
                case '>' -> b.append("&gt;");
                case '"' -> b.append("&quot;");
                case '\'' -> b.append("&#39;");
                default -> b.append(ch);
            }
        }
        return b.toString();
    }

    private static final String CSS = String.join("\n",
            "body { font-family: sans-serif; max-width: 960px; margin: 1.5em auto; padding: 0 1em; color: #111; line-height: 1.4; }",
            "h1 { font-size: 1.5em; } h2 { font-size: 1.2em; margin-top: 1.6em; border-bottom: 1px solid #ccc; }",
            ".case { color: #444; }",
            ".verdict { padding: 0.6em 1em; border-left: 8px solid #888; background: #f4f4f4; }",
            ".verdict.stable { border-color: #0072b2; } .verdict.unstable { border-color: #d55e00; background: #fbeee6; }",
            ".verdict.marginal { border-color: #e69f00; }",
            ".big { font-size: 1.4em; font-weight: bold; margin: 0.2em 0; }",
            "table { border-collapse: collapse; margin: 0.6em 0; } th, td { border: 1px solid #ccc; padding: 0.25em 0.6em; text-align: left; }",
            "table.eigenvalues td { text-align: right; font-family: monospace; }",
            "figure { margin: 1em 0; } img { max-width: 100%; height: auto; } figcaption { color: #444; font-size: 0.9em; }",
            ".cautions li { font-weight: bold; } .foot { color: #666; font-size: 0.85em; margin-top: 2em; }", "");
}
