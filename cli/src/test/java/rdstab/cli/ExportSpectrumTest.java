package rdstab.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.data.DMatrixSparseTriplet;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.ejml.ops.DConvertMatrixStruct;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import rdstab.bench.ModelProblems;
import rdstab.cli.output.MatrixMarket;
import rdstab.solver.error.InputException;

/** Matrix Market round trip, 'export' then 'spectrum' against 'check', and against EJML's dense eigen-solver. */
class ExportSpectrumTest {

    private static final ObjectMapper JSON = new ObjectMapper();

    @TempDir
    Path tmp;

    private static DMatrixSparseCSC random(int rows, int cols, int entries, Random rnd, boolean symmetric) {
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(rows, cols, 2 * entries);
        java.util.Set<Long> used = new java.util.HashSet<>();
        for (int e = 0; e < entries; e++) {
            int i = rnd.nextInt(rows);
            int j = rnd.nextInt(cols);
            if (!used.add((long) i * cols + j) || (symmetric && !used.add((long) j * cols + i) && i != j)) {
                continue;
            }
            double v = rnd.nextGaussian() * Math.pow(10, rnd.nextInt(30) - 15); // values across many decades
            t.addItem(i, j, v);
            if (symmetric && i != j) {
                t.addItem(j, i, v);
            }
        }
        return DConvertMatrixStruct.convert(t, (DMatrixSparseCSC) null);
    }

    private static void assertSameMatrix(DMatrixSparseCSC a, DMatrixSparseCSC b) {
        assertEquals(a.numRows, b.numRows);
        assertEquals(a.numCols, b.numCols);
        for (int i = 0; i < a.numRows; i++) {
            for (int j = 0; j < a.numCols; j++) {
                assertEquals(a.get(i, j), b.get(i, j), 0.0, "entry " + i + "," + j); // bit-exact: shortest round-trip text
            }
        }
    }

    @Test
    void matrixMarketWrittenAndReadBackIsEqual() {
        Random rnd = new Random(31);
        for (int trial = 0; trial < 10; trial++) {
            int n = 1 + rnd.nextInt(40);
            boolean symmetric = trial % 2 == 0;
            DMatrixSparseCSC a = random(n, symmetric ? n : 1 + rnd.nextInt(40), rnd.nextInt(3 * n + 1), rnd, symmetric);
            Path f = tmp.resolve("a" + trial + ".mtx");
            MatrixMarket.write(f, a, symmetric, "test matrix", false);
            assertSameMatrix(a, MatrixMarket.read(f));
        }
    }

    @Test
    void malformedMatrixMarketNamesTheLine() throws Exception {
        Path f = tmp.resolve("bad.mtx");
        Files.writeString(f, "%%MatrixMarket matrix coordinate real general\n2 2 2\n1 1 1.0\n3 1 2.0\n");
        InputException e = org.junit.jupiter.api.Assertions.assertThrows(InputException.class, () -> MatrixMarket.read(f));
        assertTrue(e.getMessage().contains("line 4"), e.getMessage());
        CliRun r = CliRun.of("spectrum", f.toString());
        assertEquals(2, r.code());
        assertEquals(1, r.err().strip().lines().count(), r.err());
    }

    private static double[][] leading(JsonNode n) {
        List<double[]> out = new ArrayList<>();
        for (JsonNode e : n.get("leading")) {
            out.add(new double[] {e.get("re").asDouble(), e.get("im").asDouble(), e.get("residual").asDouble()});
        }
        return out.toArray(new double[0][]);
    }

