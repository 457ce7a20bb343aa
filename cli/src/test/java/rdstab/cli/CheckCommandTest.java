package rdstab.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The check command: contract JSON, text report, files, exit codes and one-line errors. */
class CheckCommandTest {

    @TempDir
    Path tmp;

    static final String FK = String.join("\n",
            "title: FK slab",
            "geometry: {shape: slab, from: 0, to: 1}",
            "mesh: {cells: 100}",
            "parameters: {delta: 0.5}",
            "fields:",
            "  - name: u",
            "    diffusivity: 1",
            "    source: delta*exp(u)",
            "    initial: 0",
            "boundaries:",
            "  left: {u: insulated}",
            "  right: {u: {fixed: 0}}",
            "");

    Path write(String name, String text) throws IOException {
        Path p = tmp.resolve(name);
        Files.writeString(p, text);
        return p;
    }

    @Test
    void jsonHasTheContractKeys() throws IOException {
        CliRun r = CliRun.of("check", write("fk.yaml", FK).toString(), "--json");
        assertEquals(0, r.code(), r.err());
        JsonNode j = new ObjectMapper().readTree(r.out());
        for (String k : new String[] {"verdict", "growth_rate", "leading", "base", "energy", "unknowns", "parameters", "cautions"}) {
            assertTrue(j.has(k), "missing " + k);
        }
        assertEquals("stable", j.get("verdict").asText());
        // FK slab at delta = 0.5, lower branch: rightmost sigma -1.8020144 (closed form); 100 cells: O(h^2) error ~1e-4
        assertEquals(-1.8020144, j.get("growth_rate").asDouble(), 1e-3);
        assertTrue(j.get("base").has("newton_iterations") && j.get("base").get("max").has("u"));
        assertTrue(j.get("energy").has("bound") && j.get("energy").has("numerical_abscissa"));
        assertEquals(0.5, j.get("parameters").get("delta").asDouble());
    }

    @Test
    void textReportLeadsWithTheVerdictAndEndsWithCautions() throws IOException {
        CliRun r = CliRun.of("check", write("fk.yaml", FK).toString());
        assertEquals(0, r.code(), r.err());
        assertTrue(r.out().contains("VERDICT: STABLE"), r.out());
        assertTrue(r.out().contains("Cautions") && r.out().contains("licensed engineer"), r.out());
    }

    @Test
    void setOverridesAParameterAndNoSteadyStateExitsThree() throws IOException {
        CliRun r = CliRun.of("check", write("fk.yaml", FK).toString(), "--set", "delta=0.95");
        assertEquals(3, r.code());
        assertTrue(r.err().startsWith("rdstab: no steady state found"), r.err());
        assertEquals(1, r.err().strip().lines().count(), "one line: " + r.err());
    }

    @Test
    void setOfAnUnknownParameterExitsTwo() throws IOException {
        CliRun r = CliRun.of("check", write("fk.yaml", FK).toString(), "--set", "gamma=2");
        assertEquals(2, r.code());
        assertTrue(r.err().contains("no parameter 'gamma'"), r.err());
        assertFalse(r.err().contains("\tat "), "no stack trace");
    }

    @Test
    void badCaseFileExitsTwoWithPlace() throws IOException {
        CliRun r = CliRun.of("check", write("bad.yaml", FK.replace("delta*exp(u)", "delta*exp(u")).toString());
        assertEquals(2, r.code());
        assertTrue(r.err().contains("bad.yaml:8:"), r.err());
        assertEquals(1, r.err().strip().lines().count(), r.err());
    }

    @Test
    void missingFileExitsTwo() {
        CliRun r = CliRun.of("check", tmp.resolve("nope.yaml").toString());
        assertEquals(2, r.code());
        assertTrue(r.err().contains("no such case file"), r.err());
    }

    @Test
    void outWritesCsvAndJsonAndRefusesToOverwrite() throws IOException {
        Path out = tmp.resolve("res");
        Path fk = write("fk.yaml", FK);
        CliRun r = CliRun.of("check", fk.toString(), "--out", out.toString());
        assertEquals(0, r.code(), r.err());
        for (String f : new String[] {"base.csv", "modes.csv", "eigenvalues.csv", "result.json"}) {
            assertTrue(Files.size(out.resolve(f)) > 0, f);
        }
        // 100 cells -> 101 nodes + header
        assertEquals(102, Files.readAllLines(out.resolve("base.csv")).size());
        CliRun again = CliRun.of("check", fk.toString(), "--out", out.toString());
        assertEquals(4, again.code());
        assertTrue(again.err().contains("--force"), again.err());
        assertEquals(0, CliRun.of("check", fk.toString(), "--out", out.toString(), "--force").code());
    }

    @Test
    void plotsReportAndVtkAreWrittenAndNotOverwritten() throws IOException {
        Path fk = write("fk.yaml", FK);
        Path pics = tmp.resolve("pics");
        Path html = tmp.resolve("r.html");
        Path vtk = tmp.resolve("vtk");
        CliRun r = CliRun.of("check", fk.toString(), "--plots", pics.toString(), "--report", html.toString(),
                "--vtk", vtk.toString());
        assertEquals(0, r.code(), r.err());
        for (String f : new String[] {"base-u", "modes-u", "spectrum"}) {
            assertTrue(Files.size(pics.resolve(f + ".png")) > 1000, f + ".png");
            assertTrue(Files.size(pics.resolve(f + ".svg")) > 1000, f + ".svg");
        }
        assertTrue(Files.readString(html).contains("Verdict: STABLE"));
        assertTrue(Files.readString(vtk.resolve("check.vtk")).startsWith("# vtk DataFile Version 3.0"));
        assertTrue(r.out().contains("6 pictures written"), r.out());
        CliRun again = CliRun.of("check", fk.toString(), "--plots", pics.toString());
        assertEquals(4, again.code(), "existing pictures must not be overwritten without --force");
        assertEquals(0, CliRun.of("check", fk.toString(), "--plots", pics.toString(), "--force").code());
    }

    @Test
    void helpTeaches() {
        CliRun r = CliRun.of("check", "--help");
        assertEquals(0, r.code());
        assertTrue(r.out().contains("--set") && r.out().contains("Examples"), r.out());
    }
}
