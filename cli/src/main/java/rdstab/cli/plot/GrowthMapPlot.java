package rdstab.cli.plot;

import java.awt.Color;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.knowm.xchart.HeatMapChart;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;
import rdstab.cli.output.AtomicFiles;

/**
 * A two-parameter sweep, as two pictures:
 * <ul>
 *   <li>{@code growth-map}: the growth rate as a colour map (diverging palette, white at zero, blue stable, red
 *       unstable), bilinear between the sweep points; points without a result leave their cells white;</li>
 *   <li>{@code neutral-curve}: the sweep points marked stable / unstable / no result, and the neutral curve
 *       (growth rate 0) traced by marching squares: on every grid cell whose four corners have results, the zero
 *       of the bilinear interpolant is located on each edge with a sign change by linear interpolation, and the
 *       crossings are joined; a saddle cell (four crossings) is resolved by the sign of the cell's mean.</li>
 * </ul>
 */
public final class GrowthMapPlot {

    private GrowthMapPlot() {
    }

    /**
     * Line pieces of the neutral curve: x and y lists with a null after each piece (the plotting library breaks the
     * line there).
     *
     * @param a      first parameter values (columns), increasing
     * @param b      second parameter values (rows), increasing
     * @param growth growth[i][j] at (a[i], b[j]), NaN where none
     */
    public static List<List<Double>> neutralCurve(double[] a, double[] b, double[][] growth) {
        List<Double> xs = new ArrayList<>();
        List<Double> ys = new ArrayList<>();
        for (int i = 0; i + 1 < a.length; i++) {
            for (int j = 0; j + 1 < b.length; j++) {
                double[] g = {growth[i][j], growth[i + 1][j], growth[i + 1][j + 1], growth[i][j + 1]};
                double[] cx = {a[i], a[i + 1], a[i + 1], a[i]};
                double[] cy = {b[j], b[j], b[j + 1], b[j + 1]};
                if (!(Double.isFinite(g[0]) && Double.isFinite(g[1]) && Double.isFinite(g[2]) && Double.isFinite(g[3]))) {
                    continue;
                }
                List<double[]> cross = new ArrayList<>();
                for (int e = 0; e < 4; e++) {
                    int f = (e + 1) % 4;
                    if ((g[e] < 0) != (g[f] < 0)) {
                        double t = g[e] / (g[e] - g[f]);
                        cross.add(new double[] {cx[e] + t * (cx[f] - cx[e]), cy[e] + t * (cy[f] - cy[e])});
                    }
                }
                if (cross.size() == 2) {
                    piece(xs, ys, cross.get(0), cross.get(1));
                } else if (cross.size() == 4) {
                    boolean meanBelow = (g[0] + g[1] + g[2] + g[3]) < 0;
                    // crossings lie on edges 0-1, 1-2, 2-3, 3-0; join around the corners whose sign differs from the mean
                    if ((g[0] < 0) != meanBelow) {
                        piece(xs, ys, cross.get(3), cross.get(0));
                        piece(xs, ys, cross.get(1), cross.get(2));
                    } else {
                        piece(xs, ys, cross.get(0), cross.get(1));
                        piece(xs, ys, cross.get(2), cross.get(3));
                    }
                }
            }
        }
        return List.of(xs, ys);
    }

    private static void piece(List<Double> xs, List<Double> ys, double[] p, double[] q) {
        xs.add(p[0]);
        ys.add(p[1]);
        xs.add(q[0]);
        ys.add(q[1]);
        xs.add(q[0]);
        ys.add(null);
    }

