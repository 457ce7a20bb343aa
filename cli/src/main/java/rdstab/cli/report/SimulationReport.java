package rdstab.cli.report;

import static rdstab.cli.report.ResultJson.num;
import static rdstab.cli.report.TextReport.sig;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.timestep.SimulationResult;

/** Text, JSON and CSV of rdstab simulate. */
public final class SimulationReport {

    private SimulationReport() {
    }

    /** The text report. */
    public static void write(SimulationResult s, PrintWriter w) {
        CheckResult c = s.check();
        var cs = c.problem().theCase();
        List<String> fields = cs.fieldNames();
        w.println(cs.title());
        w.println("case " + cs.source() + " | " + cs.shape().word() + ", " + cs.mesh().cells() + " cells | "
                + TextReport.parameters(cs));
        w.println();
        w.printf(Locale.ROOT, "NONLINEAR CHECK of mode %d: linear prediction Re λ = %s per unit time (base state %s)%n",
                s.mode(), sig(s.linearRate(), 8), c.assessment().verdict().word());
        w.println("  integrator: " + s.method());
        w.println();
        w.printf(Locale.ROOT, "  %12s  %14s  %9s  %-30s  %10s  %s%n", "amplitude", "measured rate", "departure", "ends",
                "at time", "final max " + String.join(", ", fields));
        for (SimulationResult.Run r : s.runs()) {
            w.printf(Locale.ROOT, "  %12s  %14s  %8.2f%%  %-30s  %10s  %s%n", sig(r.amplitude(), 4), sig(r.measuredRate(), 7),
                    100 * r.departure(s.linearRate()), r.outcome().words(), sig(r.endTime(), 5), maxList(r.finalMax()));
        }
        w.println();
        if (Double.isNaN(s.departureAmplitude())) {
            w.printf(Locale.ROOT, "The measured rate stays within %.0f%% of the linear one for every amplitude tried.%n",
                    100 * s.departureLimit());
        } else {
            w.printf(Locale.ROOT, "The measured rate departs from the linear one by more than %.0f%% from amplitude %s on: "
                    + "beyond that the linear prediction does not describe the disturbance.%n", 100 * s.departureLimit(),
                    sig(s.departureAmplitude(), 4));
        }
        for (SimulationResult.Run r : s.runs()) {
            if (r.outcome() == SimulationResult.Outcome.RUNAWAY) {
                w.printf(Locale.ROOT, "Amplitude %s runs away: a field exceeds %s at t = %s.%n", sig(r.amplitude(), 4),
                        sig(s.runawayAbove(), 6), sig(r.runawayTime(), 6));
            } else if (r.outcome() == SimulationResult.Outcome.OTHER_STEADY_STATE) {
                w.printf(Locale.ROOT, "Amplitude %s settles on another steady state (max %s, Newton residual %.1e).%n",
                        sig(r.amplitude(), 4), maxList(r.finalMax()), r.finalResidual());
            }
        }
        w.println();
        w.println("How it was measured");
        for (String n : s.notes()) {
            w.println("  - " + n);
        }
        w.println();
        w.println("Cautions");
        for (String n : s.cautions()) {
            w.println("  - " + n);
        }
        w.flush();
    }

    private static String maxList(double[] v) {
        List<String> s = new ArrayList<>();
        for (double x : v) {
            s.add(sig(x, 7));
        }
        return String.join(", ", s);
    }

    /** The JSON object. */
    public static Map<String, Object> toMap(SimulationResult s) {
        List<String> fields = s.check().problem().theCase().fieldNames();
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("mode", s.mode());
        m.put("linear_rate", num(s.linearRate()));
        Map<String, Object> check = new LinkedHashMap<>();
        check.put("verdict", s.check().assessment().verdict().word());
        check.put("growth_rate", num(s.check().assessment().growthRate()));
        m.put("check", check);
        m.put("method", s.method());
        m.put("runaway_above", num(s.runawayAbove()));
        List<Object> runs = new ArrayList<>();
        for (SimulationResult.Run r : s.runs()) {
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("amplitude", num(r.amplitude()));
            x.put("measured_rate", num(r.measuredRate()));
            x.put("departure", num(r.departure(s.linearRate())));
            x.put("fit_window", List.of(0.0, r.fitEnd()));
            x.put("fit_samples", r.fitSamples());
            x.put("outcome", r.outcome().words());
            x.put("end_time", num(r.endTime()));
            x.put("runaway_time", num(r.runawayTime()));
            Map<String, Object> fm = new LinkedHashMap<>();
            for (int f = 0; f < fields.size(); f++) {
                fm.put(fields.get(f), num(r.finalMax()[f]));
            }
            x.put("final_max", fm);
            x.put("final_distance", num(r.finalDistance()));
            x.put("final_residual", num(r.finalResidual()));
            x.put("steps_accepted", r.accepted());
            x.put("steps_rejected", r.rejected());
            runs.add(x);
        }
        m.put("runs", runs);
        m.put("departure_limit", s.departureLimit());
        m.put("departure_amplitude", num(s.departureAmplitude()));
        m.put("notes", s.notes());
        m.put("parameters", s.check().problem().theCase().parameters());
        m.put("cautions", s.cautions());
        return m;
    }

    /** Time histories: one row per accepted step of every run. */
    public static String csv(SimulationResult s) {
        List<String> fields = s.check().problem().theCase().fieldNames();
        StringBuilder sb = new StringBuilder("run,amplitude,t,distance_energy,distance_max");
        for (String f : fields) {
            sb.append(",max_").append(f);
        }
        sb.append(",residual\n");
        int k = 1;
        for (SimulationResult.Run r : s.runs()) {
            for (SimulationResult.Sample p : r.history()) {
                sb.append(k).append(',').append(r.amplitude()).append(',').append(p.t()).append(',').append(p.distance())
                  .append(',').append(p.maxDistance());
                for (double v : p.fieldMax()) {
                    sb.append(',').append(v);
                }
                sb.append(',').append(p.residual()).append('\n');
            }
            k++;
        }
        return sb.toString();
    }
}
