package rdstab.cli.report;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import rdstab.solver.assess.Assessment;
import rdstab.solver.assess.Verdict;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.energy.EnergyRates;
import rdstab.solver.model.Case;

/** The human-readable report of one check: verdict first, then evidence, then cautions. */
public final class TextReport {

    private TextReport() {
    }

    /** Writes the report. */
    public static void write(CheckResult r, PrintWriter w) {
        write(r, w, null);
    }

    /**
     * Writes the report with an extra section (e.g. the grid study of check --verify) printed before the warnings and
     * cautions, so the cautions stay last.
     */
    public static void write(CheckResult r, PrintWriter w, java.util.function.Consumer<PrintWriter> extra) {
        Case c = r.problem().theCase();
        Assessment a = r.assessment();
        w.println(c.title());
        String cells = c.shape().dimension() == 2 ? r.problem().full().cells().length + (c.shape().triangles() ? " triangles, " : " cells, ")
                : c.mesh().cells() + " cells, ";
        w.println("case " + c.source() + " | " + c.shape().word() + ", " + cells
                + r.problem().full().unknowns() + " unknowns | " + parameters(c));
        w.println();
        w.println("VERDICT: " + a.verdict().word().toUpperCase(Locale.ROOT) + " — " + meaning(a.verdict()));
        String per = PhysicalTerms.applies(r) ? "per conduction time" : "per unit time";
        w.printf(Locale.ROOT, "  growth rate      %s %s (|rate| < %.1e would be undecided)%n", sig(a.growthRate(), 8), per, a.band());
        if (Double.isFinite(a.eFoldingTime())) {
            w.printf(Locale.ROOT, "  e-folding time   %s %s (%s)%n", sig(a.eFoldingTime(), 4),
                    PhysicalTerms.applies(r) ? "conduction times" : "time units",
                    a.growthRate() > 0 ? "a disturbance grows by e in this time" : "a disturbance shrinks by e in this time");
        }
        if (a.frequency() != 0 && Math.abs(a.frequency()) > 1e-12) {
            w.printf(Locale.ROOT, "  oscillation      frequency %s rad per time unit, period %s%n", sig(Math.abs(a.frequency()), 6),
                    sig(2 * Math.PI / Math.abs(a.frequency()), 6));
        }
        w.printf(Locale.ROOT, "  leading mode     largest in field %s at %s%n", a.peakField(), coords(a.peakX()));
        w.println("  energy method    " + a.energyVerdict());
        w.println();
        if (PhysicalTerms.applies(r)) {
            PhysicalTerms.write(r, w);
        }
        w.printf(Locale.ROOT, "Base state (damped Newton: %d steps, residual %.2e, accepted at %.2e)%n",
                r.base().iterations(), r.base().residual(), r.base().tolerance());
        for (Map.Entry<String, Double> e : r.baseMax().entrySet()) {
            w.printf(Locale.ROOT, "  max %-12s %s%n", e.getKey(), sig(e.getValue(), 8));
        }
        w.println();
        w.printf(Locale.ROOT, "Rightmost eigenvalues of J x = λ M x (shift-invert, shift %s%s)%n", sig(r.shift(), 6),
                r.rightmostCertified() ? ", rightmost set certified" : ", rightmost set not certified");
        if (r.scalingSpan() > 1) {
            w.println("  " + scalingNote(r));
        }
        w.println("   #          Re λ             Im λ    residual   error est.  sensitivity");
        for (int i = 0; i < r.modes().size(); i++) {
            EigenPair e = r.modes().get(i);
            String[] cond = conditioning(r, i);
            w.printf(Locale.ROOT, "  %2d  %15s  %15s    %.1e   %10s  %11s%n", i + 1, sig(e.re(), 10), sig(e.im(), 6),
                    e.residual(), cond[0], cond[1]);
        }
        w.println("  (error est.: of the computed eigenvalue, condition number × backward error, first order;");
        w.println("   sensitivity: condition number in the energy norm, how far a change δ of the operator can move it,");
        w.println("   about sensitivity·δ; 1 for a self-adjoint operator)");
        w.println();
        EnergyRates en = r.energy();
        w.println("Energy method (growth rates; spectral ≤ numerical abscissa ≤ a-priori bound)");
        w.printf(Locale.ROOT, "  spectral abscissa    %s%n", sig(a.growthRate(), 8));
        w.printf(Locale.ROOT, "  numerical abscissa   %s   (sharp energy rate: ‖u(t)‖ ≤ e^(rate·t) ‖u(0)‖)%n",
                sig(en.numericalAbscissa(), 8));
        w.printf(Locale.ROOT, "  a-priori bound       %s   (= −μ₁ + max reaction rate = %s + %s)%n", sig(en.bound(), 8),
                sig(-en.poincare(), 6), sig(en.reactionRate(), 6));
        energyDetails(en, w);
        PatternReport.write(r, w);
        if (extra != null) {
            extra.accept(w);
        }
        if (!a.warnings().isEmpty()) {
            w.println();
            w.println("Warnings");
            for (String s : a.warnings()) {
                w.println("  - " + s);
            }
        }
        w.println();
        w.println("Cautions");
        for (String s : a.cautions()) {
            w.println("  - " + s);
        }
        w.flush();
    }

