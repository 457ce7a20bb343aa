package rdstab.solver.drive;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.ejml.data.DMatrixSparseCSC;
import rdstab.mesh.assembly.Discretization;
import rdstab.mesh.assembly.FiniteVolume1D;
import rdstab.solver.assess.Assessment;
import rdstab.solver.assess.SafetyCautions;
import rdstab.solver.assess.Verdict;
import rdstab.solver.eigen.EigenConditioning;
import rdstab.solver.eigen.EigenOptions;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.eigen.EigenSolvers;
import rdstab.solver.eigen.Spectrum;
import rdstab.solver.energy.EnergyAnalysis;
import rdstab.solver.energy.EnergyRates;
import rdstab.solver.energy.PoincareConstant;
import rdstab.solver.energy.TransientGrowth;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.error.ConvergenceException.Reason;
import rdstab.solver.model.AnalysisSpec;
import rdstab.solver.model.Case;
import rdstab.solver.newton.BaseState;
import rdstab.solver.newton.DampedNewton;
import rdstab.solver.newton.SourceHomotopy;
import rdstab.solver.pattern.DispersionRelation;
import rdstab.solver.pattern.PecletNumbers;
import rdstab.solver.setup.Problem;
import rdstab.solver.setup.ProblemBuilder;

/**
 * One stability check: case → base state (damped Newton) → J, M → rightmost eigenpairs
 * (shift-invert) → energy rates → assessment. The single-point driver every other driver reuses.
 */
public final class StabilityCheck {

    private StabilityCheck() {
    }

    /** Runs a check from the case's own initial guess, with the conditioning of every reported eigenvalue. */
    public static CheckResult run(Case c) {
        Problem p = ProblemBuilder.build(c);
        return run(p, p.initial(), true);
    }

    /**
     * Runs a check from a given initial guess (warm start from a neighbouring point), with the conditioning of
     * the leading eigenvalue only (what the verdict needs; sweeps and critical searches run this).
     *
     * @throws ConvergenceException NO_STEADY_STATE when Newton fails, EIGEN_NOT_CONVERGED when the leading
     *         eigenpair is not trustworthy
     */
    public static CheckResult run(Problem p, double[] guess) {
        return run(p, guess, false);
    }

    /**
     * Runs a check from a given initial guess.
     *
     * @param conditionAll true: error estimate and sensitivity of every reported eigenvalue; false: of the leading
     *                     one only (the others NaN)
     * @throws ConvergenceException NO_STEADY_STATE when Newton fails, EIGEN_NOT_CONVERGED when the leading
     *         eigenpair is not trustworthy
     */
    public static CheckResult run(Problem p, double[] guess, boolean conditionAll) {
        Case c = p.theCase();
        AnalysisSpec a = c.analysis();
        Map<String, Double> seconds = new LinkedHashMap<>();
        long t0 = System.nanoTime();
        BaseState base = steadyState(p, guess);
        long t1 = System.nanoTime();
        seconds.put("base", (t1 - t0) * 1e-9);
        Discretization d = p.full();
        DMatrixSparseCSC j = d.jacobian(base.u());
        DMatrixSparseCSC m = d.mass();
        boolean symmetric = EnergyAnalysis.isSymmetric(j);
        int k = Math.min(a.modes(), d.unknowns());
        EigenOptions opts = new EigenOptions(k, a.shift(), symmetric, a.eigenTolerance(), 3000, 0);
        Spectrum spectrum = EigenSolvers.solve(j, m, opts);
        long t2 = System.nanoTime();
        seconds.put("spectrum", (t2 - t1) * 1e-9);
        List<String> warnings = new ArrayList<>();
        List<EigenPair> modes = trusted(spectrum.pairs(), a.residualLimit(), warnings);
        List<EigenConditioning.Estimate> conditioning = EigenConditioning.of(j, m, modes, spectrum.scaling(), symmetric,
                spectrum.shift(), opts, conditionAll ? 0 : 1);
        long t2c = System.nanoTime();
        seconds.put("conditioning", (t2c - t2) * 1e-9);
        t2 = t2c;
        DMatrixSparseCSC t = p.transport().jacobian(base.u());
        EnergyRates energy = energy(c, d, j, t, m, modes.get(0).re(), a);
        seconds.put("energy", (System.nanoTime() - t2) * 1e-9);
        if (!"newton".equals(base.route())) {
            warnings.add("Newton's method failed from the case's initial guess; the base state was reached by "
                    + "continuation in the source strength from the source-free state (the branch connected to it)");
        }
        if (!spectrum.rightmostCertified()) {
            warnings.add(d.massIsDiagonal()
                    ? "the returned eigenvalues are the ones nearest the shift; an eigenvalue with a large imaginary "
                    + "part further right cannot be ruled out by the certificate (raise --modes to widen the search)"
                    : "with a consistent mass matrix (triangle meshes) the spectrum bounds that place the shift are estimates, "
                    + "so the returned set is not certified to hold the rightmost eigenvalues; a grid study or --modes "
                    + "larger adds confidence");
        }
        double[][] nodal = d.nodalValues(base.u());
        Map<String, Double> max = new LinkedHashMap<>();
        for (int f = 0; f < d.fieldCount(); f++) {
            double mx = Double.NEGATIVE_INFINITY;
            for (double v : nodal[f]) {
                mx = Math.max(mx, v);
            }
            max.put(c.fields().get(f).name(), mx);
        }
        PecletNumbers.Result flow = null;
        DispersionRelation.Result dispersion = null;
        if (d instanceof FiniteVolume1D fv) {
            flow = PecletNumbers.of(fv, c.fieldNames(), base.u());
            if (flow.warning() != null) {
                warnings.add(flow.warning());
            }
            dispersion = DispersionRelation.of(fv, base.u());
        }
        Assessment as = assess(c, d, modes, conditioning.get(0), energy, warnings);
        return new CheckResult(p, base, nodal, max, modes, conditioning, spectrum.shift(), spectrum.scaling().span(),
                spectrum.rightmostCertified(),
                energy, as, seconds, flow, dispersion);
    }

