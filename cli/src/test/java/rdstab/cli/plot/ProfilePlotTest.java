package rdstab.cli.plot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.awt.image.BufferedImage;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** 1D curves: files decode, and the drawn curve is the data (its peak lands where the data's peak is). */
class ProfilePlotTest {

    @TempDir
    Path tmp;

    /**
     * The highest drawn pixel of a one-curve chart, mapped back through the plot area (whose left and right
     * edges are the curve's own first and last points, since the x axis spans the data exactly), lies at the x of
     * the data's maximum, for peaks placed across the range. Tolerance 0.01 of the span: about 8 pixels at the
     * default width, covering the 2.5-pixel line width and the flat top of a sampled peak.
     */
    @Test
    void highestDrawnPointIsAtThePeak() throws Exception {
        for (double peak : new double[] {0.2, 0.55, 0.83}) {
            int n = 201;
            double[] x = new double[n];
            double[] y = new double[n];
            for (int i = 0; i < n; i++) {
                x[i] = 2.0 + 3.0 * i / (n - 1); // span [2, 5]
                double s = (x[i] - (2 + 3 * peak)) / 0.3;
                y[i] = Math.exp(-s * s) - 0.2 * x[i] / 5;
            }
            int best = 0;
            for (int i = 1; i < n; i++) {
                best = y[i] > y[best] ? i : best;
            }
            List<Path> files = ProfilePlot.write(tmp, "peak", "one mode", "position x [m]", "mode", x,
                    List.of(new ProfilePlot.Curve("mode 1", y)), true);
            BufferedImage img = Pictures.png(files.get(0), PlotStyle.WIDTH, PlotStyle.HEIGHT);
            Pictures.svg(files.get(1), PlotStyle.WIDTH, PlotStyle.HEIGHT);
            double[] e = Pictures.curveExtent(img, Palette.line(0));
            double xDrawn = x[0] + (e[2] - e[0]) / (e[1] - e[0]) * (x[n - 1] - x[0]);
            assertEquals(x[best], xDrawn, 0.01 * 3, "peak placed at " + peak);
        }
    }

    @Test
    void mismatchedCurveIsRejected() {
        assertThrows(IllegalArgumentException.class, () -> ProfilePlot.chart("t", "x", "y", new double[] {0, 1},
                List.of(new ProfilePlot.Curve("c", new double[] {1, 2, 3}))));
    }
}
