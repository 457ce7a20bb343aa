package rdstab.cli.output;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import rdstab.cli.plot.Stub2D;
import rdstab.mesh.assembly.Discretization;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.drive.CheckResult;
import rdstab.solver.drive.StabilityCheck;

/** Legacy VTK files read back by a small independent parser equal the data in memory. */
class VtkWriterTest {

    @TempDir
    Path tmp;

    /** What a legacy ASCII unstructured-grid file holds. */
    record Vtk(double[][] points, int[][] cells, int[] types, Map<String, double[]> data) {
    }

    /** Parses the subset of the legacy format the writer produces, token by token (format per the VTK file-format guide). */
    static Vtk parse(String text) {
        String[] lines = text.split("\n");
        assertEquals("# vtk DataFile Version 3.0", lines[0]);
        assertEquals("ASCII", lines[2]);
        assertEquals("DATASET UNSTRUCTURED_GRID", lines[3]);
        List<String> tok = new ArrayList<>();
        for (int i = 4; i < lines.length; i++) {
            for (String t : lines[i].trim().split("\\s+")) {
                if (!t.isEmpty()) {
                    tok.add(t);
                }
            }
        }
        int k = 0;
        assertEquals("POINTS", tok.get(k++));
        int n = Integer.parseInt(tok.get(k++));
        assertEquals("double", tok.get(k++));
        double[][] pts = new double[n][3];
        for (int i = 0; i < n; i++) {
            for (int d = 0; d < 3; d++) {
                pts[i][d] = Double.parseDouble(tok.get(k++));
            }
        }
        assertEquals("CELLS", tok.get(k++));
        int nc = Integer.parseInt(tok.get(k++));
        int size = Integer.parseInt(tok.get(k++));
        int[][] cells = new int[nc][];
        int used = 0;
        for (int c = 0; c < nc; c++) {
            int m = Integer.parseInt(tok.get(k++));
            cells[c] = new int[m];
            for (int j = 0; j < m; j++) {
                cells[c][j] = Integer.parseInt(tok.get(k++));
            }
            used += m + 1;
        }
        assertEquals(size, used, "CELLS size entry");
        assertEquals("CELL_TYPES", tok.get(k++));
        assertEquals(nc, Integer.parseInt(tok.get(k++)));
        int[] types = new int[nc];
        for (int c = 0; c < nc; c++) {
            types[c] = Integer.parseInt(tok.get(k++));
        }
        assertEquals("POINT_DATA", tok.get(k++));
        assertEquals(n, Integer.parseInt(tok.get(k++)));
        Map<String, double[]> data = new LinkedHashMap<>();
        while (k < tok.size()) {
            assertEquals("SCALARS", tok.get(k++));
            String name = tok.get(k++);
            assertEquals("double", tok.get(k++));
            assertEquals("1", tok.get(k++));
            assertEquals("LOOKUP_TABLE", tok.get(k++));
            assertEquals("default", tok.get(k++));
            double[] v = new double[n];
            for (int i = 0; i < n; i++) {
                v[i] = Double.parseDouble(tok.get(k++));
            }
            data.put(name, v);
        }
        return new Vtk(pts, cells, types, data);
    }

    static void assertMesh(Discretization d, Vtk v) {
        assertEquals(d.nodes(), v.points().length);
        for (int i = 0; i < d.nodes(); i++) {
            assertEquals(d.coordinate(i, 0), v.points()[i][0], 0.0);
            assertEquals(d.dimension() > 1 ? d.coordinate(i, 1) : 0.0, v.points()[i][1], 0.0);
            assertEquals(0.0, v.points()[i][2], 0.0);
        }
        int[][] cells = d.cells();
        assertEquals(cells.length, v.cells().length);
        for (int c = 0; c < cells.length; c++) {
            assertArrayEquals(cells[c], v.cells()[c]);
            // VTK cell types: 3 line, 5 triangle, 9 quad (VTK file-format guide, from memory)
            int expected = cells[c].length == 2 ? 3 : cells[c].length == 3 ? 5 : 9;
            assertEquals(expected, v.types()[c]);
        }
    }

    /** A 2D mesh of triangles and one of distorted quads with a seeded random field: read back exactly. */
    @Test
    void twoDimensionalMeshesRoundTrip() {
        java.util.Random rnd = new java.util.Random(11);
        for (boolean tri : new boolean[] {true, false}) {
            Stub2D m = Stub2D.grid(5, 3, 2.0, 1.0, 0.2, tri, rnd.nextLong());
            double[] f = new double[m.nodes()];
            for (int i = 0; i < f.length; i++) {
                f[i] = rnd.nextGaussian() * Math.pow(10, rnd.nextInt(20) - 10);
            }
            Map<String, double[]> in = new LinkedHashMap<>();
            in.put("T", f);
            in.put("mode1_T_re", f.clone());
            Vtk v = parse(VtkWriter.text("stub", m, in));
            assertMesh(m, v);
            assertEquals(in.keySet(), v.data().keySet());
            assertArrayEquals(f, v.data().get("T"), 0.0);
        }
    }

    /** A real 1D check (line cells): base state and every mode's _re/_im arrays equal the in-memory data. */
    @Test
    void checkResultRoundTrips() throws Exception {
        Path c = tmp.resolve("fk.yaml");
        Files.writeString(c, String.join("\n", "title: FK slab", "geometry: {shape: slab, from: 0, to: 1}",
                "mesh: {cells: 40}", "parameters: {delta: 0.5}", "fields:", "  - name: u", "    diffusivity: 1",
                "    source: delta*exp(u)", "    initial: 0", "boundaries:", "  left: {u: {fixed: 0}}",
                "  right: {u: {fixed: 0}}", "analysis: {modes: 3}", ""));
        CheckResult r = StabilityCheck.run(CaseReader.read(c));
        Path file = VtkWriter.write(r, tmp, false);
        Vtk v = parse(Files.readString(file));
        Discretization d = r.problem().full();
        assertMesh(d, v);
        assertArrayEquals(r.baseNodal()[0], v.data().get("u"), 0.0);
        Map<String, double[]> expect = VtkWriter.checkArrays(r);
        assertEquals(1 + 2 * r.modes().size(), v.data().size());
        for (Map.Entry<String, double[]> e : expect.entrySet()) {
            assertArrayEquals(e.getValue(), v.data().get(e.getKey()), 0.0, e.getKey());
        }
        // the normalised leading mode has largest amplitude 1 (modes.csv convention) and fixed ends 0
        double[] m1 = v.data().get("mode1_u_re");
        double max = 0;
        for (double x : m1) {
            max = Math.max(max, Math.abs(x));
        }
        assertEquals(1.0, max, 1e-12);
        assertEquals(0.0, m1[0], 0.0);
        assertTrue(r.modes().get(0).residual() < 1e-8, "eigen residual " + r.modes().get(0).residual());
    }
}
