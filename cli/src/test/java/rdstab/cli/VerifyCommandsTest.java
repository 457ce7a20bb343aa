package rdstab.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** converge, check --verify and simulate through the command line: contract keys, numbers, files, errors. */
class VerifyCommandsTest {

    @TempDir
    Path tmp;

    static final String LAPLACIAN = String.join("\n", "title: Laplacian", "geometry: {shape: slab, from: 0, to: 1}",
            "mesh: {cells: 40}", "fields:", "  - name: u", "    diffusivity: 1", "    source: 0", "    initial: 0",
            "boundaries:", "  left: {u: {fixed: 0}}", "  right: {u: {fixed: 0}}", "");

    Path write(String name, String text) throws IOException {
        Path p = tmp.resolve(name);
        Files.writeString(p, text);
        return p;
    }

    static void assertResiduals(JsonNode levels) {
        for (JsonNode l : levels) {
            for (JsonNode e : l.get("tracked")) {
                assertTrue(e.get("residual").asDouble() < 1e-8, "eigenpair residual " + e);
            }
        }
    }

    @Test
    void convergeOnTheLaplacianReportsOrderTwoAndTheAnalyticLimit() throws IOException {
        Path csv = tmp.resolve("grid.csv");
        CliRun r = CliRun.of("converge", write("lap.yaml", LAPLACIAN).toString(), "--json", "--out", csv.toString());
        assertEquals(0, r.code(), r.err());
        JsonNode j = new ObjectMapper().readTree(r.out());
        JsonNode g = j.get("grid");
        assertResiduals(g.get("levels"));
        assertEquals(3, g.get("levels").size());
        assertEquals(160, g.get("reported_cells").asInt());
        assertEquals(2.0, g.get("observed_order").asDouble(), 0.05);
        // σ1 = −π² on (0, 1) with fixed ends (separation of variables)
        assertEquals(-Math.PI * Math.PI, g.get("extrapolated").asDouble(), 1e-6);
        assertTrue(g.get("resolved").asBoolean());
        assertEquals("stable", j.get("verdict").asText());
        assertTrue(j.get("cautions").size() >= 3);
        assertEquals(4, Files.readAllLines(csv).size(), "header + 3 levels");
    }

    @Test
    void convergeRejectsTooFewLevels() throws IOException {
        CliRun r = CliRun.of("converge", write("lap.yaml", LAPLACIAN).toString(), "--levels", "2");
        assertEquals(2, r.code());
        assertTrue(r.err().contains("--levels"), r.err());
    }

    @Test
    void checkVerifyAddsTheGridBandAndCanTurnAVerdictMarginal() throws IOException {
        CliRun r = CliRun.of("check", write("lap.yaml", LAPLACIAN).toString(), "--verify", "--json");
        assertEquals(0, r.code(), r.err());
        JsonNode j = new ObjectMapper().readTree(r.out());
        assertEquals("stable", j.get("verdict").asText());
        JsonNode g = j.get("grid");
        assertResiduals(g.get("levels"));
        assertEquals(40, g.get("reported_cells").asInt());
        assertTrue(j.get("band").asDouble() >= g.get("gci").asDouble(), "the check's band includes the grid band");
        // u_t = u_xx + k u with k = 9.866 just below π² = 9.8696: σ1 = k − π² = −0.0036 (separation of variables),
        // stable. On 40 cells the discrete σ1 is about k − π² + π⁴h²/12 = +0.0015 (the five-point truncation error,
        // common practice): the plain check says unstable, wrongly; its grid band (about 6e-3) makes it marginal.
        String near = LAPLACIAN.replace("source: 0", "source: 9.866*u");
        CliRun plain = CliRun.of("check", write("near0.yaml", near).toString(), "--json");
        assertEquals("unstable", new ObjectMapper().readTree(plain.out()).get("verdict").asText());
        CliRun m = CliRun.of("check", write("near.yaml", near).toString(), "--verify", "--json");
        assertEquals(0, m.code(), m.err());
        JsonNode jm = new ObjectMapper().readTree(m.out());
        assertEquals("marginal", jm.get("verdict").asText());
        assertTrue(!jm.get("grid").get("resolved").asBoolean());
        CliRun text = CliRun.of("check", write("near2.yaml", near).toString(), "--verify");
        assertTrue(text.out().contains(" ± ") && text.out().contains("NOT resolved"), text.out());
        assertTrue(text.out().trim().endsWith("a small margin is not a safe one."), "cautions last");
    }

    @Test
    void simulateHeatEquationDecaysAtTheAnalyticRateAndWritesHistories() throws IOException {
        Path csv = tmp.resolve("runs.csv");
        CliRun r = CliRun.of("simulate", write("lap.yaml", LAPLACIAN).toString(), "--amplitudes", "0.5,-0.5", "--json",
                "--out", csv.toString());
        assertEquals(0, r.code(), r.err());
        JsonNode j = new ObjectMapper().readTree(r.out());
        // u_t = u_xx on (0, 1), fixed ends: decay rate −π² (separation of variables); linear, so both signs agree
        for (JsonNode run : j.get("runs")) {
            assertEquals(-Math.PI * Math.PI, run.get("measured_rate").asDouble(), 0.01 * Math.PI * Math.PI);
            assertEquals("back to the base state", run.get("outcome").asText());
        }
        assertTrue(j.get("departure_amplitude").isNull(), "a linear problem never departs");
        assertTrue(j.get("cautions").size() >= 3);
        assertTrue(Files.readAllLines(csv).size() > 80, "time histories written");
        assertTrue(Files.readAllLines(csv).get(0).startsWith("run,amplitude,t,"));
    }

    @Test
    void simulateTextHasMethodOutcomeAndCautions() throws IOException {
        CliRun r = CliRun.of("simulate", write("lap.yaml", LAPLACIAN).toString(), "--amplitude", "0.1", "--time", "1");
        assertEquals(0, r.code(), r.err());
        assertTrue(r.out().contains("ROS2") && r.out().contains("order 2"), r.out());
        assertTrue(r.out().contains("back to the base state"), r.out());
        assertTrue(r.out().contains("Cautions") && r.out().contains("licensed engineer"), r.out());
    }

    @Test
    void simulateRejectsBadModeAndZeroAmplitude() throws IOException {
        Path lap = write("lap.yaml", LAPLACIAN);
        CliRun bad = CliRun.of("simulate", lap.toString(), "--mode", "99");
        assertEquals(2, bad.code());
        assertTrue(bad.err().contains("--mode"), bad.err());
        CliRun zero = CliRun.of("simulate", lap.toString(), "--amplitude", "0");
        assertEquals(2, zero.code());
        assertEquals(1, zero.err().strip().lines().count(), zero.err());
    }
}
