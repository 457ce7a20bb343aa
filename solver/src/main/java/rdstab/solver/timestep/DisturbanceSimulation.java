package rdstab.solver.timestep;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import rdstab.mesh.assembly.Discretization;
import rdstab.solver.assess.SafetyCautions;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.error.InputException;
import rdstab.solver.newton.BaseState;
import rdstab.solver.newton.DampedNewton;

/**
 * Nonlinear check of the linear prediction: integrates M du/dt = F(u) from ū + A·φ, with φ the real part of mode J
 * scaled to unit max amplitude (its largest entry +1), and compares the measured growth rate of ‖u − ū‖_M with
 * Re λ_J.
 *
 * <h2>What is measured, and how</h2>
 * <ul>
 *   <li>Integration: {@link Rosenbrock2} (ROS2, order 2, L-stable) on the disturbance y = u − ū with
 *       G(y) = F(ū + y) − F(ū) ({@link SemiDiscreteSystem#disturbanceOf}), relative tolerance rtol (default {@link #DEFAULT_RTOL})
 *       norm-wise, absolute tolerance 1e-3·rtol·|A|, so the error is controlled relative to the disturbance itself.</li>
 *   <li>Growth rate: the least-squares slope of ln ‖u − ū‖_M against t over the window [0, 2/|Re λ_J|] (two e-folding
 *       times of the prediction, where a small disturbance is still small); steps in the window are at most 1/40 of
 *       it, so the fit has at least 40 points.</li>
 *   <li>After the window the relative tolerance is relaxed to max(rtol, {@link #LATE_RTOL}): only where the run
 *       ends is needed there.</li>
 *   <li>Runaway: any nodal value of any field above the threshold (default 10·max(max|ū|, 1); a field growing
 *       exponentially, as with Arrhenius kinetics, costs steps per e-fold of the distance to its blow-up time, so a
 *       higher default buys nothing but time); the run stops there.</li>
 *   <li>Steady: after the window, the run stops when the scaled residual max_i |G_i|/w_i ≤ 1e-6·|Re λ_J|·max(max|ū|,
 *       |A|). It is back at the base state when max|u − ū| ≤ 1e-3·|A|; otherwise Newton polishes the state and, unless
 *       it falls back onto ū, the run ended on another steady state (its max and Newton residual are reported).</li>
 *   <li>Default end time: (|ln|A|| + 30)/|Re λ_J|.</li>
 * </ul>
 */
public final class DisturbanceSimulation {

    /** Relative departure of the measured from the linear rate counted as nonlinear. */
    public static final double DEPARTURE = 0.10;
    /**
     * Default relative tolerance: with the window's step cap (1/40 of two e-folding times, |hλ| ≤ 0.05) the rate is
     * already accurate to about 1e-4; tighter tolerances only add steps.
     */
    public static final double DEFAULT_RTOL = 1e-5;
    /** Default runaway factor on max(max|ū|, 1). */
    public static final double RUNAWAY_FACTOR = 10;
    /**
     * Relative tolerance after the fit window (at least the user's): only the end state is needed there, and near a
     * blow-up an order-2 method needs about rtol^(−1/2) steps per e-fold of the remaining time.
     */
    public static final double LATE_RTOL = 1e-4;
    /** Fit window in e-folding times of the predicted rate. */
    public static final double WINDOW_EFOLDS = 2;

    /**
     * Settings.
     *
     * @param mode         1-based mode index (rightmost first)
     * @param amplitudes   signed amplitudes, non-zero
     * @param endTime      end time, NaN for the default
     * @param runawayAbove runaway threshold, NaN for the default
     * @param rtol         relative tolerance of the integrator
     */
    public record Options(int mode, List<Double> amplitudes, double endTime, double runawayAbove, double rtol) {
        public Options {
            amplitudes = List.copyOf(amplitudes);
        }
    }

    /** Told after each run (library code never prints). */
    public interface Listener {
        /** Run {@code index} (1-based) of {@code count} finished. */
        void runDone(int index, int count, SimulationResult.Run run);
    }