    /**
     * The energy rates in the case's weights (or chosen ones), the analytic Poincaré constant where the shape
     * allows, and — when the spectrum decays but the energy rate is positive — the peak amplification.
     */
    static EnergyRates energy(Case c, Discretization d, DMatrixSparseCSC j, DMatrixSparseCSC t, DMatrixSparseCSC m,
                              double spectralAbscissa, AnalysisSpec a) {
        EnergyRates e = EnergyAnalysis.compute(d, j, t, m, a.energyWeights());
        PoincareConstant.Value pc = PoincareConstant.of(c);
        e = e.withPoincare(pc.mu(), pc.source());
        double band = a.marginalBand();
        if (e.selfAdjoint() || e.numericalAbscissa() <= 0) {
            return e.withAmplification(1.0, 0.0, "1 at t = 0: the energy never grows (numerical abscissa ≤ 0"
                    + (e.selfAdjoint() ? ", self-adjoint operator)" : ")"));
        }
        if (!(spectralAbscissa < -band)) {
            return e.withAmplification(Double.NaN, Double.NaN, "not computed: the spectrum is not stable, growth is unbounded");
        }
        if (a.amplificationBudget() <= 0 || !d.massIsDiagonal()) {
            return e.withAmplification(Double.NaN, Double.NaN, a.amplificationBudget() <= 0
                    ? "not computed (amplification budget 0)" : "not computed (needs a lumped weight matrix)");
        }
        double[] wu = EnergyAnalysis.perUnknown(e.weights(), EnergyAnalysis.fieldOfUnknown(d));
        TransientGrowth.Result r = TransientGrowth.search(j, m, wu, spectralAbscissa, e.numericalAbscissa(),
                a.amplificationBudget());
        String note = String.format(java.util.Locale.ROOT, "power iteration on Crank–Nicolson propagators, %d linear solves%s%s",
                r.solves(), r.budgetSpent() ? "; budget spent, the peak may be higher (raise --amplification-budget)" : "",
                r.atWindowEnd() ? "; peak at the end of the searched window, it may come later" : "");
        return e.withAmplification(r.peak(), r.time(), note);
    }

    /** Newton from the guess; failure becomes NO_STEADY_STATE with the reason kept in the message. */
    public static BaseState steadyState(Problem p, double[] guess) {
        AnalysisSpec a = p.theCase().analysis();
        DampedNewton newton = new DampedNewton(a.newtonTolerance(), a.newtonMaxSteps());
        try {
            return newton.solve(p.full(), guess);
        } catch (ConvergenceException direct) {
            try {
                return SourceHomotopy.solve(p.full(), p.transport(), guess, newton);
            } catch (ConvergenceException e) {
                throw new ConvergenceException(Reason.NO_STEADY_STATE, "no steady state found: " + direct.getMessage()
                        + "; then " + e.getMessage() + ". Beyond a fold there is none; try a smaller value of the driving "
                        + "parameter or 'rdstab critical' to locate the limit", e.iterations(), e.lastResidual(), e);
            }
        }
    }

    private static List<EigenPair> trusted(List<EigenPair> pairs, double limit, List<String> warnings) {
        List<EigenPair> out = new ArrayList<>();
        for (EigenPair e : pairs) {
            if (e.residual() <= limit) {
                out.add(e);
            } else if (out.isEmpty()) {
                throw new ConvergenceException(Reason.EIGEN_NOT_CONVERGED, String.format(java.util.Locale.ROOT,
                        "the rightmost eigenpair (%.6g%+.6gi) has residual %.2e above the limit %.1e; not reported",
                        e.re(), e.im(), e.residual(), limit), -1, e.residual());
            } else {
                warnings.add(String.format(java.util.Locale.ROOT, "eigenpair %.6g%+.6gi dropped: residual %.2e above %.1e",
                        e.re(), e.im(), e.residual(), limit));
            }
        }
        return out;
    }

