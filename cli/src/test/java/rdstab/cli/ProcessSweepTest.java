package rdstab.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import rdstab.cli.output.SweepFiles;

/**
 * Sweeps in separate JVMs: shards as four processes merged equal the single-process sweep byte for
 * byte; a sweep killed with SIGKILL at random (seeded) instants and resumed ends with the same file
 * as an uninterrupted run, and no kill ever loses a finished row or leaves more than a torn last line.
 */
class ProcessSweepTest {

    @TempDir
    Path tmp;

    Path slab(int cells) throws IOException {
        Path p = tmp.resolve("slab.yaml");
        Files.writeString(p, SweepCommandTest.SLAB.replace("cells: 60", "cells: " + cells));
        return p;
    }

    /** Starts rdstab.cli.Main in a new JVM on the test class path, without Slurm variables. */
    Process launch(String tag, List<String> args) throws IOException {
        List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-Xss8m", "-XX:+UseSerialGC", "-cp", System.getProperty("java.class.path"), "rdstab.cli.Main"));
        cmd.addAll(args);
        ProcessBuilder pb = new ProcessBuilder(cmd).directory(tmp.toFile())
                .redirectOutput(tmp.resolve(tag + ".out").toFile()).redirectError(tmp.resolve(tag + ".err").toFile());
        pb.environment().keySet().removeIf(k -> k.startsWith("SLURM_"));
        return pb.start();
    }

    int finish(Process p, String tag) throws Exception {
        assertTrue(p.waitFor(120, TimeUnit.SECONDS), tag + " did not finish");
        return p.exitValue();
    }

    List<String> sweepArgs(Path c, String out, String... more) {
        List<String> a = new ArrayList<>(List.of("sweep", c.toString(), "--vary", "delta=0.3:1.0:12", "--vary", "Bi=2:20:3",
                "--chain-length", "4", "--quiet", "--out", out));
        a.addAll(List.of(more));
        return a;
    }

    /** Complete data lines of a CSV sweep file (0 when it does not exist yet). */
    static long dataLines(Path csv) throws IOException {
        if (!Files.exists(csv)) {
            return 0;
        }
        byte[] b = Files.readAllBytes(csv);
        long n = 0;
        for (byte x : b) {
            n += x == '\n' ? 1 : 0;
        }
        return Math.max(0, n - 2);
    }

    @Test
    void fourShardProcessesMergedEqualOneProcess() throws Exception {
        Path c = slab(60);
        List<Process> shards = new ArrayList<>();
        for (int s = 0; s < 4; s++) {
            shards.add(launch("shard" + s, sweepArgs(c, "part.csv", "--shard", s + "/4", "--threads", "1")));
        }
        Process single = launch("single", sweepArgs(c, "whole.csv", "--threads", "2"));
        for (int s = 0; s < 4; s++) {
            assertEquals(0, finish(shards.get(s), "shard " + s), Files.readString(tmp.resolve("shard" + s + ".err")));
        }
        assertEquals(0, finish(single, "single"), Files.readString(tmp.resolve("single.err")));
        Process merge = launch("merge", List.of("merge", "part.shard3of4.csv", "part.shard1of4.csv", "part.shard0of4.csv",
                "part.shard2of4.csv", "--out", "merged.csv"));
        assertEquals(0, finish(merge, "merge"), Files.readString(tmp.resolve("merge.err")));
        assertArrayEquals(Files.readAllBytes(tmp.resolve("whole.csv")), Files.readAllBytes(tmp.resolve("merged.csv")),
                "CSV row for row, bit for bit");
        assertArrayEquals(Files.readAllBytes(tmp.resolve("whole.jsonl")), Files.readAllBytes(tmp.resolve("merged.jsonl")));
        assertEquals(2 + 36, Files.readAllLines(tmp.resolve("merged.csv")).size());
    }

    @Test
    void killedAtRandomInstantsAndResumedEndsWithTheUninterruptedFile() throws Exception {
        Path c = slab(400);
        Process ref = launch("ref", sweepArgs(c, "ref.csv", "--threads", "2"));
        assertEquals(0, finish(ref, "reference"), Files.readString(tmp.resolve("ref.err")));
        Random rnd = new Random(7);
        int rowsBefore = 0;
        int kills = Integer.getInteger("rdstab.kills", 5);
        int midRun = 0;
        StringBuilder log = new StringBuilder();
        for (int k = 0; k < kills; k++) {
            Process p = launch("run" + k, sweepArgs(c, "run.csv", "--threads", "2", "--resume"));
            // a random instant while points are being written: once the CSV holds a random number of rows
            // beyond those already there, plus a random 0-150 ms (seeded, so the test is repeatable)
            // (within the first third of the remaining rows: with two threads rows arrive in bursts)
            int target = rowsBefore + 1 + rnd.nextInt(Math.max(1, (36 - rowsBefore) / 3));
            long extra = rnd.nextInt(150);
            long delay = System.nanoTime();
            while (p.isAlive() && dataLines(tmp.resolve("run.csv")) < target) {
                Thread.sleep(5);
            }
            Thread.sleep(extra);
            delay = (System.nanoTime() - delay) / 1_000_000;
            if (!p.isAlive()) {
                break; // finished before the kill: nothing left to interrupt
            }
            p.destroyForcibly(); // SIGKILL on Linux
            p.waitFor();
            if (!Files.exists(tmp.resolve("run.csv")) || !Files.exists(tmp.resolve("run.jsonl"))) {
                continue;
            }
            int cols = SweepFiles.columns(List.of("delta", "Bi"), List.of("u")).size();
            SweepFiles.Contents csv = SweepFiles.read(tmp.resolve("run.csv"), true, cols);
            SweepFiles.Contents json = SweepFiles.read(tmp.resolve("run.jsonl"), false, 0);
            int rows = Math.min(csv.lines().size(), json.lines().size());
            assertTrue(rows >= rowsBefore, "kill " + k + ": finished rows went from " + rowsBefore + " to " + rows);
            rowsBefore = rows;
            midRun += rows > 0 && rows < 36 ? 1 : 0;
            log.append(" kill ").append(k).append(" at ").append(delay).append(" ms: ").append(rows).append(" rows")
                    .append(csv.torn() || json.torn() ? " + torn line;" : ";");
            String whole = Files.readString(tmp.resolve("ref.csv"));
            String part = Files.readString(tmp.resolve("run.csv"));
            int lastComplete = part.lastIndexOf('\n') + 1;
            assertTrue(whole.startsWith(part.substring(0, lastComplete)), "kill " + k + ": complete rows equal the reference");
        }
        assertTrue(midRun >= 1, "at least one kill must land mid-run:" + log);
        Process last = launch("final", sweepArgs(c, "run.csv", "--threads", "2", "--resume"));
        assertEquals(0, finish(last, "final"), Files.readString(tmp.resolve("final.err")));
        assertArrayEquals(Files.readAllBytes(tmp.resolve("ref.csv")), Files.readAllBytes(tmp.resolve("run.csv")));
        assertArrayEquals(Files.readAllBytes(tmp.resolve("ref.jsonl")), Files.readAllBytes(tmp.resolve("run.jsonl")));
        assertTrue(!Files.exists(tmp.resolve("run.pending")), "journal removed at the end");
    }
}