    @Test
    void exportThenSpectrumReproducesCheck() throws Exception {
        String caseFile = Path.of("..", "cases", "slab-self-heating.yaml").toString();
        CliRun check = CliRun.of("check", caseFile, "--json");
        assertEquals(0, check.code(), check.err());
        Path dir = tmp.resolve("ops");
        CliRun export = CliRun.of("export", caseFile, "--out", dir.toString());
        assertEquals(0, export.code(), export.err());
        for (String f : List.of("J.mtx", "M.mtx", "unknowns.csv", "nodes.csv")) {
            assertTrue(Files.size(dir.resolve(f)) > 0, f);
        }
        List<String> layout = Files.readAllLines(dir.resolve("unknowns.csv"));
        assertEquals("unknown,field,node,x", layout.get(0));
        assertEquals(MatrixMarket.read(dir.resolve("J.mtx")).numRows, layout.size() - 1);
        CliRun spectrum = CliRun.of("spectrum", dir.resolve("J.mtx").toString(), dir.resolve("M.mtx").toString(), "--json");
        assertEquals(0, spectrum.code(), spectrum.err());
        double[][] want = leading(JSON.readTree(check.out()));
        double[][] got = leading(JSON.readTree(spectrum.out()));
        assertEquals(want.length, got.length);
        for (int i = 0; i < want.length; i++) {
            assertEquals(want[i][0], got[i][0], 1e-8 * Math.abs(want[i][0]), "eigenvalue " + i);
            assertEquals(want[i][1], got[i][1], 1e-8 * Math.abs(want[i][0]));
            assertTrue(got[i][2] < 1e-10, "residual " + got[i][2]);
        }
    }

    /** All eigenvalues of M⁻¹J (M diagonal here) by EJML's dense solver, the independent oracle. */
    private static Complex_F64[] denseEigenvalues(DMatrixSparseCSC j, DMatrixSparseCSC m) {
        DMatrixRMaj a = DConvertMatrixStruct.convert(j, (DMatrixRMaj) null);
        for (int r = 0; r < a.numRows; r++) {
            double w = m.get(r, r);
            for (int c = 0; c < a.numCols; c++) {
                a.set(r, c, a.get(r, c) / w);
            }
        }
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(a.numRows, false);
        assertTrue(eig.decompose(a));
        Complex_F64[] out = new Complex_F64[a.numRows];
        for (int i = 0; i < out.length; i++) {
            out[i] = eig.getEigenvalue(i);
        }
        Arrays.sort(out, (x, y) -> Double.compare(y.real, x.real));
        return out;
    }

    @Test
    void spectrumOfSmallExportedCaseAgreesWithDenseEjml() throws Exception {
        Path dir = tmp.resolve("small");
        String caseFile = Path.of("..", "cases", "slab-self-heating.yaml").toString();
        assertEquals(0, CliRun.of("export", caseFile, "--cells", "80", "--out", dir.toString()).code());
        DMatrixSparseCSC j = MatrixMarket.read(dir.resolve("J.mtx"));
        DMatrixSparseCSC m = MatrixMarket.read(dir.resolve("M.mtx"));
        Complex_F64[] dense = denseEigenvalues(j, m);
        CliRun r = CliRun.of("spectrum", dir.resolve("J.mtx").toString(), dir.resolve("M.mtx").toString(), "--modes", "5", "--json");
        assertEquals(0, r.code(), r.err());
        double[][] got = leading(JSON.readTree(r.out()));
        for (int i = 0; i < 5; i++) {
            assertEquals(dense[i].real, got[i][0], 1e-8 * Math.abs(dense[i].real), "eigenvalue " + i);
            assertTrue(got[i][2] < 1e-10, "residual " + got[i][2]);
        }
    }

