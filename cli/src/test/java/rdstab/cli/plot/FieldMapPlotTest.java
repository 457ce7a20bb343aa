package rdstab.cli.plot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** 2D colour maps: the raster is the finite-element interpolant, and the pictures show the data's colours. */
class FieldMapPlotTest {

    @TempDir
    Path tmp;

    static double linear(double x, double y) {
        return 2 * x - 3 * y + 1;
    }

    /**
     * P1 on triangles and bilinear on (distorted, convex) quadrilaterals both reproduce a linear function exactly
     * (a property of the element spaces, any finite-element text); so every pixel inside the body equals the
     * function at its centre to round-off. Seeded random distortions of the mesh.
     */
    @Test
    void rasterReproducesLinearFunctions() {
        java.util.Random rnd = new java.util.Random(7);
        for (int trial = 0; trial < 6; trial++) {
            boolean tri = trial % 2 == 0;
            Stub2D m = Stub2D.grid(5 + trial, 4, 2.0, 1.0, 0.25, tri, rnd.nextLong());
            double[] v = new double[m.nodes()];
            for (int k = 0; k < v.length; k++) {
                v[k] = linear(m.xs()[k], m.ys()[k]);
            }
            Raster r = Raster.sample(m.xs(), m.ys(), m.cells(), v, 60);
            assertEquals(60, r.columns());
            assertEquals(30, r.rows());
            int inside = 0;
            for (int i = 0; i < r.columns(); i++) {
                for (int j = 0; j < r.rows(); j++) {
                    double s = r.value()[i][j];
                    assertTrue(!Double.isNaN(s), "pixel " + i + "," + j + " of a full rectangle is outside every cell");
                    assertEquals(linear(r.xCentre(i), r.yCentre(j)), s, 1e-12);
                    inside++;
                }
            }
            assertEquals(60 * 30, inside);
        }
    }

    /** Bilinear elements on rectangles also reproduce x·y exactly (the bilinear term is in the space). */
    @Test
    void bilinearReproducesProductOnRectangles() {
        Stub2D m = Stub2D.grid(4, 3, 1.0, 1.0, 0.0, false, 1);
        double[] v = new double[m.nodes()];
        for (int k = 0; k < v.length; k++) {
            v[k] = m.xs()[k] * m.ys()[k];
        }
        Raster r = Raster.sample(m.xs(), m.ys(), m.cells(), v, 40);
        for (int i = 0; i < r.columns(); i++) {
            for (int j = 0; j < r.rows(); j++) {
                assertEquals(r.xCentre(i) * r.yCentre(j), r.value()[i][j], 1e-12);
            }
        }
    }

    /** An L-shaped body (the upper-right quarter's cells removed) leaves that quarter outside (NaN). */
    @Test
    void pixelsOutsideTheBodyAreEmpty() {
        Stub2D full = Stub2D.grid(4, 4, 1.0, 1.0, 0.0, true, 1);
        List<int[]> keep = new java.util.ArrayList<>();
        for (int[] c : full.cells()) {
            double cx = 0;
            double cy = 0;
            for (int n : c) {
                cx += full.xs()[n] / 3;
                cy += full.ys()[n] / 3;
            }
            if (!(cx > 0.5 && cy > 0.5)) {
                keep.add(c);
            }
        }
        double[] v = new double[full.nodes()];
        Raster r = Raster.sample(full.xs(), full.ys(), keep.toArray(new int[0][]), v, 40);
        for (int i = 0; i < 40; i++) {
            for (int j = 0; j < 40; j++) {
                boolean outside = r.xCentre(i) > 0.5 && r.yCentre(j) > 0.5;
                assertEquals(outside, Double.isNaN(r.value()[i][j]), "pixel " + i + "," + j);
            }
        }
    }

    /**
     * The PNG of a field spanning [min, max] shows both ends of its palette (within 6 levels per channel of the
     * first and last stops); a blank or placeholder picture would not. Sequential (base state) and diverging (mode).
     */
    @Test
    void picturesShowBothEndsOfThePalette() throws Exception {
        Stub2D m = Stub2D.grid(12, 6, 2.0, 1.0, 0.2, true, 3);
        double[] base = new double[m.nodes()];
        double[] mode = new double[m.nodes()];
        for (int k = 0; k < base.length; k++) {
            base[k] = 300 + 40 * Math.exp(-(m.xs()[k] - 1) * (m.xs()[k] - 1) - (m.ys()[k] - 0.5) * (m.ys()[k] - 0.5));
            mode[k] = Math.sin(Math.PI * m.xs()[k]) * Math.sin(Math.PI * m.ys()[k]);
        }
        List<Path> b = FieldMapPlot.write(tmp, "base-T", "Base state T [K]", "x [m]", "y [m]", m.xs(), m.ys(), m.cells(),
                base, false, false);
        List<Path> md = FieldMapPlot.write(tmp, "mode1-T", "Mode 1 of T", "x [m]", "y [m]", m.xs(), m.ys(), m.cells(),
                mode, true, false);
        BufferedImage bi = javax.imageio.ImageIO.read(b.get(0).toFile());
        Pictures.png(b.get(0), bi.getWidth(), bi.getHeight());
        Pictures.svg(b.get(1), bi.getWidth(), bi.getHeight());
        assertTrue(Pictures.count(bi, Palette.SEQUENTIAL[0], 6) > 20, "dark end of viridis missing");
        assertTrue(Pictures.count(bi, Palette.SEQUENTIAL[9], 6) > 20, "bright end of viridis missing");
        BufferedImage mi = javax.imageio.ImageIO.read(md.get(0).toFile());
        Pictures.png(md.get(0), mi.getWidth(), mi.getHeight());
        Pictures.svg(md.get(1), mi.getWidth(), mi.getHeight());
        assertTrue(Pictures.count(mi, Palette.DIVERGING[0], 6) > 20, "negative (blue) end missing");
        assertTrue(Pictures.count(mi, Palette.DIVERGING[8], 6) > 20, "positive (red) end missing");
    }

    @Test
    void tickLabelsSitUnderTheNearestColumn() {
        List<String> l = FieldMapPlot.labels(100, 0, 2);
        assertEquals("0", l.get(0).trim().isEmpty() ? "" : l.get(0));
        assertEquals("1", l.get(50).trim().isEmpty() ? l.get(49) : l.get(50));
        assertEquals(0.5, FieldMapPlot.niceStep(0.4), 0);
        assertEquals(2.0, FieldMapPlot.niceStep(1.3), 0);
    }
}