    /** Fraction of |growth rate| above which the leading eigenvalue's error estimate earns a warning. */
    static final double SENSITIVITY_WARNING = 1e-3;
    /** Energy-norm condition number above which the leading eigenvalue is called very sensitive to the operator. */
    static final double SENSITIVE_OPERATOR = 1e6;

    /**
     * The verdict. The band around zero is the larger of the case's marginal band and the leading eigenvalue's
     * error estimate (condition number × backward error, {@link EigenConditioning}): within it the sign of the
     * growth rate is not established. An energy rate (numerical abscissa) below −band proves decay whatever the
     * eigenvalues' sensitivity, since it bounds every Re λ from the right.
     */
    static Assessment assess(Case c, Discretization d, List<EigenPair> modes, EigenConditioning.Estimate leadCondition,
                             EnergyRates energy, List<String> warnings) {
        EigenPair lead = modes.get(0);
        double growth = lead.re();
        double marginal = c.analysis().marginalBand();
        double eigenError = Double.isNaN(leadCondition.errorEstimate()) ? leadCondition.backwardError()
                : leadCondition.errorEstimate();
        double band = Math.max(marginal, eigenError);
        Verdict v = growth > band ? Verdict.UNSTABLE : growth < -band ? Verdict.STABLE : Verdict.MARGINAL;
        boolean energyProof = energy.numericalAbscissa() < -marginal;
        if (energyProof) {
            v = Verdict.STABLE;
        }
        if (Double.isNaN(leadCondition.condition())) {
            warnings.add("the condition number of the leading eigenvalue could not be computed (the transposed "
                    + "eigenproblem did not converge): its error band is the backward error alone");
        } else {
            if (leadCondition.exceeds(SENSITIVITY_WARNING, growth, marginal)) {
                String size = Double.isFinite(leadCondition.errorEstimate())
                        ? String.format(java.util.Locale.ROOT, "about %.2g", leadCondition.errorEstimate()) : "any amount";
                warnings.add(String.format(java.util.Locale.ROOT, "the computed leading eigenvalue may be off by %s "
                        + "(condition number %.1e × backward error) although its residual is %.1e%s", size,
                        leadCondition.condition(), lead.residual(),
                        energyProof ? "; the negative energy rate still proves decay"
                                : Math.abs(growth) <= eigenError ? "; the sign of the growth rate is not established by "
                                + "the eigenvalues, and the energy rate is not negative either" : ""));
            }
            if (leadCondition.sensitivity() > SENSITIVE_OPERATOR) {
                warnings.add(String.format(java.util.Locale.ROOT, "the leading eigenvalue is very sensitive to "
                        + "unstructured changes of the operator (condition number %.1e in the energy norm; strongly "
                        + "non-normal, as convection-dominated transport is): it is computed accurately for this model "
                        + "(error estimate %.1e) and moves smoothly with the case's parameters, but a small term left out "
                        + "of the model could move it by up to %.1e times that term's size; %s",
                        leadCondition.sensitivity(), leadCondition.errorEstimate(), leadCondition.sensitivity(),
                        energyProof ? "the negative energy rate proves decay regardless"
                                : "the energy rate and the transient growth describe such an operator's disturbances "
                                + "better than the eigenvalue alone"));
            }
        }
        double efold = growth == 0 ? Double.POSITIVE_INFINITY : 1.0 / Math.abs(growth);
        double[][] mode = d.nodalPerturbation(lead.vectorRe());
        double[][] modeIm = d.nodalPerturbation(lead.vectorIm());
        int bestF = 0;
        int bestI = 0;
        double best = -1;
        for (int f = 0; f < mode.length; f++) {
            for (int i = 0; i < mode[f].length; i++) {
                double amp = Math.hypot(mode[f][i], modeIm[f][i]);
                if (amp > best) {
                    best = amp;
                    bestF = f;
                    bestI = i;
                }
            }
        }
        double[] peakX = new double[d.dimension()];
        for (int dir = 0; dir < peakX.length; dir++) {
            peakX[dir] = d.coordinate(bestI, dir);
        }
        String energyVerdict;
        if (energy.numericalAbscissa() < 0) {
            energyVerdict = "energy-stable: every disturbance decays from the start";
        } else if (v == Verdict.STABLE) {
            energyVerdict = "modally stable, transient growth possible";
            String by = Double.isFinite(energy.peakAmplification()) ? String.format(java.util.Locale.ROOT,
                    " (energy-norm amplification up to %.4g at t ≈ %.3g)", energy.peakAmplification(), energy.peakTime()) : "";
            warnings.add("the energy rate is positive while every mode decays: some disturbances grow for a while "
                    + "before they decay (transient growth)" + by);
        } else {
            energyVerdict = v == Verdict.UNSTABLE ? "unstable" : "marginal: the energy rate is not negative";
        }
        if (v == Verdict.MARGINAL) {
            warnings.add("the growth rate is within its error band of zero: the case sits at (or very near) "
                    + "its stability limit; this is not a margin of safety");
        }
        return new Assessment(v, growth, band, efold, lead.im(), c.fields().get(bestF).name(), peakX, energyVerdict,
                List.copyOf(warnings), SafetyCautions.STANDARD);
    }
}