    private DisturbanceSimulation() {
    }

    /** Runs every amplitude from the base state and modes of a finished check. */
    public static SimulationResult run(CheckResult check, Options o, Listener listener) {
        List<EigenPair> modes = check.modes();
        if (o.mode() < 1 || o.mode() > modes.size()) {
            throw new InputException("command line", "--mode", "expected a mode from 1 to " + modes.size() + ", found " + o.mode());
        }
        if (o.amplitudes().isEmpty()) {
            throw new InputException("command line", "--amplitude", "at least one amplitude is needed");
        }
        for (double a : o.amplitudes()) {
            if (a == 0 || !Double.isFinite(a)) {
                throw new InputException("command line", "--amplitude", "amplitudes must be finite and non-zero, found " + a);
            }
        }
        if (!(o.rtol() > 0 && o.rtol() < 0.1)) {
            throw new InputException("command line", "--tolerance", "expected a relative tolerance in (0, 0.1), found " + o.rtol());
        }
        EigenPair pair = modes.get(o.mode() - 1);
        double sigma = pair.re();
        if (!(Math.abs(sigma) > 0)) {
            throw new InputException("command line", "--mode", "mode " + o.mode() + " has Re λ = 0: no rate to compare with");
        }
        Discretization d = check.problem().full();
        double[] base = check.base().u();
        double baseMax = maxAbs(check.baseNodal());
        double thr = Double.isNaN(o.runawayAbove()) ? RUNAWAY_FACTOR * Math.max(baseMax, 1.0) : o.runawayAbove();
        if (!(thr > baseMax)) {
            throw new InputException("command line", "--runaway-above", "the threshold must exceed the base-state maximum "
                    + baseMax + ", found " + thr);
        }
        double[] phi = normalisedMode(d, pair);
        List<SimulationResult.Run> runs = new ArrayList<>();
        for (double a : o.amplitudes()) {
            runs.add(one(check, d, base, phi, a, sigma, thr, baseMax, o));
            if (listener != null) {
                listener.runDone(runs.size(), o.amplitudes().size(), runs.get(runs.size() - 1));
            }
        }
        double departure = runs.stream().filter(r -> r.departure(sigma) > DEPARTURE)
                .map(SimulationResult.Run::amplitude).map(Math::abs).min(Comparator.naturalOrder()).orElse(Double.NaN);
        String method = String.format(Locale.ROOT, "ROS2 Rosenbrock method (2 stages, order 2, L-stable; one sparse LU of "
                + "M - γhJ per step, exact Jacobian) with an embedded order-1 error estimate; error norm: norm-wise relative, "
                + "‖e‖/(atol + rtol·‖y‖) in the volume-weighted RMS norm, y = u − ū, rtol = %.1e, atol = 1e-3·rtol·|A|", o.rtol());
        List<String> notes = List.of(
                String.format(Locale.ROOT, "growth rate: least-squares slope of ln‖u − ū‖_M over t in [0, %.4g] "
                        + "(%.0f e-folding times of the predicted rate); tolerance relaxed to %.0e after it", WINDOW_EFOLDS / Math.abs(sigma), WINDOW_EFOLDS, Math.max(o.rtol(), LATE_RTOL)),
                String.format(Locale.ROOT, "runaway: a field above %.4g; steady: scaled residual below "
                        + "1e-6·|Re λ|·max(max|ū|, |A|); back to the base state: max|u − ū| ≤ 1e-3·|A|", thr),
                "the integrated right-hand side is F(ū + y) − F(ū): ū is an exact rest point; the difference is ū's "
                        + "Newton residual " + String.format(Locale.ROOT, "%.1e", check.base().residual()));
        return new SimulationResult(check, o.mode(), sigma, thr, runs, DEPARTURE, departure, method, notes,
                SafetyCautions.STANDARD);
    }

