package rdstab.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** rdstab trace through the command line: summary, files, restart, errors. */
class TraceCommandTest {

    static final ObjectMapper JSON = new ObjectMapper();

    @TempDir
    Path dir;

    Path fkSlab() throws IOException {
        Path f = dir.resolve("fk.yaml");
        Files.writeString(f, "title: FK slab\n"
                + "geometry: {shape: slab, from: 0, to: 1}\n"
                + "mesh: {cells: 80}\n"
                + "parameters: {delta: 0.5}\n"
                + "fields:\n  - name: u\n    diffusivity: 1\n    source: delta*exp(u)\n    initial: 0\n"
                + "boundaries:\n  left:\n    u: insulated\n  right:\n    u: {fixed: 0}\n");
        return f;
    }

    /**
     * The JSON summary names the fold in plain words near the Frank-Kamenetskii value δ_c = 0.87845768 (closed form;
     * 80 cells: second-order error about 1.6e-5, tolerance 5e-5), keeps the cautions, and the text summary prints them.
     */
    @Test
    void jsonSummaryNamesTheFoldAndKeepsTheCautions() throws IOException {
        Path c = fkSlab();
        CliRun r = CliRun.of("trace", c.toString(), "--along", "delta=0.5:1.0", "--json");
        assertEquals(0, r.code(), r.err());
        JsonNode j = JSON.readTree(r.out());
        assertEquals(1, j.get("special_points").size());
        JsonNode fold = j.get("special_points").get(0);
        assertEquals("fold", fold.get("kind").asText());
        assertEquals(0.87845768, fold.get("value").asDouble(), 5e-5);
        assertTrue(fold.get("eigenvalue").get("residual").asDouble() < 1e-10);
        assertEquals(3, j.get("cautions").size());
        assertEquals("stable", j.get("segments").get(0).get("stability").asText());
        assertEquals("unstable", j.get("segments").get(j.get("segments").size() - 1).get("stability").asText());
        CliRun text = CliRun.of("trace", c.toString(), "--along", "delta=0.5:1.0");
        assertEquals(0, text.code(), text.err());
        assertTrue(text.out().contains("Cautions") && text.out().contains("licensed engineer"), text.out());
        assertTrue(text.out().contains("fold"), text.out());
    }

    /** --out writes CSV and states; --restart FILE --row K repeats the rows after K (common practice, no source). */
    @Test
    void restartFromTheStateFileRepeatsTheRows() throws IOException {
        Path c = fkSlab();
        Path out = dir.resolve("branch.csv");
        CliRun first = CliRun.of("trace", c.toString(), "--along", "delta=0.5:1.0", "--out", out.toString());
        assertEquals(0, first.code(), first.err());
        List<String> rows = Files.readAllLines(out);
        assertTrue(rows.get(0).startsWith("row,step,arclength,delta,m_norm,max_u,growth_rate"), rows.get(0));
        assertTrue(Files.exists(dir.resolve("branch.csv.states")));
        int k = 6;
        Path again = dir.resolve("again.jsonl");
        CliRun second = CliRun.of("trace", c.toString(), "--along", "delta=0.5:1.0", "--restart", out.toString(), "--row", "" + k,
                "--out", again.toString());
        assertEquals(0, second.code(), second.err());
        List<String> more = Files.readAllLines(again);
        assertEquals(rows.size() - 1 - k, more.size(), "rows from K on");
        for (int i = 0; i < more.size(); i++) {
            String[] a = rows.get(1 + k + i).split(",");
            JsonNode b = JSON.readTree(more.get(i));
            assertEquals(Integer.parseInt(a[0]), b.get("row").asInt());
            assertEquals(Double.parseDouble(a[3]), b.get("delta").asDouble(), 1e-9, "delta of row " + a[0]);
            assertEquals(Double.parseDouble(a[5]), b.get("max").get("u").asDouble(), 1e-9, "max u of row " + a[0]);
            assertEquals(a[8], b.get("stability").asText());
            for (JsonNode e : b.get("eigenvalues")) {
                assertTrue(e.get("residual").asDouble() < 1e-10, "eigenpair residual, row " + a[0]);
            }
        }
    }

    @Test
    void badInputIsExitTwoWithOneLine() throws IOException {
        Path c = fkSlab();
        CliRun noName = CliRun.of("trace", c.toString(), "--along", "gamma=0.5:1.0");
        assertEquals(2, noName.code());
        assertTrue(noName.err().contains("gamma"), noName.err());
        CliRun badRange = CliRun.of("trace", c.toString(), "--along", "delta=0.5");
        assertEquals(2, badRange.code());
        CliRun noRow = CliRun.of("trace", c.toString(), "--along", "delta=0.5:1", "--restart", "x.states");
        assertEquals(2, noRow.code());
        assertTrue(noRow.err().lines().count() <= 2, noRow.err());
    }

    @Test
    void noSteadyStateAtTheStartIsExitThree() throws IOException {
        CliRun r = CliRun.of("trace", fkSlab().toString(), "--along", "delta=0.95:1.2");
        assertEquals(3, r.code(), r.err());
        assertTrue(r.err().contains("no steady state"), r.err());
    }
}
