package rdstab.cli.plot;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Supplier;
import org.knowm.xchart.internal.chartpart.Chart;
import rdstab.cli.output.AtomicFiles;
import rdstab.cli.output.ResultFiles;
import rdstab.mesh.assembly.Discretization;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.model.Case;
import rdstab.solver.model.FieldSpec;

/**
 * The pictures of one check (rdstab check --plots DIR):
 * <ul>
 *   <li>1D: {@code base-FIELD} (the base-state profile of each field) and {@code modes-FIELD} (the leading
 *       {@value #MAX_MODES_1D} modes on one chart, real parts, each normalised to largest amplitude 1 over all
 *       fields and real-positive there, the legend giving each eigenvalue);</li>
 *   <li>2D: {@code base-FIELD} as a colour map (viridis) and {@code modeK-FIELD} for the leading
 *       {@value #MAX_MODES_2D} modes (real part, diverging map symmetric about zero);</li>
 *   <li>{@code spectrum}: the computed eigenvalues in the complex plane.</li>
 * </ul>
 * Each as NAME.png and NAME.svg. Field names are made file-safe (anything but letters, digits, '-' and '_'
 * becomes '_').
 */
public final class CheckPlots {

    /** Modes drawn together on a 1D chart. */
    public static final int MAX_MODES_1D = 4;
    /** Modes drawn as separate maps in 2D. */
    public static final int MAX_MODES_2D = 2;

    /**
     * One picture.
     *
     * @param name    file name without extension
     * @param caption one-line description (used by the HTML report)
     * @param chart   the chart at PNG resolution
     * @param svg     builds the chart for the SVG file (a coarser raster for colour maps)
     */
    public record Figure(String name, String caption, Chart<?, ?> chart, Supplier<Chart<?, ?>> svg) {
    }

    private CheckPlots() {
    }

    /** The pictures of a check result, in report order. */
    public static List<Figure> figures(CheckResult r) {
        Discretization d = r.problem().full();
        Case c = r.problem().theCase();
        List<Figure> out = new ArrayList<>();
        if (d.dimension() == 1) {
            oneD(r, d, c, out);
        } else {
            twoD(r, d, c, out);
        }
        double[] re = new double[r.modes().size()];
        double[] im = new double[re.length];
        for (int k = 0; k < re.length; k++) {
            re[k] = r.modes().get(k).re();
            im[k] = r.modes().get(k).im();
        }
        String title = "Rightmost eigenvalues of J x = λ M x";
        out.add(new Figure("spectrum", "the computed eigenvalues in the complex plane; right of the dashed line grows",
                SpectrumPlot.chart(title, re, im), () -> SpectrumPlot.chart(title, re, im)));
        return out;
    }

    /** Writes every figure as PNG and SVG into {@code dir}; returns the paths written. */
    public static List<Path> write(CheckResult r, Path dir, boolean overwrite) {
        List<Path> paths = new ArrayList<>();
        for (Figure f : figures(r)) {
            Path png = dir.resolve(f.name() + ".png");
            Path svg = dir.resolve(f.name() + ".svg");
            AtomicFiles.write(png, PlotFiles.png(f.chart()), overwrite);
            AtomicFiles.write(svg, PlotFiles.svg(f.svg().get()), overwrite);
            paths.add(png);
            paths.add(svg);
        }
        return paths;
    }

    /** Nodal modes [mode][field][node], real parts, normalised as in modes.csv. */
    static double[][][] modes(CheckResult r, int max) {
        Discretization d = r.problem().full();
        int k = Math.min(max, r.modes().size());
        double[][][] out = new double[k][][];
        for (int m = 0; m < k; m++) {
            EigenPair e = r.modes().get(m);
            double[][] re = d.nodalPerturbation(e.vectorRe());
            double[][] im = d.nodalPerturbation(e.vectorIm());
            ResultFiles.normalise(re, im);
            out[m] = re;
        }
        return out;
    }

    static String modeLabel(int m, EigenPair e) {
        return "mode " + (m + 1) + ": λ = " + PlotStyle.eigenvalue(e.re(), e.im()) + (e.isReal() ? "" : " (real part)");
    }

    private static void oneD(CheckResult r, Discretization d, Case c, List<Figure> out) {
        double[] x = new double[d.nodes()];
        for (int i = 0; i < x.length; i++) {
            x[i] = d.coordinate(i, 0);
        }
        String xTitle = c.shape().radial() ? "radius r" : "position x";
        double[][][] modes = modes(r, MAX_MODES_1D);
        for (int f = 0; f < d.fieldCount(); f++) {
            FieldSpec fs = c.fields().get(f);
            String yTitle = PlotStyle.withUnit(fs.name(), fs.unit());
            String t1 = "Base state " + fs.name();
            List<ProfilePlot.Curve> base = List.of(new ProfilePlot.Curve(fs.name(), r.baseNodal()[f]));
            out.add(new Figure("base-" + safe(fs.name()), "base-state profile of " + fs.name(),
                    ProfilePlot.chart(t1, xTitle, yTitle, x, base), () -> ProfilePlot.chart(t1, xTitle, yTitle, x, base)));
            List<ProfilePlot.Curve> curves = new ArrayList<>();
            for (int m = 0; m < modes.length; m++) {
                curves.add(new ProfilePlot.Curve(modeLabel(m, r.modes().get(m)), modes[m][f]));
            }
            String t2 = "Leading modes, field " + fs.name();
            String y2 = "mode of " + fs.name() + " (largest amplitude 1)";
            out.add(new Figure("modes-" + safe(fs.name()), "the leading modes in field " + fs.name()
                    + ", rightmost first", ProfilePlot.chart(t2, xTitle, y2, x, curves),
                    () -> ProfilePlot.chart(t2, xTitle, y2, x, curves)));
        }
    }

    private static void twoD(CheckResult r, Discretization d, Case c, List<Figure> out) {
        int n = d.nodes();
        double[] x = new double[n];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = d.coordinate(i, 0);
            y[i] = d.coordinate(i, 1);
        }
        int[][] cells = d.cells();
        double[][][] modes = modes(r, MAX_MODES_2D);
        for (int f = 0; f < d.fieldCount(); f++) {
            FieldSpec fs = c.fields().get(f);
            double[] base = r.baseNodal()[f];
            String t1 = "Base state " + PlotStyle.withUnit(fs.name(), fs.unit());
            out.add(map("base-" + safe(fs.name()), "base state of " + fs.name() + " (colour map)", t1, x, y, cells, base, false));
            for (int m = 0; m < modes.length; m++) {
                String t = "Mode " + (m + 1) + " of " + fs.name() + ", λ = " + PlotStyle.eigenvalue(r.modes().get(m).re(),
                        r.modes().get(m).im());
                out.add(map("mode" + (m + 1) + "-" + safe(fs.name()), "mode " + (m + 1) + " in field " + fs.name()
                        + " (real part, largest amplitude 1; red positive, blue negative)", t, x, y, cells, modes[m][f], true));
            }
        }
    }

    private static Figure map(String name, String caption, String title, double[] x, double[] y, int[][] cells,
                              double[] v, boolean diverging) {
        return new Figure(name, caption,
                FieldMapPlot.chart(title, "x", "y", Raster.sample(x, y, cells, v, FieldMapPlot.PNG_PIXELS), diverging),
                () -> FieldMapPlot.chart(title, "x", "y", Raster.sample(x, y, cells, v, FieldMapPlot.SVG_PIXELS), diverging));
    }

    /** A file-safe form of a field name. */
    static String safe(String name) {
        return name.replaceAll("[^A-Za-z0-9_-]", "_");
    }
}
