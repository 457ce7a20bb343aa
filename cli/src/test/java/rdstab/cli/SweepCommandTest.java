package rdstab.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The sweep, merge and critical commands in-process: errors, determinism, resume, merge checks. */
class SweepCommandTest {

    @TempDir
    Path tmp;

    /** Frank-Kamenetskii slab with a convective surface (u'' + delta e^u = 0, -u'(1) = Bi u(1)). */
    static final String SLAB = String.join("\n",
            "title: FK slab, convective surface",
            "geometry: {shape: slab, from: 0, to: 1}",
            "mesh: {cells: 60}",
            "parameters: {delta: 0.5, Bi: 8}",
            "fields:",
            "  - name: u",
            "    diffusivity: 1",
            "    source: delta*exp(u)",
            "    initial: 0",
            "boundaries:",
            "  left: {u: insulated}",
            "  right: {u: {convective: {h: Bi, ambient: 0}}}",
            "");

    Path slab() throws IOException {
        Path p = tmp.resolve("slab.yaml");
        Files.writeString(p, SLAB);
        return p;
    }

    CliRun sweep(String out, String... more) throws IOException {
        return sweepOf("delta=0.3:1.0:15", out, more);
    }

    CliRun sweepOf(String delta, String out, String... more) throws IOException {
        String[] base = {"sweep", slab().toString(), "--vary", delta, "--vary", "Bi=2:20:2", "--chain-length", "4",
            "--shard", "0/1", "--quiet", "--out", tmp.resolve(out).toString()};
        String[] all = new String[base.length + more.length];
        System.arraycopy(base, 0, all, 0, base.length);
        System.arraycopy(more, 0, all, base.length, more.length);
        return CliRun.of(all);
    }

    @Test
    void badSpecificationsGiveOneLineAndExitTwo() throws IOException {
        String c = slab().toString();
        String[][] bad = {
            {"--vary", "gamma=0:1:3"}, {"--vary", "delta=0.5:0.5:4"}, {"--vary", "delta=0:1:0"}, {"--vary", "Bi=0:10:5:log"},
            {"--vary", "Bi=-2:10:5:log"}, {"--vary", "delta=0:1:3", "--shard", "4/4"}, {"--vary", "delta=0:1:3", "--shard", "-1/2"},
            {"--vary", "delta=0:1:3", "--shard", "a/b"}, {"--vary", "delta=0:1"}, {"--vary", "delta=0:1:3", "--threads", "0"}};
        for (String[] b : bad) {
            String[] args = new String[b.length + 4];
            args[0] = "sweep";
            args[1] = c;
            System.arraycopy(b, 0, args, 2, b.length);
            args[b.length + 2] = "--out";
            args[b.length + 3] = tmp.resolve("never.csv").toString();
            CliRun r = CliRun.of(args);
            assertEquals(2, r.code(), String.join(" ", b) + ": " + r.err());
            assertEquals(1, r.err().strip().lines().count(), "one line: " + r.err());
            assertFalse(r.err().contains("\tat "), "no stack trace");
            assertFalse(Files.exists(tmp.resolve("never.csv")), "nothing written");
        }
    }

    @Test
    void threadCountDoesNotChangeOneBit() throws IOException {
        assertEquals(0, sweep("one.csv", "--threads", "1").code());
        CliRun two = sweep("two.csv", "--threads", "2");
        assertEquals(0, two.code(), two.err());
        assertEquals(Files.readString(tmp.resolve("one.csv")), Files.readString(tmp.resolve("two.csv")));
        assertEquals(Files.readString(tmp.resolve("one.jsonl")), Files.readString(tmp.resolve("two.jsonl")));
        List<String> rows = Files.readAllLines(tmp.resolve("one.csv"));
        assertEquals(2 + 30, rows.size(), "header, columns, 30 points");
        assertTrue(rows.get(2).startsWith("0,0.3,2.0,ok,stable,"), rows.get(2));
        assertTrue(String.join("\n", rows).contains("no steady state"), "beyond the fold: failed points are rows");
        JsonNode row = new ObjectMapper().readTree(Files.readAllLines(tmp.resolve("one.jsonl")).get(1));
        for (String k : new String[] {"point", "status", "verdict", "growth_rate", "leading", "base", "energy", "unknowns",
            "parameters", "cautions"}) {
            assertTrue(row.has(k), "contract key " + k);
        }
        assertTrue(row.get("leading").get(0).get("residual").asDouble() < 1e-8, "eigenpair residual");
        assertTrue(two.out().contains("licensed engineer"), "cautions printed");
    }

