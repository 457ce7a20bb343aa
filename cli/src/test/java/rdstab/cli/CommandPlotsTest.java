package rdstab.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.awt.Color;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.knowm.xchart.XYChart;
import rdstab.cli.plot.ConvergePlots;
import rdstab.cli.plot.ConvergencePlot;
import rdstab.cli.plot.Palette;
import rdstab.cli.plot.Pictures;
import rdstab.cli.plot.PlotFiles;
import rdstab.cli.plot.PlotStyle;
import rdstab.cli.plot.SimulatePlots;
import rdstab.cli.plot.TracePlots;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.continuation.BranchRow;
import rdstab.solver.continuation.BranchTracer;
import rdstab.solver.continuation.SpecialPoint;
import rdstab.solver.continuation.TraceListener;
import rdstab.solver.continuation.TraceOptions;
import rdstab.solver.continuation.TraceResult;
import rdstab.solver.drive.StabilityCheck;
import rdstab.solver.model.Case;
import rdstab.solver.timestep.DisturbanceSimulation;
import rdstab.solver.timestep.SimulationResult;
import rdstab.solver.verify.GridStudy;
import rdstab.solver.verify.GridStudyResult;

/**
 * trace, converge and simulate with --plots DIR: the files are there, decode (PNG through ImageIO, SVG as XML), are
 * not blank, and show the data. To read the data back from the pixels, each test rebuilds the same chart from the
 * same (deterministic) computation in-process and paints it, which fixes XChart's data-to-pixel mapping
 * ({@code getScreenXFromChart} and friends); the pixels read are those of the file the command wrote.
 */
class CommandPlotsTest {

    static final ObjectMapper JSON = new ObjectMapper();

    /** u'' + δ e^u = 0, insulated at 0, u(1) = 0: the Frank-Kamenetskii slab (half-width 1). */
    static final String FK_SLAB = "title: FK slab\n"
            + "geometry: {shape: slab, from: 0, to: 1}\n"
            + "mesh: {cells: 40}\n"
            + "parameters: {delta: 0.5}\n"
            + "fields:\n  - name: u\n    diffusivity: 1\n    source: delta*exp(u)\n    initial: 0\n"
            + "boundaries:\n  left:\n    u: insulated\n  right:\n    u: {fixed: 0}\n";

    /** u_t = u_xx on (0, 1), both ends fixed at 0: base state 0, eigenvalues −k²π². */
    static final String LAPLACIAN = String.join("\n", "title: Laplacian", "geometry: {shape: slab, from: 0, to: 1}",
            "mesh: {cells: 40}", "fields:", "  - name: u", "    diffusivity: 1", "    source: 0", "    initial: 0",
            "boundaries:", "  left: {u: {fixed: 0}}", "  right: {u: {fixed: 0}}", "");

    @TempDir
    Path tmp;

    Path write(String name, String text) throws IOException {
        Path p = tmp.resolve(name);
        Files.writeString(p, text);
        return p;
    }

    /** Both files of a picture exist, decode and are not blank; returns the PNG. */
    static BufferedImage decoded(Path dir, String name) throws Exception {
        Pictures.svg(dir.resolve(name + ".svg"), PlotStyle.WIDTH, PlotStyle.HEIGHT);
        return Pictures.png(dir.resolve(name + ".png"), PlotStyle.WIDTH, PlotStyle.HEIGHT);
    }

