package rdstab.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import rdstab.cli.report.ResultJson;

/**
 * Resume after a kill at the instants that matter, without timing: the files a SIGKILL leaves behind
 * at that instant are built from an uninterrupted run, then {@code --resume} runs in-process and must
 * end with the uninterrupted files, byte for byte (the promise of docs/cluster.md; common practice for
 * append-only journals, no source).
 *
 * <p>The instant that lost rows in a loaded full build: a run writes point k, then drains rows that had
 * finished early (held in FILE.pending) one by one, CSV then JSON lines, each fsynced. A kill in that
 * drain leaves the main files cut at some k' whose row is in the journal. The resumed run took the
 * journal rows as finished (not to be computed) but only wrote waiting rows after computing the next
 * point itself, which never came: every later row waited in memory and the run exited 0 with the
 * rows from k' on missing.
 */
class SweepResumeTest {

    @TempDir
    static Path refDir;

    @TempDir
    Path tmp;

    static String csv;
    static String jsonl;
    /** Data lines of the uninterrupted run (without headers), point order. */
    static List<String> csvRows;
    static List<String> jsonRows;

    static CliRun sweep(Path dir, String out, String... more) throws IOException {
        return sweepShard(dir, "0/1", out, more);
    }

    static CliRun sweepShard(Path dir, String shard, String out, String... more) throws IOException {
        Path c = dir.resolve("slab.yaml");
        if (!Files.exists(c)) {
            Files.writeString(c, SweepCommandTest.SLAB.replace("cells: 60", "cells: 30"));
        }
        String[] base = {"sweep", c.toString(), "--vary", "delta=0.3:1.0:15", "--vary", "Bi=2:20:2", "--chain-length", "4",
            "--shard", shard, "--threads", "2", "--quiet", "--out", dir.resolve(out).toString()};
        String[] all = new String[base.length + more.length];
        System.arraycopy(base, 0, all, 0, base.length);
        System.arraycopy(more, 0, all, base.length, more.length);
        return CliRun.of(all);
    }

    @BeforeAll
    static void reference() throws IOException {
        CliRun r = sweep(refDir, "ref.csv");
        assertEquals(0, r.code(), r.err());
        csv = Files.readString(refDir.resolve("ref.csv"));
        jsonl = Files.readString(refDir.resolve("ref.jsonl"));
        csvRows = csv.lines().skip(2).map(s -> s + "\n").toList();
        jsonRows = jsonl.lines().skip(1).map(s -> s + "\n").toList();
        assertEquals(30, csvRows.size());
        assertEquals(30, jsonRows.size());
    }

    /** The first n data rows of a file with its header lines. */
    static String head(String text, int headerLines, int n) {
        int pos = 0;
        for (int i = 0; i < headerLines + n; i++) {
            pos = text.indexOf('\n', pos) + 1;
        }
        return text.substring(0, pos);
    }