    @Test
    void existingOutputIsRefusedWithoutResumeOrForce() throws IOException {
        assertEquals(0, sweepOf("delta=0.3:0.5:3", "a.csv").code());
        CliRun again = sweepOf("delta=0.3:0.5:3", "a.csv");
        assertEquals(4, again.code());
        assertTrue(again.err().contains("--resume") && again.err().contains("--force"), again.err());
        assertEquals(0, sweepOf("delta=0.3:0.5:3", "a.csv", "--force").code());
        CliRun other = CliRun.of("sweep", slab().toString(), "--vary", "delta=0.3:0.9:15", "--quiet", "--shard", "0/1", "--out",
                tmp.resolve("a.csv").toString(), "--resume");
        assertEquals(2, other.code(), "resuming another sweep is refused: " + other.err());
    }

    @Test
    void resumeCutsATornLineAndFinishesIdentically() throws IOException {
        assertEquals(0, sweep("full.csv").code());
        String csv = Files.readString(tmp.resolve("full.csv"));
        String jsonl = Files.readString(tmp.resolve("full.jsonl"));
        // simulate a kill: keep 11 CSV rows and 9 JSON rows, each followed by half of the next line
        Files.writeString(tmp.resolve("cut.csv"), torn(csv, 2 + 11));
        Files.writeString(tmp.resolve("cut.jsonl"), torn(jsonl, 1 + 9));
        CliRun r = sweep("cut.csv", "--resume");
        assertEquals(0, r.code(), r.err());
        assertTrue(r.out().contains("9 kept from the earlier run"), r.out());
        assertEquals(csv, Files.readString(tmp.resolve("cut.csv")));
        assertEquals(jsonl, Files.readString(tmp.resolve("cut.jsonl")));
    }

    /** The first n lines of text and half of line n + 1. */
    static String torn(String text, int n) {
        int pos = 0;
        for (int i = 0; i < n; i++) {
            pos = text.indexOf('\n', pos) + 1;
        }
        int end = text.indexOf('\n', pos);
        return text.substring(0, pos + (end - pos) / 2);
    }

    @Test
    void mergeJoinsShardsAndReportsMissingAndDuplicatePoints() throws IOException {
        assertEquals(0, sweep("whole.csv").code());
        String[] base = {"sweep", slab().toString(), "--vary", "delta=0.3:1.0:15", "--vary", "Bi=2:20:2", "--chain-length", "4",
            "--quiet", "--out", tmp.resolve("part.csv").toString(), "--shard"};
        for (int s = 0; s < 3; s++) {
            String[] args = java.util.Arrays.copyOf(base, base.length + 1);
            args[base.length] = s + "/3";
            assertEquals(0, CliRun.of(args).code());
        }
        String p0 = tmp.resolve("part.shard0of3.csv").toString();
        String p1 = tmp.resolve("part.shard1of3.csv").toString();
        String p2 = tmp.resolve("part.shard2of3.csv").toString();
        CliRun missing = CliRun.of("merge", p0, p2, "--out", tmp.resolve("m.csv").toString());
        assertEquals(2, missing.code());
        // chains of 4 along delta (15 values: chains 0-3, 4-7, 8-11, 12-14 per Bi line); shard 1 of 3 owns chains 1, 4, 7
        assertTrue(missing.err().contains("points missing: 4-7, 15-18, 27-29"), missing.err());
        assertFalse(Files.exists(tmp.resolve("m.csv")));
        CliRun dup = CliRun.of("merge", p0, p1, p2, p1, "--out", tmp.resolve("m.csv").toString());
        assertEquals(2, dup.code());
        assertTrue(dup.err().contains("present more than once: 4-7, 15-18, 27-29"), dup.err());
        CliRun ok = CliRun.of("merge", p2, p0, p1, "--out", tmp.resolve("m.csv").toString());
        assertEquals(0, ok.code(), ok.err());
        assertArrayEquals(Files.readAllBytes(tmp.resolve("whole.csv")), Files.readAllBytes(tmp.resolve("m.csv")));
        assertArrayEquals(Files.readAllBytes(tmp.resolve("whole.jsonl")), Files.readAllBytes(tmp.resolve("m.jsonl")));
        CliRun other = CliRun.of("merge", p0, tmp.resolve("whole.csv").toString(), "--out", tmp.resolve("x.csv").toString());
        assertEquals(2, other.code(), "same points twice: " + other.err());
    }

