package rdstab.cli.plot;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.knowm.xchart.XYChart;
import rdstab.solver.timestep.SimulationResult;

/**
 * The picture of a disturbance simulation (rdstab simulate --plots DIR): {@code time-history}, the distance
 * ‖u(t) − ū‖_M of every run on a log axis (one solid line per amplitude, its outcome in the legend) with the linear
 * prediction ‖u(0) − ū‖_M·e^{Re λ t} of the mode dashed in the same colour. On a log axis exponential growth or decay
 * is a straight line, so where a run bends away from its dashed line the nonlinearity takes over.
 */
public final class SimulatePlots {

    private SimulatePlots() {
    }

    /** Writes {@code time-history.png} and {@code .svg} into dir. */
    public static List<Path> write(SimulationResult s, Path dir, boolean overwrite) {
        return PlotFiles.save(chart(s), dir, "time-history", overwrite);
    }

    /** The chart. */
    public static XYChart chart(SimulationResult s) {
        List<TimeHistoryPlot.History> runs = new ArrayList<>();
        for (SimulationResult.Run r : s.runs()) {
            String what = runs.isEmpty() ? " (largest initial |u − ū|)" : "";
            int n = r.history().size();
            double[] t = new double[n];
            double[] a = new double[n];
            for (int i = 0; i < n; i++) {
                t[i] = r.history().get(i).t();
                a[i] = r.history().get(i).distance();
            }
            runs.add(new TimeHistoryPlot.History("A = " + TimeHistoryPlot.compact(r.amplitude()) + what + ": "
                    + r.outcome().words(), t, a));
        }
        XYChart c = TimeHistoryPlot.chart(runs, "distance from the base state ‖u − ū‖_M (log scale)", s.linearRate());
        c.setTitle("Disturbance of mode " + s.mode() + " over time, nonlinear runs and linear prediction");
        return c;
    }
}