    /** Real part of the mode (imaginary part if the real part vanishes), scaled to max |·| = 1, largest entry +1. */
    static double[] normalisedMode(Discretization d, EigenPair pair) {
        double[] v = pair.vectorRe();
        if (maxAbs(d.nodalPerturbation(v)) <= 1e-8 * maxAbs(d.nodalPerturbation(pair.vectorIm()))) {
            v = pair.vectorIm();
        }
        double big = 0;
        double sign = 1;
        for (double x : v) {
            if (Math.abs(x) > big) {
                big = Math.abs(x);
                sign = Math.signum(x);
            }
        }
        double[] phi = new double[v.length];
        for (int i = 0; i < v.length; i++) {
            phi[i] = sign * v[i] / big;
        }
        return phi;
    }

    private static SimulationResult.Run one(CheckResult check, Discretization d, double[] base, double[] phi, double a,
                                            double sigma, double thr, double baseMax, Options o) {
        int n = base.length;
        double window = WINDOW_EFOLDS / Math.abs(sigma);
        double tEnd = Double.isNaN(o.endTime()) ? (Math.abs(Math.log(Math.abs(a))) + 30) / Math.abs(sigma) : o.endTime();
        if (!(tEnd > 0)) {
            throw new InputException("command line", "--time", "the end time must be > 0, found " + tEnd);
        }
        window = Math.min(window, tEnd);
        SemiDiscreteSystem sys = SemiDiscreteSystem.disturbanceOf(d, base);
        double[] w = DampedNewton.rowSums(d.mass());
        double[] y0 = new double[n];
        for (int i = 0; i < n; i++) {
            y0[i] = a * phi[i];
        }
        double steadyTol = 1e-6 * Math.abs(sigma) * Math.max(baseMax, Math.abs(a));
        Recorder rec = new Recorder(sys, d, base, w, thr, steadyTol, window);
        if (!rec.accepted(0, y0)) {
            return classify(check, d, base, a, new Rosenbrock2.Outcome(0, y0, 0, 0, 0, true), rec, 0, 0, baseMax);
        }
        Rosenbrock2 ros = new Rosenbrock2(sys);
        Rosenbrock2.Settings s = new Rosenbrock2.Settings(o.rtol(), 1e-3 * o.rtol() * Math.abs(a), window / 40, 1_000_000);
        Rosenbrock2.Outcome out = ros.integrate(y0, 0, window, window / 1000, s, rec);
        int acc = out.accepted();
        int rej = out.rejected();
        if (!out.stopped() && tEnd > window) {
            out = ros.integrate(out.y(), window, tEnd, out.lastStep(), late(s, o.rtol(), a, tEnd - window), rec);
            acc += out.accepted();
            rej += out.rejected();
        }
        return classify(check, d, base, a, out, rec, acc, rej, baseMax);
    }

    private static Rosenbrock2.Settings late(Rosenbrock2.Settings s, double rtol, double a, double span) {
        double r = Math.max(rtol, LATE_RTOL);
        return new Rosenbrock2.Settings(r, 1e-3 * r * Math.abs(a), span / 50, s.maxSteps());
    }