    @Test
    void neutralCurveOfABiotDeltaSweep() throws IOException {
        CliRun r = CliRun.of("sweep", slab().toString(), "--vary", "Bi=1:100:3:log", "--vary", "delta=0.1:0.95:18", "--quiet",
                "--shard", "0/1", "--out", tmp.resolve("bd.csv").toString(), "--neutral-curve", tmp.resolve("nc.csv").toString());
        assertEquals(0, r.code(), r.err());
        List<String> nc = Files.readAllLines(tmp.resolve("nc.csv"));
        assertEquals("Bi,delta_critical,kind,delta_low,delta_high", nc.get(0));
        assertEquals(4, nc.size());
        // slab, convective surface, closed form (Frank-Kamenetskii family; see CriticalFinderTest in solver):
        // delta_c(Bi=1) = 0.27067, delta_c(Bi=10) = 0.72898, delta_c(Bi=100) = 0.86119 (computed by us from the
        // closed form; the curve's fold values are midpoints, error at most half the spacing 0.025)
        double[] exact = {0.27067, 0.72898, 0.86119};
        for (int i = 0; i < 3; i++) {
            String[] f = nc.get(i + 1).split(",");
            assertEquals("fold", f[2]);
            assertEquals(exact[i], Double.parseDouble(f[1]), 0.025 + 1e-3, nc.get(i + 1));
        }
        assertTrue(r.out().contains("Neutral curve"), r.out());
    }

    @Test
    void criticalJsonCarriesTheContractAndTheCriticalMember() throws IOException {
        Path cyl = tmp.resolve("cyl.yaml");
        Files.writeString(cyl, String.join("\n", "title: FK cylinder", "geometry: {shape: cylinder, from: 0, to: 1}",
                "mesh: {cells: 80}", "parameters: {delta: 1}", "fields:", "  - name: u", "    diffusivity: 1",
                "    source: delta*exp(u)", "    initial: 0", "boundaries:", "  outer: {u: {fixed: 0}}", ""));
        CliRun r = CliRun.of("critical", cyl.toString(), "--vary", "delta=0.5:3", "--json", "--tolerance", "1e-6");
        assertEquals(0, r.code(), r.err());
        JsonNode j = new ObjectMapper().readTree(r.out());
        for (String k : new String[] {"verdict", "growth_rate", "leading", "base", "energy", "unknowns", "parameters", "cautions"}) {
            assertTrue(j.has(k), "missing " + k);
        }
        JsonNode c = j.get("critical");
        assertEquals("delta", c.get("parameter").asText());
        assertEquals("fold", c.get("kind").asText());
        assertTrue(c.get("tolerance").asDouble() <= 1e-6);
        // cylinder fold at delta = 2 exactly (Frank-Kamenetskii; Chambré); 80 cells: grid error ~1e-4 (second order,
        // 7.8e-5 at 50 cells in CriticalFinderTest)
        assertEquals(2.0, c.get("value").asDouble(), 2e-4);
        assertTrue(j.get("leading").get(0).get("residual").asDouble() < 1e-8, "eigenpair residual");
        CliRun text = CliRun.of("critical", cyl.toString(), "--vary", "delta=0.5:3");
        assertTrue(text.out().contains("CRITICAL VALUE: delta = 1.99") && text.out().contains("fold"), text.out());
        assertTrue(text.out().contains("licensed engineer") && text.out().contains("grid error"), text.out());
    }

}