    /** One journal line as the sweep writes it: {"point": p, "csv": row, "json": row}. */
    String journalLine(int p) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("point", p);
        m.put("csv", csvRows.get(p));
        m.put("json", jsonRows.get(p));
        return ResultJson.write(m) + "\n";
    }

    /** Writes the files of an interrupted run "run" and resumes it; returns the resumed run. */
    CliRun resume(String csvPart, String jsonPart, String journal) throws IOException {
        Files.writeString(tmp.resolve("run.csv"), csvPart);
        Files.writeString(tmp.resolve("run.jsonl"), jsonPart);
        if (journal != null) {
            Files.writeString(tmp.resolve("run.pending"), journal);
        }
        return sweep(tmp, "run.csv", "--resume");
    }

    void assertEqualsReference(CliRun r) throws IOException {
        assertEquals(0, r.code(), r.err());
        assertArrayEquals(csv.getBytes(StandardCharsets.UTF_8), Files.readAllBytes(tmp.resolve("run.csv")), "CSV byte for byte");
        assertArrayEquals(jsonl.getBytes(StandardCharsets.UTF_8), Files.readAllBytes(tmp.resolve("run.jsonl")),
                "JSON lines byte for byte");
        assertFalse(Files.exists(tmp.resolve("run.pending")), "journal removed at the end");
    }

    @Test
    void killInTheDrainOfJournalRowsLosesNothing() throws IOException {
        // points 5..9 had finished early and were journaled (5 and 6 already drained into both files);
        // the kill came after row 6 was written, before 7: files hold 0..6, journal holds 5..9
        StringBuilder j = new StringBuilder();
        for (int p = 5; p <= 9; p++) {
            j.append(journalLine(p));
        }
        CliRun r = resume(head(csv, 2, 7), head(jsonl, 1, 7), j.toString());
        assertEqualsReference(r);
        assertTrue(r.out().contains("; 20 computed now, 10 kept from the earlier run"), r.out());
    }

    @Test
    void killBetweenTheCsvAndTheJsonWriteOfAJournalRow() throws IOException {
        // row 7 (from the journal) reached the CSV file but not the JSON lines: the resume cuts it and
        // must take it back from the journal
        String j = journalLine(7) + journalLine(8);
        assertEqualsReference(resume(head(csv, 2, 8), head(jsonl, 1, 7), j));
    }

    @Test
    void tornJournalLineAndJournalRowsAlreadyInTheFiles() throws IOException {
        // journal: rows 2 and 3 (already in both files), row 6, then half of row 7's line (the kill came
        // while it was appended); rows 4 and 5 are to be computed, 7 recomputed
        String torn = journalLine(7);
        String j = journalLine(2) + journalLine(3) + journalLine(6) + torn.substring(0, torn.length() / 2);
        CliRun r = resume(head(csv, 2, 4), head(jsonl, 1, 4), j);
        assertEqualsReference(r);
        assertTrue(r.out().contains("; 25 computed now, 5 kept from the earlier run"), r.out());
    }

    @Test
    void everyRowInTheJournalNothingInTheFiles() throws IOException {
        // the extreme of a drain cut short: both files hold only their headers, the journal every row
        StringBuilder j = new StringBuilder();
        for (int p = 29; p >= 0; p--) {
            j.append(journalLine(p));
        }
        CliRun r = resume(head(csv, 2, 0), head(jsonl, 1, 0), j.toString());
        assertEqualsReference(r);
        assertTrue(r.out().contains("; 0 computed now, 30 kept from the earlier run"), r.out());
    }

    @Test
    void staleTemporaryJournalIsIgnored() throws IOException {
        // a kill while the journal was being rewritten leaves FILE.pending.tmp beside the journal
        Files.writeString(tmp.resolve("run.pending.tmp"), journalLine(3).substring(0, 40));
        assertEqualsReference(resume(head(csv, 2, 2), head(jsonl, 1, 2), journalLine(4)));
    }

    @Test
    void shardResumedFromItsJournal() throws IOException {
        // shard 1 of 2 owns chains 1, 3, 5, 7 (4 points per chain along delta, 15 values, 2 Bi values): points
        // 4-7, 12-14, 19-22, 27-29, in that order. Killed in a drain: the files hold 4-7 and 12, the journal 12, 13,
        // 14 and 19 (12 already in both files). The rows of a shard are the rows of the whole sweep (merge equals the single process).
        CliRun ref = sweepShard(tmp, "1/2", "part.csv");
        assertEquals(0, ref.code(), ref.err());
        Path csvRef = tmp.resolve("part.shard1of2.csv");
        Path jsonRef = tmp.resolve("part.shard1of2.jsonl");
        byte[] wantCsv = Files.readAllBytes(csvRef);
        byte[] wantJson = Files.readAllBytes(jsonRef);
        String shardCsv = Files.readString(csvRef);
        String shardJson = Files.readString(jsonRef);
        Files.writeString(csvRef, head(shardCsv, 2, 5));
        Files.writeString(jsonRef, head(shardJson, 1, 5));
        Files.writeString(tmp.resolve("part.shard1of2.pending"), journalLine(12) + journalLine(13) + journalLine(14)
                + journalLine(19));
        CliRun r = sweepShard(tmp, "1/2", "part.csv", "--resume");
        assertEquals(0, r.code(), r.err());
        assertTrue(r.out().contains("; 6 computed now, 8 kept from the earlier run"), r.out());
        assertArrayEquals(wantCsv, Files.readAllBytes(csvRef));
        assertArrayEquals(wantJson, Files.readAllBytes(jsonRef));
        assertFalse(Files.exists(tmp.resolve("part.shard1of2.pending")));
    }
}