    /**
     * What is printed on stdout when no steady state exists (the error line itself goes to stderr):
     * for a self-heating body this is the runaway answer, so the cautions are printed with it.
     */
    public static void writeNoSteadyState(Case c, PrintWriter w) {
        w.println(c.title());
        w.println("case " + c.source() + " | " + c.shape().word() + ", " + c.mesh().cells() + " cells | " + parameters(c));
        w.println();
        w.println("VERDICT: NO STEADY STATE FOUND — heat or species production cannot be balanced at these values;");
        w.println("  for a self-heating body this means thermal runaway is expected (see the reason on stderr).");
        w.println();
        w.println("Cautions");
        for (String s : rdstab.solver.assess.SafetyCautions.STANDARD) {
            w.println("  - " + s);
        }
        w.flush();
    }

    /** Weights, the Poincaré constant beside its closed form, and the peak amplification. */
    static void energyDetails(EnergyRates en, PrintWriter w) {
        StringBuilder ws = new StringBuilder("[");
        double[] wt = en.weights();
        for (int i = 0; i < wt.length; i++) {
            ws.append(i == 0 ? "" : ", ").append(sig(wt[i], 4));
        }
        ws.append(']');
        w.printf(Locale.ROOT, "  energy weights       %s (%s; E = ½ Σ w_f ‖u_f‖²)%s%n", ws, en.weightChoice(),
                en.unitWeightBound() != en.bound() ? "; bound with unit weights " + sig(en.unitWeightBound(), 6) : "");
        if (Double.isFinite(en.analyticPoincare())) {
            w.printf(Locale.ROOT, "  Poincaré μ₁          %s computed, %s analytic (%s)%n", sig(en.poincare(), 8),
                    sig(en.analyticPoincare(), 8), en.poincareSource());
        } else {
            w.printf(Locale.ROOT, "  Poincaré μ₁          %s computed (no closed form for this shape, coefficients or conditions)%n",
                    sig(en.poincare(), 8));
        }
        if (Double.isFinite(en.peakAmplification()) && en.peakTime() > 0) {
            w.printf(Locale.ROOT, "  peak amplification   %s at t ≈ %s (max ‖e^(tA)‖ in the energy norm; %s)%n",
                    sig(en.peakAmplification(), 6), sig(en.peakTime(), 4), en.amplificationNote());
        } else {
            w.printf(Locale.ROOT, "  peak amplification   %s%n", en.amplificationNote());
        }
    }

    static String meaning(Verdict v) {
        return switch (v) {
            case STABLE -> "small disturbances die out";
            case UNSTABLE -> "a small disturbance grows (runaway or a move to another state)";
            case MARGINAL -> "at the stability limit within the numerical error; the analysis cannot decide";
        };
    }

    static String parameters(Case c) {
        if (c.parameters().isEmpty()) {
            return "no parameters";
        }
        List<String> parts = new ArrayList<>();
        for (String k : c.parameters().keySet()) {
            String u = c.unitText(k);
            parts.add(k + " = " + sig(c.displayValue(k), 6) + (u.isEmpty() ? "" : " " + u));
        }
        return String.join(", ", parts);
    }

    static String coords(double[] x) {
        if (x.length == 1) {
            return "x = " + sig(x[0], 4);
        }
        return "(x, y) = (" + sig(x[0], 4) + ", " + sig(x[1], 4) + ")";
    }

    /** A number to the given significant digits, without exponent clutter where possible. */
    /** One sentence on the symmetrizing scaling the eigenvalues were computed under (text and HTML reports). */
    static String scalingNote(CheckResult r) {
        return String.format(Locale.ROOT, "(solved under a symmetrizing diagonal scaling D⁻¹JD of span %.1e, where these "
                + "eigenvalues are well conditioned; residuals are those of the scaled pencil)", r.scalingSpan());
    }

    /** The error estimate and sensitivity of pair i as shown in the eigenvalue tables of the text and HTML reports. */
    static String[] conditioning(CheckResult r, int i) {
        if (i >= r.conditioning().size() || Double.isNaN(r.conditioning().get(i).condition())) {
            return new String[] {"n/a", "n/a"};
        }
        rdstab.solver.eigen.EigenConditioning.Estimate c = r.conditioning().get(i);
        return new String[] {sci(c.errorEstimate()), c.sensitivity() == 1.0 ? "1" : sci(c.sensitivity())};
    }

    private static String sci(double v) {
        return Double.isInfinite(v) ? "inf" : String.format(Locale.ROOT, "%.1e", v);
    }

    public static String sig(double v, int digits) {
        if (v == 0) {
            return "0";
        }
        if (!Double.isFinite(v)) {
            return Double.toString(v);
        }
        double av = Math.abs(v);
        if (av >= 1e-4 && av < 1e7) {
            return new java.math.BigDecimal(v).round(new java.math.MathContext(digits)).stripTrailingZeros().toPlainString();
        }
        return String.format(Locale.ROOT, "%." + (digits - 1) + "e", v);
    }
}