    /**
     * Branch diagram of the Frank-Kamenetskii slab through its fold. The fold lies at δ_c = 0.87845768 (closed form of
     * the slab problem, from memory; 40 cells: second-order error about 7e-5, tolerance 3e-4). Pixels: the drawn
     * curve's leftmost and rightmost points are the traced parameter range mapped through the plot area (within 3
     * pixels: the 2.5-pixel line width and its round caps), the fold marker sits at the curve's right end (a fold is
     * where the branch turns back in δ), and in the growth-rate picture the fold marker sits on Re λ = 0.
     */
    @Test
    void traceDrawsTheBranchThroughTheFold() throws Exception {
        Path caseFile = write("fk.yaml", FK_SLAB);
        Path dir = tmp.resolve("pics");
        CliRun r = CliRun.of("trace", caseFile.toString(), "--along", "delta=0.5:1.0", "--plots", dir.toString());
        assertEquals(0, r.code(), r.err());
        assertTrue(r.out().contains("4 pictures written to " + dir), r.out());
        BufferedImage branch = decoded(dir, "branch");
        BufferedImage growth = decoded(dir, "branch-growth");

        Case c = CaseReader.read(caseFile);
        TraceResult t = BranchTracer.trace(c, TraceOptions.of("delta", 0.5, 1.0, 200, Double.NaN), TraceListener.NONE);
        assertEquals(1, t.specialPoints().size());
        SpecialPoint fold = t.specialPoints().get(0);
        assertEquals("fold", fold.kind().word());
        assertEquals(0.87845768, fold.parameter(), 3e-4);
        double pMin = Double.POSITIVE_INFINITY;
        double pMax = Double.NEGATIVE_INFINITY;
        for (BranchRow row : t.rows()) {
            pMin = Math.min(pMin, row.parameter());
            pMax = Math.max(pMax, row.parameter());
        }
        XYChart chart = TracePlots.branch(t, TracePlots.Measure.parse("max", c));
        PlotFiles.png(chart); // paint once: fixes the mapping
        assertTrue(chart.getSeriesMap().values().stream().anyMatch(k -> k.getLabel().equals("stable (solid)")));
        assertTrue(chart.getSeriesMap().values().stream().anyMatch(s -> s.getLabel().contains("unstable (dashed)")));
        int bottom = (int) chart.getScreenYFromChart(chart.getStyler().getYAxisMin()) - 3;
        int[] ext = xExtent(branch, Palette.line(0), bottom);
        assertEquals(chart.getScreenXFromChart(pMin), ext[0], 3, "left end of the drawn branch");
        assertEquals(chart.getScreenXFromChart(pMax), ext[1], 3, "right end of the drawn branch");
        double foldX = chart.getScreenXFromChart(fold.parameter());
        double foldY = chart.getScreenYFromChart(fold.max().get("u"));
        assertEquals(ext[1], foldX, 3, "the fold is the branch's turning point in delta");
        assertTrue(blackAround(branch, foldX, foldY) > 30, "fold marker missing at its place");

        XYChart g = TracePlots.growth(t);
        PlotFiles.png(g);
        double zeroY = g.getScreenYFromChart(0);
        assertTrue(blackAround(growth, g.getScreenXFromChart(fold.parameter()), zeroY) > 30,
                "fold marker not on Re λ = 0 in the growth picture");

        CliRun norm = CliRun.of("trace", caseFile.toString(), "--along", "delta=0.5:1.0", "--plots", dir.toString(),
                "--measure", "norm", "--force");
        assertEquals(0, norm.code(), norm.err());
        assertTrue(TracePlots.branch(t, TracePlots.Measure.parse("norm", c)).getYAxisTitle().contains("M-norm"));
        CliRun bad = CliRun.of("trace", caseFile.toString(), "--along", "delta=0.5:1.0", "--measure", "max:T");
        assertEquals(2, bad.code());
        assertTrue(bad.err().contains("--measure expects norm, max or max:FIELD with FIELD one of u"), bad.err());
        CliRun again = CliRun.of("trace", caseFile.toString(), "--along", "delta=0.5:1.0", "--plots", dir.toString());
        assertEquals(4, again.code(), "existing pictures without --force: " + again.err());
    }

    /**
     * Convergence of the Laplacian's first eigenvalue (−π², separation of variables) on 10, 20, 40 and 80 cells: the
     * slope read from the drawn markers of the coarsest and finest levels (0.9 decades apart in h) is the observed
     * order of the study within 0.05 (about 3 pixels of the 450-pixel plot height over the 2-decade error range),
     * and both are 2 within 0.05 (second-order finite volumes; common practice, no source). The base maximum is 0 on
     * every grid, so it is left out with a note.
     */
    @Test
    void convergeDrawsTheErrorWithTheObservedSlope() throws Exception {
        Path caseFile = write("lap.yaml", LAPLACIAN);
        Path dir = tmp.resolve("pics");
        CliRun r = CliRun.of("converge", caseFile.toString(), "--cells", "10", "--levels", "4", "--plots", dir.toString());
        assertEquals(0, r.code(), r.err());
        assertTrue(r.out().contains("max u does not change with the grid above round-off: not drawn"), r.out());
        assertTrue(r.out().contains("Convergence plot written to " + dir), r.out());
        BufferedImage img = decoded(dir, "convergence");
        CliRun j = CliRun.of("converge", caseFile.toString(), "--cells", "10", "--levels", "4", "--json");
        double order = JSON.readTree(j.out()).get("grid").get("observed_order").asDouble();

        Case c = CaseReader.read(caseFile).withMesh(CaseReader.read(caseFile).mesh().withCells(10));
        int[] cells = GridStudy.refined(10, 4, 2);
        GridStudyResult study = GridStudy.run(c, cells, cells.length - 1, null);
        List<String> omitted = new ArrayList<>();
        List<ConvergencePlot.Series> s = ConvergePlots.series(study, omitted);
        assertEquals(1, s.size());
        assertEquals(1, omitted.size());
        assertTrue(s.get(0).orderText().startsWith("observed order "), s.get(0).orderText());
        assertEquals(order, Double.parseDouble(s.get(0).orderText().substring(15)), 5e-4, "legend gives the study's order");
        for (GridStudyResult.Level l : study.levels()) {
            assertTrue(l.check().modes().get(0).residual() < 1e-8, "eigenpair residual on " + l.cells() + " cells");
        }
        XYChart chart = ConvergePlots.chart(s);
        PlotFiles.png(chart);
        double xCoarse = chart.getScreenXFromChart(Math.log10(1.0 / 10));
        double xFine = chart.getScreenXFromChart(Math.log10(1.0 / 80));
        double yCoarse = chart.getChartYFromCoordinate((int) Math.round(meanY(img, Palette.line(0), xCoarse)));
        double yFine = chart.getChartYFromCoordinate((int) Math.round(meanY(img, Palette.line(0), xFine)));
        double drawnSlope = (yCoarse - yFine) / (Math.log10(1.0 / 10) - Math.log10(1.0 / 80));
        assertEquals(order, drawnSlope, 0.05, "slope of the drawn points");
        assertEquals(2.0, drawnSlope, 0.05);
        assertEquals(2.0, order, 0.05);
    }

