package rdstab.cli.plot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.Color;
import java.awt.image.BufferedImage;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The plotting API for sweep, trace, converge and simulate: files decode, are not blank, and show the data. */
class SweepAndTracePlotsTest {

    @TempDir
    Path tmp;

    /** Growth curve: stable fill only where growth < 0, unstable fill only where a point has growth > 0. */
    @Test
    void growthCurveShadesStableAndUnstableRanges() throws Exception {
        double[] p = {0.5, 0.6, 0.7, 0.8, 0.9, 1.0};
        double[] up = {-1.0, -0.7, -0.4, -0.1, 0.2, 0.5};
        String[] st = {"ok", "ok", "ok", "not_converged", "ok", "ok"};
        List<Path> f = GrowthCurvePlot.write(tmp, "delta", p, up, st);
        BufferedImage img = Pictures.png(f.get(0), PlotStyle.WIDTH, PlotStyle.HEIGHT);
        Pictures.svg(f.get(1), PlotStyle.WIDTH, PlotStyle.HEIGHT);
        int stable = Pictures.count(img, Pictures.overWhite(Palette.STABLE_FILL), 3);
        int unstable = Pictures.count(img, Pictures.overWhite(Palette.UNSTABLE_FILL), 3);
        assertTrue(stable > 1000, "stable range not shaded: " + stable);
        assertTrue(unstable > 1000, "unstable range not shaded: " + unstable);
        double[] down = {-1.0, -0.9, -0.8, -0.7, -0.6, -0.5};
        BufferedImage all = Pictures.png(GrowthCurvePlot.write(tmp, "delta", p, down, null).get(0), PlotStyle.WIDTH,
                PlotStyle.HEIGHT);
        assertTrue(Pictures.count(all, Pictures.overWhite(Palette.UNSTABLE_FILL), 3) < 50, "unstable fill on an all-stable sweep");
    }

    /** Marching squares on a linear growth g = a + b − 1: every neutral-curve point lies on a + b = 1 exactly. */
    @Test
    void neutralCurveOfLinearGrowthIsTheLine() throws Exception {
        double[] a = {0, 0.25, 0.5, 0.75, 1};
        double[] b = {0, 0.2, 0.4, 0.6, 0.8, 1};
        double[][] g = new double[a.length][b.length];
        for (int i = 0; i < a.length; i++) {
            for (int j = 0; j < b.length; j++) {
                g[i][j] = a[i] + b[j] - 1;
            }
        }
        g[0][5] = Double.NaN; // one failed point: its cells drop out, the rest stays
        List<List<Double>> c = GrowthMapPlot.neutralCurve(a, b, g);
        int points = 0;
        for (int k = 0; k < c.get(0).size(); k++) {
            if (c.get(1).get(k) != null) {
                assertEquals(1.0, c.get(0).get(k) + c.get(1).get(k), 1e-12);
                points++;
            }
        }
        assertTrue(points >= 10, "too few neutral-curve points: " + points);
        List<Path> f = GrowthMapPlot.write(tmp, "delta", "Biot number Bi", a, b, g);
        assertEquals(4, f.size());
        BufferedImage map = javax.imageio.ImageIO.read(f.get(0).toFile());
        Pictures.png(f.get(0), map.getWidth(), map.getHeight());
        Pictures.svg(f.get(1), map.getWidth(), map.getHeight());
        Pictures.png(f.get(2), PlotStyle.WIDTH, PlotStyle.HEIGHT);
        Pictures.svg(f.get(3), PlotStyle.WIDTH, PlotStyle.HEIGHT);
    }