    /** The sweep points by outcome and the neutral curve. */
    public static XYChart neutralChart(String aName, String bName, double[] a, double[] b, double[][] growth) {
        XYChart c = PlotStyle.xy("Stable and unstable sweep points, neutral curve", aName, bName);
        List<Double>[] st = points(a, b, growth, -1);
        List<Double>[] un = points(a, b, growth, 1);
        List<Double>[] no = points(a, b, growth, 0);
        marks(c, "stable", st, SeriesMarkers.CIRCLE, Palette.line(0));
        marks(c, "unstable", un, SeriesMarkers.TRIANGLE_UP, Palette.line(1));
        marks(c, "no steady state or not converged", no, SeriesMarkers.CROSS, Palette.line(3));
        List<List<Double>> curve = neutralCurve(a, b, growth);
        if (!curve.get(0).isEmpty()) {
            XYSeries s = c.addSeries("neutral curve (growth rate 0)", curve.get(0), curve.get(1));
            s.setMarker(SeriesMarkers.NONE);
            s.setLineColor(Color.BLACK);
            s.setLineStyle(PlotStyle.SOLID);
        }
        double padA = 0.03 * (a[a.length - 1] - a[0]);
        double padB = 0.03 * (b[b.length - 1] - b[0]);
        c.getStyler().setXAxisMin(a[0] - padA);
        c.getStyler().setXAxisMax(a[a.length - 1] + padA);
        c.getStyler().setYAxisMin(b[0] - padB);
        c.getStyler().setYAxisMax(b[b.length - 1] + padB);
        return c;
    }

    @SuppressWarnings("unchecked")
    private static List<Double>[] points(double[] a, double[] b, double[][] g, int sign) {
        List<Double> xs = new ArrayList<>();
        List<Double> ys = new ArrayList<>();
        for (int i = 0; i < a.length; i++) {
            for (int j = 0; j < b.length; j++) {
                boolean ok = Double.isFinite(g[i][j]);
                boolean take = sign == 0 ? !ok : ok && (sign > 0 ? g[i][j] >= 0 : g[i][j] < 0);
                if (take) {
                    xs.add(a[i]);
                    ys.add(b[j]);
                }
            }
        }
        return new List[] {xs, ys};
    }

    private static void marks(XYChart c, String name, List<Double>[] pts, org.knowm.xchart.style.markers.Marker m, Color col) {
        if (pts[0].isEmpty()) {
            return;
        }
        XYSeries s = c.addSeries(name, pts[0], pts[1]);
        s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        s.setMarker(m);
        s.setMarkerColor(col);
    }

    /** The growth rate as a colour map at the given long-side resolution. */
    public static HeatMapChart mapChart(String aName, String bName, double[] a, double[] b, double[][] growth, int pixels) {
        int na = a.length;
        int nb = b.length;
        double[] x = new double[na * nb];
        double[] y = new double[na * nb];
        double[] v = new double[na * nb];
        for (int i = 0; i < na; i++) {
            for (int j = 0; j < nb; j++) {
                x[i * nb + j] = a[i];
                y[i * nb + j] = b[j];
                v[i * nb + j] = growth[i][j];
            }
        }
        int[][] cells = new int[(na - 1) * (nb - 1)][];
        int k = 0;
        for (int i = 0; i + 1 < na; i++) {
            for (int j = 0; j + 1 < nb; j++) {
                cells[k++] = new int[] {i * nb + j, (i + 1) * nb + j, (i + 1) * nb + j + 1, i * nb + j + 1};
            }
        }
        return FieldMapPlot.chart("Growth rate max Re λ (blue stable, red unstable; blank: no steady state)", aName, bName,
                Raster.sample(x, y, cells, v, pixels, pixels * 3 / 5), true, PlotStyle.HEIGHT);
    }

    /** Writes {@code growth-map} and {@code neutral-curve} (PNG and SVG) into {@code dir}; returns the paths. */
    public static List<Path> write(Path dir, String aName, String bName, double[] a, double[] b, double[][] growth) {
        if (a.length < 2 || b.length < 2 || growth.length != a.length || growth[0].length != b.length) {
            throw new IllegalArgumentException("a growth map needs at least 2 × 2 points and growth[" + a.length + "]["
                    + b.length + "]");
        }
        List<Path> out = new ArrayList<>();
        Path png = dir.resolve("growth-map.png");
        Path svg = dir.resolve("growth-map.svg");
        AtomicFiles.write(png, PlotFiles.png(mapChart(aName, bName, a, b, growth, FieldMapPlot.PNG_PIXELS)), true);
        AtomicFiles.write(svg, PlotFiles.svg(mapChart(aName, bName, a, b, growth, FieldMapPlot.SVG_PIXELS)), true);
        out.add(png);
        out.add(svg);
        out.addAll(PlotFiles.save(neutralChart(aName, bName, a, b, growth), dir, "neutral-curve", true));
        return out;
    }
}