    /**
     * Heat equation disturbed by its first mode: ‖u − ū‖ decays at −π² (separation of variables; 40 cells:
     * discretisation error 0.05 %). The decay rate read from the drawn line between t = 0.05 and t = 0.5 (about 2
     * decades, over 200 pixels on the log axis) is −π² within 3 % (±2 pixels at each end).
     */
    @Test
    void simulateDrawsTheDecayOnALogAxis() throws Exception {
        Path caseFile = write("lap.yaml", LAPLACIAN);
        Path dir = tmp.resolve("pics");
        CliRun r = CliRun.of("simulate", caseFile.toString(), "--amplitudes", "0.5,-0.1", "--plots", dir.toString());
        assertEquals(0, r.code(), r.err());
        assertTrue(r.out().contains("Time-history plot written to " + dir), r.out());
        BufferedImage img = decoded(dir, "time-history");

        SimulationResult s = DisturbanceSimulation.run(StabilityCheck.run(CaseReader.read(caseFile)),
                new DisturbanceSimulation.Options(1, List.of(0.5, -0.1), Double.NaN, Double.NaN,
                        DisturbanceSimulation.DEFAULT_RTOL), null);
        assertTrue(s.check().modes().get(0).residual() < 1e-8, "eigenpair residual");
        XYChart chart = SimulatePlots.chart(s);
        PlotFiles.png(chart);
        assertEquals(4, chart.getSeriesMap().size(), "two runs, each with its prediction");
        double t1 = 0.05;
        double t2 = 0.5;
        double a1 = chart.getChartYFromCoordinate((int) Math.round(meanY(img, Palette.line(0), chart.getScreenXFromChart(t1))));
        double a2 = chart.getChartYFromCoordinate((int) Math.round(meanY(img, Palette.line(0), chart.getScreenXFromChart(t2))));
        double rate = Math.log(a2 / a1) / (t2 - t1);
        assertEquals(-Math.PI * Math.PI, rate, 0.03 * Math.PI * Math.PI, "decay rate read from the picture");
    }

    /** Leftmost and rightmost column holding the exact colour, above row {@code bottom} (the legend lies below). */
    static int[] xExtent(BufferedImage img, Color c, int bottom) {
        int left = Integer.MAX_VALUE;
        int right = -1;
        for (int y = 0; y < bottom; y++) {
            for (int x = 0; x < img.getWidth(); x++) {
                if ((img.getRGB(x, y) & 0xffffff) == (c.getRGB() & 0xffffff)) {
                    left = Math.min(left, x);
                    right = Math.max(right, x);
                }
            }
        }
        assertTrue(right >= 0, "no pixel of colour " + c);
        return new int[] {left, right};
    }

    /** Mean row of the exact-colour pixels in column x (rounded), above the legend. */
    static double meanY(BufferedImage img, Color c, double x) {
        int col = (int) Math.round(x);
        double sum = 0;
        int n = 0;
        for (int y = 0; y < img.getHeight() * 3 / 4; y++) {
            if ((img.getRGB(col, y) & 0xffffff) == (c.getRGB() & 0xffffff)) {
                sum += y;
                n++;
            }
        }
        assertTrue(n > 0, "nothing of colour " + c + " drawn in column " + col);
        return sum / n;
    }

    /** Black pixels in the 11 × 11 box around (x, y). */
    static int blackAround(BufferedImage img, double x, double y) {
        int k = 0;
        for (int j = (int) y - 5; j <= (int) y + 5; j++) {
            for (int i = (int) x - 5; i <= (int) x + 5; i++) {
                k += (img.getRGB(i, j) & 0xffffff) == 0 ? 1 : 0;
            }
        }
        return k;
    }
}