    private static SimulationResult.Run classify(CheckResult check, Discretization d, double[] base, double a,
                                                 Rosenbrock2.Outcome out, Recorder rec, int acc, int rej, double baseMax) {
        SimulationResult.Sample last = rec.history.get(rec.history.size() - 1);
        double[] fit = rec.fit();
        SimulationResult.Outcome oc;
        double[] finalMax = last.fieldMax();
        double residual = last.residual();
        if (rec.runaway) {
            oc = SimulationResult.Outcome.RUNAWAY;
        } else if (last.maxDistance() <= 1e-3 * Math.abs(a)) {
            oc = SimulationResult.Outcome.RETURNED;
        } else if (rec.steady) {
            oc = SimulationResult.Outcome.UNDECIDED;
            double[] u = new double[base.length];
            for (int i = 0; i < u.length; i++) {
                u[i] = base[i] + out.y()[i];
            }
            try {
                var a0 = check.problem().theCase().analysis();
                BaseState s = new DampedNewton(a0.newtonTolerance(), a0.newtonMaxSteps()).solve(d, u);
                double dist = 0;
                for (int i = 0; i < u.length; i++) {
                    dist = Math.max(dist, Math.abs(s.u()[i] - base[i]));
                }
                oc = dist <= 1e-6 * Math.max(1, baseMax) ? SimulationResult.Outcome.RETURNED
                        : SimulationResult.Outcome.OTHER_STEADY_STATE;
                finalMax = fieldMax(d.nodalValues(s.u()));
                residual = s.residual();
            } catch (ConvergenceException e) {
                oc = SimulationResult.Outcome.UNDECIDED;
            }
        } else {
            oc = SimulationResult.Outcome.UNDECIDED;
        }
        return new SimulationResult.Run(a, fit[0], rec.window, (int) fit[1], oc, out.t(),
                rec.runaway ? out.t() : Double.NaN, finalMax, last.maxDistance(), residual, acc, rej, rec.history);
    }

    static double maxAbs(double[][] v) {
        double m = 0;
        for (double[] row : v) {
            for (double x : row) {
                m = Math.max(m, Math.abs(x));
            }
        }
        return m;
    }

    static double[] fieldMax(double[][] nodal) {
        double[] m = new double[nodal.length];
        for (int f = 0; f < nodal.length; f++) {
            m[f] = Double.NEGATIVE_INFINITY;
            for (double x : nodal[f]) {
                m[f] = Math.max(m[f], x);
            }
        }
        return m;
    }

    /** Records the history, watches for runaway and steadiness, fits the rate. */
    private static final class Recorder implements Rosenbrock2.Observer {
        final SemiDiscreteSystem sys;
        final Discretization d;
        final double[] base;
        final double[] w;
        final double thr;
        final double steadyTol;
        final double window;
        final double[] u;
        final double[] g;
        final List<SimulationResult.Sample> history = new ArrayList<>();
        boolean runaway;
        boolean steady;

        Recorder(SemiDiscreteSystem sys, Discretization d, double[] base, double[] w, double thr, double steadyTol,
                 double window) {
            this.sys = sys;
            this.d = d;
            this.base = base;
            this.w = w;
            this.thr = thr;
            this.steadyTol = steadyTol;
            this.window = window;
            this.u = new double[base.length];
            this.g = new double[base.length];
        }

        @Override
        public boolean accepted(double t, double[] y) {
            double dist2 = 0;
            double distMax = 0;
            for (int i = 0; i < y.length; i++) {
                u[i] = base[i] + y[i];
                dist2 += w[i] * y[i] * y[i];
                distMax = Math.max(distMax, Math.abs(y[i]));
            }
            sys.rhs(y, g);
            double rho = DampedNewton.scaledNorm(g, w);
            double[][] nodal = d.nodalValues(u);
            history.add(new SimulationResult.Sample(t, Math.sqrt(dist2), distMax, fieldMax(nodal), rho));
            if (maxAbs(nodal) > thr) {
                runaway = true;
                return false;
            }
            if (t >= window && rho <= steadyTol) {
                steady = true;
                return false;
            }
            return true;
        }

        /** {slope, samples} of ln distance over the window. */
        double[] fit() {
            double st = 0;
            double sl = 0;
            double stt = 0;
            double stl = 0;
            int k = 0;
            for (SimulationResult.Sample s : history) {
                if (s.t() > window * (1 + 1e-12) || !(s.distance() > 0)) {
                    continue;
                }
                double l = Math.log(s.distance());
                st += s.t();
                sl += l;
                stt += s.t() * s.t();
                stl += s.t() * l;
                k++;
            }
            double den = k * stt - st * st;
            return new double[] {k >= 3 && den > 0 ? (k * stl - st * sl) / den : Double.NaN, k};
        }
    }
}