    /** Neutral curve of g = a² + b² − 1 lies within O(h²) of the unit circle (linear interpolation error). */
    @Test
    void neutralCurveOfCircleIsNearTheCircle() {
        int n = 21;
        double[] a = new double[n];
        for (int i = 0; i < n; i++) {
            a[i] = -1.5 + 3.0 * i / (n - 1);
        }
        double[][] g = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                g[i][j] = a[i] * a[i] + a[j] * a[j] - 1;
            }
        }
        List<List<Double>> c = GrowthMapPlot.neutralCurve(a, a, g);
        double h = a[1] - a[0];
        for (int k = 0; k < c.get(0).size(); k++) {
            if (c.get(1).get(k) != null) {
                double r = Math.hypot(c.get(0).get(k), c.get(1).get(k));
                assertEquals(1.0, r, h * h, "point " + k);
            }
        }
    }

    /** Branch: dashed and solid pieces in the line colour, black special-point markers. */
    @Test
    void branchDiagramFilesAndMarks() throws Exception {
        int n = 60;
        double[] p = new double[n];
        double[] m = new double[n];
        boolean[] stable = new boolean[n];
        for (int i = 0; i < n; i++) {
            double s = -1.2 + 2.4 * i / (n - 1); // fold parabola p = 0.88 − s², lower part stable
            p[i] = 0.88 - s * s;
            m[i] = 1.5 + s;
            stable[i] = s < 0;
        }
        List<Path> f = BranchPlot.write(tmp, "delta", p, m, stable, List.of(new BranchPlot.Label(0.88, 1.5, "fold")));
        BufferedImage img = Pictures.png(f.get(0), PlotStyle.WIDTH, PlotStyle.HEIGHT);
        Pictures.svg(f.get(1), PlotStyle.WIDTH, PlotStyle.HEIGHT);
        assertTrue(Pictures.count(img, Palette.line(0), 0) > 300, "branch line missing");
        assertTrue(Pictures.count(img, Color.BLACK, 0) > 60, "special-point marker and label missing");
        assertThrows(IllegalArgumentException.class,
                () -> BranchPlot.chart("p", "m", new double[] {1, 2}, new double[] {1}, new boolean[] {true, true}, List.of()));
    }

    /** Convergence and time history: decode, not blank; bad log data rejected. */
    @Test
    void convergenceAndTimeHistory() throws Exception {
        double[] h = {0.1, 0.05, 0.025, 0.0125};
        double[] e = new double[h.length];
        for (int i = 0; i < h.length; i++) {
            e[i] = 3 * h[i] * h[i];
        }
        List<Path> c = ConvergencePlot.write(tmp, h, e);
        Pictures.png(c.get(0), PlotStyle.WIDTH, PlotStyle.HEIGHT);
        Pictures.svg(c.get(1), PlotStyle.WIDTH, PlotStyle.HEIGHT);
        assertTrue(ConvergencePlot.chart(h, e).getSeriesMap().keySet().iterator().next().contains("order 2"),
                "observed order of e = 3h² should read 2");
        double[] t = new double[50];
        double[] amp = new double[50];
        for (int i = 0; i < t.length; i++) {
            t[i] = 0.1 * i;
            amp[i] = 1e-3 * Math.exp(0.8 * t[i]) / (1 + 1e-3 * Math.exp(0.8 * t[i]));
        }
        List<Path> th = TimeHistoryPlot.write(tmp, t, amp, 0.8);
        Pictures.png(th.get(0), PlotStyle.WIDTH, PlotStyle.HEIGHT);
        Pictures.svg(th.get(1), PlotStyle.WIDTH, PlotStyle.HEIGHT);
        assertThrows(IllegalArgumentException.class, () -> ConvergencePlot.chart(new double[] {0.1, 0}, new double[] {1, 1}));
    }

    /** Spectrum: the rightmost eigenvalue is named in the legend; files decode. */
    @Test
    void spectrumMarksTheRightmost() throws Exception {
        double[] re = {0.3, 0.3, -1, -2.5};
        double[] im = {2, -2, 0, 0};
        List<Path> f = SpectrumPlot.write(tmp, re, im, true);
        BufferedImage img = Pictures.png(f.get(0), PlotStyle.WIDTH, PlotStyle.HEIGHT);
        Pictures.svg(f.get(1), PlotStyle.WIDTH, PlotStyle.HEIGHT);
        assertTrue(SpectrumPlot.chart("s", re, im).getSeriesMap().containsKey("rightmost: λ = 0.3 + 2i"));
        assertTrue(Pictures.count(img, Palette.line(1), 0) > 30, "rightmost marker missing");
    }
}
