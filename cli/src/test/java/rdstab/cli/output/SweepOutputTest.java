package rdstab.cli.output;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The file mechanics of a sweep output (no numerics: rows are placeholders with the right shape): the
 * end-of-run self-check refuses missing or extra points, and journal rows that continue the files are
 * written when a run resumes. Append-only files with a journal: common practice, no source.
 */
class SweepOutputTest {

    @TempDir
    Path tmp;

    static final int COLS = SweepFiles.columns(List.of("x"), List.of("u")).size();
    static final String CSV_HEAD = SweepFiles.csvHeader("{\"test\":1}", SweepFiles.columns(List.of("x"), List.of("u")));
    static final String JSON_HEAD = "{\"sweep\":{\"test\":1}}\n";

    static String csvRow(int p) {
        return p + ",".repeat(COLS - 1) + "\"\"\n";
    }

    static String jsonRow(int p) {
        return "{\"point\":" + p + ",\"status\":\"ok\"}\n";
    }

    Path[] paths() {
        return SweepFiles.paths(tmp.resolve("s.csv"));
    }

    SweepOutput open(int[] points, boolean resume) throws IOException {
        return SweepOutput.open(paths(), CSV_HEAD, JSON_HEAD, COLS, points, resume, !resume);
    }

    @Test
    void selfCheckRefusesAMissingPoint() throws IOException {
        int[] points = {0, 1, 2, 3, 4};
        IOException e;
        try (SweepOutput o = open(points, false)) {
            for (int p : new int[] {0, 1, 3, 4}) {
                o.accept(p, csvRow(p), jsonRow(p));
            }
            assertEquals(2, o.written());
            e = assertThrows(IOException.class, o::verifyComplete);
        }
        assertTrue(e.getMessage().contains("first missing: point 2") && e.getMessage().contains("--resume"), e.getMessage());
        assertTrue(Files.exists(SweepOutput.journalOf(paths()[1])), "finished rows 3 and 4 stay in the journal");
    }

    @Test
    void selfCheckRereadsTheFilesOnDisk() throws IOException {
        int[] points = {0, 2, 4};
        try (SweepOutput o = open(points, false)) {
            for (int p : new int[] {4, 2, 0}) {
                o.accept(p, csvRow(p), jsonRow(p));
            }
            o.verifyComplete();
            // something else appends to the JSON lines behind the run's back: no longer exactly the points
            Files.writeString(paths()[1], jsonRow(6), StandardOpenOption.APPEND);
            IOException e = assertThrows(IOException.class, o::verifyComplete);
            assertTrue(e.getMessage().contains("s.jsonl") && e.getMessage().contains("follows the last point"), e.getMessage());
            // and a CSV cut to two rows
            Files.writeString(paths()[0], CSV_HEAD + csvRow(0) + csvRow(2));
            e = assertThrows(IOException.class, o::verifyComplete);
            assertTrue(e.getMessage().contains("s.csv") && e.getMessage().contains("point 4 is missing"), e.getMessage());
        }
    }

    @Test
    void resumeWritesJournalRowsThatContinueTheFiles() throws IOException {
        int[] points = {0, 1, 2, 3};
        // the state a kill leaves while a run drains its journal: files hold 0 and 1, the journal 1, 2, 3
        Files.writeString(paths()[0], CSV_HEAD + csvRow(0) + csvRow(1));
        Files.writeString(paths()[1], JSON_HEAD + jsonRow(0) + jsonRow(1));
        String journal = "";
        for (int p = 1; p <= 3; p++) {
            journal += "{\"point\":" + p + ",\"csv\":" + SweepFiles.MAPPER.writeValueAsString(csvRow(p)) + ",\"json\":"
                    + SweepFiles.MAPPER.writeValueAsString(jsonRow(p)) + "}\n";
        }
        Files.writeString(SweepOutput.journalOf(paths()[1]), journal);
        try (SweepOutput o = open(points, true)) {
            assertEquals(4, o.written(), "rows 2 and 3 written at once: no point left to compute would release them");
            assertEquals(4, o.resumed());
            o.verifyComplete();
        }
        assertEquals(CSV_HEAD + csvRow(0) + csvRow(1) + csvRow(2) + csvRow(3), Files.readString(paths()[0]));
        assertTrue(Files.notExists(SweepOutput.journalOf(paths()[1])), "journal removed once everything is written");
    }

    @Test
    void secondWriterIsRefusedAndTheLockIsFreedOnClose() throws IOException {
        int[] points = {0, 1};
        try (SweepOutput o = open(points, false)) {
            o.accept(0, csvRow(0), jsonRow(0));
            IOException e = assertThrows(IOException.class, () -> open(points, true));
            assertTrue(e.getMessage().contains("another rdstab sweep is writing"), e.getMessage());
        }
        try (SweepOutput again = open(points, true)) {
            assertEquals(1, again.resumed());
            again.accept(1, csvRow(1), jsonRow(1));
            again.verifyComplete();
        }
    }
}