    @Test
    void nonSymmetricTwoFieldGridAgreesWithDenseEjmlAndAnalyticModes() throws Exception {
        // Arnoldi + LU path: two coupled fields on a 12×12 grid (the benchmark operator, small). Every grid mode
        // with Laplacian eigenvalue μ = −(4/h²)(sin²(iπh/2) + sin²(jπh/2)) gives the 2×2 block
        // [[μ − 1, 1], [0.5, 0.2μ − 2]] (separation of variables on the grid), so the rightmost eigenvalue is the larger
        // root for i = j = 1.
        int nn = 12;
        DMatrixSparseCSC j = ModelProblems.twoField(nn);
        Path f = tmp.resolve("two.mtx");
        MatrixMarket.write(f, j, false, null, false);
        CliRun r = CliRun.of("spectrum", f.toString(), "--modes", "4", "--shift", "0", "--json");
        assertEquals(0, r.code(), r.err());
        assertEquals("arnoldi", JSON.readTree(r.out()).get("method").asText());
        double[][] got = leading(JSON.readTree(r.out()));
        DMatrixSparseCSC id = DConvertMatrixStruct.convert(identityTriplet(j.numRows), (DMatrixSparseCSC) null);
        Complex_F64[] dense = denseEigenvalues(j, id);
        double h = 1.0 / (nn + 1);
        double mu = -2 * (4 / (h * h)) * Math.pow(Math.sin(Math.PI * h / 2), 2);
        double tr = mu - 1 + 0.2 * mu - 2;
        double det = (mu - 1) * (0.2 * mu - 2) - 0.5;
        double analytic = tr / 2 + Math.sqrt(tr * tr / 4 - det);
        assertEquals(analytic, got[0][0], 1e-10 * Math.abs(analytic));
        for (int i = 0; i < 4; i++) {
            assertEquals(dense[i].real, got[i][0], 1e-8 * Math.abs(dense[i].real), "eigenvalue " + i);
            assertTrue(got[i][2] < 1e-10, "residual " + got[i][2]);
        }
    }

    private static DMatrixSparseTriplet identityTriplet(int n) {
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, n);
        for (int i = 0; i < n; i++) {
            t.addItem(i, i, 1.0);
        }
        return t;
    }

    @Test
    void modelLaplacianMatchesItsAnalyticEigenvalues() throws Exception {
        // five-point Dirichlet Laplacian on the unit square: λ = c − (4/h²)(sin²(iπh/2) + sin²(jπh/2))
        // (separation of variables on the grid, textbook); Lanczos path with σ = 0 above the spectrum
        int nn = 30;
        Path f = tmp.resolve("lap.mtx");
        MatrixMarket.write(f, ModelProblems.laplace(nn, 10.0), true, null, false);
        CliRun r = CliRun.of("spectrum", f.toString(), "--shift", "0", "--symmetric", "--json", "--modes", "6");
        assertEquals(0, r.code(), r.err());
        double h = 1.0 / (nn + 1);
        List<Double> exact = new ArrayList<>();
        for (int i = 1; i <= 4; i++) {
            for (int k = 1; k <= 4; k++) {
                double si = Math.sin(i * Math.PI * h / 2);
                double sk = Math.sin(k * Math.PI * h / 2);
                exact.add(10.0 - 4 / (h * h) * (si * si + sk * sk));
            }
        }
        exact.sort((a, b) -> Double.compare(b, a));
        double[][] got = leading(JSON.readTree(r.out()));
        double[] want = new double[6];
        double[] have = new double[6];
        for (int i = 0; i < 6; i++) {
            want[i] = exact.get(i);
            have[i] = got[i][0];
            assertTrue(got[i][2] < 1e-10, "residual " + got[i][2]);
        }
        assertArrayEquals(want, have, 1e-9 * Math.abs(want[5]));
    }

    @Test
    void toleranceOptionIsUsedAndChecked() throws Exception {
        // same analytic spectrum as above; a tolerance at the unit round-off still gives it, and a bad one is
        // a usage error (exit 2) naming the option
        int nn = 30;
        Path f = tmp.resolve("lap-tol.mtx");
        MatrixMarket.write(f, ModelProblems.laplace(nn, 10.0), true, null, false);
        CliRun r = CliRun.of("spectrum", f.toString(), "--shift", "0", "--symmetric", "--json", "--modes", "1",
                "--tolerance", "1e-16");
        assertEquals(0, r.code(), r.err());
        double h = 1.0 / (nn + 1);
        double s1 = Math.sin(Math.PI * h / 2);
        double exact = 10.0 - 8 / (h * h) * s1 * s1;
        assertEquals(exact, leading(JSON.readTree(r.out()))[0][0], 1e-11 * Math.abs(exact));
        CliRun bad = CliRun.of("spectrum", f.toString(), "--tolerance", "2");
        assertEquals(2, bad.code());
        assertTrue(bad.err().contains("--tolerance"), bad.err());
    }
}
