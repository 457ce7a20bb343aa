package rdstab.cli.output;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import rdstab.cli.report.ResultJson;

/**
 * Writes the rows of a sweep (or of one shard) in point order, safely against a kill at any instant.
 *
 * <p><b>Durability.</b> Both files are append-only; each row is one write of one complete line,
 * followed by fsync, first to the CSV file, then to the JSON-lines file. A point that finishes
 * before an earlier one (another thread's chain) waits in memory and is also appended, fsynced, to a
 * journal {@code FILE.pending} so that a kill does not lose it. So a kill loses only the points
 * being computed, and leaves at most a torn last line, which {@link #open} cuts off on resume.
 *
 * <p><b>Resume.</b> The finished rows are the longest prefix of the shard's points present, complete
 * and in order in both files; the files are truncated to it. Journal entries for later points are
 * taken back, and those that continue the files are written at once (a run killed while it moved
 * journal rows into the files leaves the next point in the journal, and that point is not computed
 * again); the journal is then rewritten (temporary file, fsync, atomic rename: a kill leaves the old
 * or the new journal, never none). The journal is deleted when the run completes; before that,
 * {@link #verifyComplete} reads both files back and fails when a point is missing.
 *
 * <p><b>One writer.</b> An OS lock on {@code FILE.pending.lock} (an empty file that stays) is held while
 * a run writes; a second run on the same output is refused instead of interleaving rows.
 */
public final class SweepOutput implements AutoCloseable {

    private final Path csvPath;
    private final Path jsonPath;
    private final Path journalPath;
    private final FileChannel csv;
    private final FileChannel json;
    private FileChannel journal;
    /** Held (with an OS file lock on FILE.pending.lock) while this run writes; keeps a second run out. */
    private FileChannel lock;
    private final Map<Integer, Integer> position = new HashMap<>();
    private final TreeMap<Integer, String[]> waiting = new TreeMap<>();
    private final int[] points;
    /** CSV columns per row. */
    private final int columns;
    private int next;
    private final int resumed;
    /** Status of the points finished before this run started (resumed rows and journal entries). */
    private final Map<Integer, rdstab.solver.sweep.PointStatus> earlier = new HashMap<>();

    private SweepOutput(Path[] paths, int columns, int[] points, int done, Map<Integer, String[]> pending,
                        List<SweepFiles.Line> kept) throws IOException {
        this.columns = columns;
        this.csvPath = paths[0];
        this.jsonPath = paths[1];
        this.journalPath = journalOf(paths[1]);
        this.points = points;
        for (int i = 0; i < points.length; i++) {
            position.put(points[i], i);
        }
        this.next = done;
        this.resumed = done + pending.size();
        pending.forEach((p, rows) -> waiting.put(position.get(p), rows));
        for (int i = 0; i < done; i++) {
            earlier.put(kept.get(i).point(), status(kept.get(i).text()));
        }
        pending.forEach((p, rows) -> earlier.put(p, status(rows[1])));
        csv = FileChannel.open(csvPath, StandardOpenOption.WRITE);
        json = FileChannel.open(jsonPath, StandardOpenOption.WRITE);
        csv.position(csv.size());
        json.position(json.size());
        // Journal rows that continue the files are written now: they will not be computed again (the runner
        // skips finished points), so no later accept() of the point at `next` would ever release them. A run
        // killed while it drained the journal into the files leaves exactly this state.
        drainWaiting();
        rewriteJournal();
    }

    /** The journal path of a JSON-lines path. */
    public static Path journalOf(Path jsonPath) {
        String n = jsonPath.getFileName().toString();
        return jsonPath.resolveSibling((n.endsWith(".jsonl") ? n.substring(0, n.length() - 6) : n) + ".pending");
    }

    /**
     * Opens (or resumes) the output of a sweep.
     *
     * @param paths     the CSV and JSON-lines paths
     * @param csvHead   the CSV header (both lines)
     * @param jsonHead  the JSON-lines header line
     * @param columns   CSV columns per row
     * @param points    the points this run must write, in order
     * @param resume    keep finished rows of an earlier run of the same specification
     * @param force     overwrite existing files (ignored with resume)
     * @throws java.io.UncheckedIOException when files exist without resume/force, or hold another sweep
     */
    public static SweepOutput open(Path[] paths, String csvHead, String jsonHead, int columns, int[] points, boolean resume,
                                   boolean force) throws IOException {
        Path dir = paths[0].toAbsolutePath().getParent();
        Files.createDirectories(dir);
        FileChannel lock = FileChannel.open(journalOf(paths[1]).resolveSibling(journalOf(paths[1]).getFileName() + ".lock"),
                StandardOpenOption.CREATE, StandardOpenOption.WRITE);
        try {
            if (tryLock(lock) == null) {
                throw new java.nio.file.FileSystemException(paths[0] + ": another rdstab sweep is writing this output now; "
                        + "wait for it, or give this run another --out");
            }
            SweepOutput o = openLocked(paths, csvHead, jsonHead, columns, points, resume, force);
            o.lock = lock;
            return o;
        } catch (IOException | RuntimeException e) {
            lock.close();
            throw e;
        }
    }

    /** The OS lock, or null when another process (or another run in this JVM) holds it. */
    private static java.nio.channels.FileLock tryLock(FileChannel ch) throws IOException {
        try {
            return ch.tryLock();
        } catch (java.nio.channels.OverlappingFileLockException e) {
            return null;
        }
    }

    private static SweepOutput openLocked(Path[] paths, String csvHead, String jsonHead, int columns, int[] points,
                                          boolean resume, boolean force) throws IOException {
        Path dir = paths[0].toAbsolutePath().getParent();
        boolean exists = Files.exists(paths[0]) || Files.exists(paths[1]);
        if (exists && !resume && !force) {
            throw new java.nio.file.FileAlreadyExistsException(paths[0] + " or " + paths[1]
                    + " exists; pass --resume to continue that sweep or --force to start it again");
        }
        int done = 0;
        Map<Integer, String[]> pending = new LinkedHashMap<>();
        if (resume && Files.exists(paths[0]) && Files.exists(paths[1])) {
            SweepFiles.Contents c = SweepFiles.read(paths[0], true, columns);
            SweepFiles.Contents j = SweepFiles.read(paths[1], false, 0);
            if (c.headerEnd() > 0 && j.headerEnd() > 0) {
                sameSweep(paths[0], c.header(), csvHead);
                sameSweep(paths[1], j.header(), jsonHead);
                done = prefix(c.lines(), j.lines(), points);
                truncate(paths[0], done == 0 ? c.headerEnd() : c.lines().get(done - 1).end());
                truncate(paths[1], done == 0 ? j.headerEnd() : j.lines().get(done - 1).end());
                pending = readJournal(journalOf(paths[1]), points, done, columns);
                return new SweepOutput(paths, columns, points, done, pending, j.lines());
            }
        }
        fresh(paths[0], csvHead);
        fresh(paths[1], jsonHead);
        Files.deleteIfExists(journalOf(paths[1]));
        syncDirectory(dir);
        return new SweepOutput(paths, columns, points, 0, pending, List.of());
    }

    private static void sameSweep(Path file, String found, String expected) {
        if (!found.equals(expected)) {
            throw new rdstab.solver.error.InputException(file.toString(), "line 1", "this file holds another sweep "
                    + "(different case, overrides, ranges, chain length or shard); resume it with the same options, or pass "
                    + "another --out, or --force to start again");
        }
    }

    private static int prefix(List<SweepFiles.Line> a, List<SweepFiles.Line> b, int[] points) {
        int n = 0;
        while (n < a.size() && n < b.size() && n < points.length && a.get(n).point() == points[n] && b.get(n).point() == points[n]) {
            n++;
        }
        return n;
    }

    private static Map<Integer, String[]> readJournal(Path journal, int[] points, int done, int columns) throws IOException {
        Map<Integer, String[]> out = new LinkedHashMap<>();
        if (!Files.exists(journal)) {
            return out;
        }
        Map<Integer, Integer> pos = new HashMap<>();
        for (int i = 0; i < points.length; i++) {
            pos.put(points[i], i);
        }
        byte[] bytes = Files.readAllBytes(journal);
        int start = 0;
        for (int i = 0; i < bytes.length; i++) {
            if (bytes[i] != '\n') {
                continue;
            }
            String line = new String(bytes, start, i + 1 - start, StandardCharsets.UTF_8);
            start = i + 1;
            try {
                JsonNode n = SweepFiles.MAPPER.readTree(line);
                int p = n.get("point").asInt();
                String c = n.get("csv").asText();
                String j = n.get("json").asText();
                Integer at = pos.get(p);
                boolean valid = SweepFiles.csvPoint(c, columns) == p && SweepFiles.jsonPoint(j) == p;
                if (at != null && at >= done && valid) {
                    out.put(p, new String[] {c, j});
                }
            } catch (IOException | RuntimeException e) {
                break;
            }
        }
        return out;
    }

    private static void fresh(Path file, String header) throws IOException {
        try (FileChannel ch = FileChannel.open(file, StandardOpenOption.CREATE, StandardOpenOption.WRITE,
                StandardOpenOption.TRUNCATE_EXISTING)) {
            writeFully(ch, header);
            ch.force(true);
        }
    }

    private static void truncate(Path file, long size) throws IOException {
        try (FileChannel ch = FileChannel.open(file, StandardOpenOption.WRITE)) {
            ch.truncate(size);
            ch.force(true);
        }
    }

    private static void writeFully(FileChannel ch, String text) throws IOException {
        ByteBuffer b = ByteBuffer.wrap(text.getBytes(StandardCharsets.UTF_8));
        while (b.hasRemaining()) {
            ch.write(b);
        }
    }

    private static void syncDirectory(Path dir) {
        try (FileChannel d = FileChannel.open(dir, StandardOpenOption.READ)) {
            d.force(true);
        } catch (IOException | UnsupportedOperationException e) {
            // some platforms cannot open a directory; the files themselves are fsynced
        }
    }

    /** Number of points of this run already finished before it started (resume). */
    public int resumed() {
        return resumed;
    }

    /** The status of point p when it was finished before this run started (resumed or journal), else null. */
    public rdstab.solver.sweep.PointStatus earlier(int p) {
        return earlier.get(p);
    }

    private static rdstab.solver.sweep.PointStatus status(String jsonRow) {
        try {
            return rdstab.solver.sweep.PointStatus.of(SweepFiles.MAPPER.readTree(jsonRow).get("status").asText());
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }

    /** Rows written so far (including resumed ones). */
    public synchronized int written() {
        return next;
    }

    /**
     * Accepts the finished rows of point p (any thread); writes them now if it is the next point,
     * else keeps them (in memory and in the journal) until the points before it are written.
     */
    public synchronized void accept(int p, String csvRow, String jsonRow) throws IOException {
        Integer at = position.get(p);
        if (at == null || at < next || waiting.containsKey(at)) {
            throw new IllegalStateException("point " + p + " is not expected here or was written twice");
        }
        if (at != next) {
            waiting.put(at, new String[] {csvRow, jsonRow});
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("point", p);
            m.put("csv", csvRow);
            m.put("json", jsonRow);
            if (journal == null) {
                journal = FileChannel.open(journalPath, StandardOpenOption.CREATE, StandardOpenOption.WRITE,
                        StandardOpenOption.APPEND);
            }
            writeFully(journal, ResultJson.write(m) + "\n");
            journal.force(false);
            return;
        }
        write(csvRow, jsonRow);
        drainWaiting();
    }

    /** Writes the waiting rows that continue the files (the point at {@code next} and those after it). */
    private void drainWaiting() throws IOException {
        while (!waiting.isEmpty() && waiting.firstKey() == next) {
            String[] rows = waiting.pollFirstEntry().getValue();
            write(rows[0], rows[1]);
        }
    }

    private void write(String csvRow, String jsonRow) throws IOException {
        writeFully(csv, csvRow);
        csv.force(false);
        writeFully(json, jsonRow);
        json.force(false);
        next++;
    }

    /**
     * Replaces the journal by the rows still waiting. The old journal stays until the atomic rename, so a
     * kill at any instant leaves either the old journal or the new one, never none (the entries of the old
     * one that are already in the files are ignored on resume).
     */
    private void rewriteJournal() throws IOException {
        if (waiting.isEmpty()) {
            Files.deleteIfExists(journalPath);
            return;
        }
        StringBuilder sb = new StringBuilder();
        for (Map.Entry<Integer, String[]> e : waiting.entrySet()) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("point", points[e.getKey()]);
            m.put("csv", e.getValue()[0]);
            m.put("json", e.getValue()[1]);
            sb.append(ResultJson.write(m)).append('\n');
        }
        Path tmp = journalPath.resolveSibling(journalPath.getFileName() + ".tmp");
        fresh(tmp, sb.toString());
        Files.move(tmp, journalPath, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
        syncDirectory(journalPath.toAbsolutePath().getParent());
        journal = FileChannel.open(journalPath, StandardOpenOption.WRITE, StandardOpenOption.APPEND);
    }

    /** True when every point of this run is written. */
    public synchronized boolean complete() {
        return next == points.length;
    }

    /**
     * The self-check at the end of a run: every point of this run (shard) is written, and both files as
     * they are now on disk hold exactly these points, complete and in order, with nothing after them.
     * A sweep must never end "successfully" with points missing.
     *
     * @throws IOException (exit status 4) naming the file and the first missing or unexpected point
     */
    public synchronized void verifyComplete() throws IOException {
        if (next != points.length) {
            throw new IOException(csvPath + ": the sweep ended with " + (points.length - next) + " of its " + points.length
                    + " points not written (first missing: point " + points[next] + "); the finished rows are kept in "
                    + csvPath.getFileName() + ", " + jsonPath.getFileName() + " and " + journalPath.getFileName()
                    + "; run the same command with --resume to complete it");
        }
        check(csvPath, SweepFiles.read(csvPath, true, columns));
        check(jsonPath, SweepFiles.read(jsonPath, false, 0));
    }

    private void check(Path file, SweepFiles.Contents c) throws IOException {
        List<SweepFiles.Line> lines = c.lines();
        int n = prefix(lines, lines, points);
        if (n != points.length || lines.size() != points.length || c.torn()) {
            String what = n < points.length ? "point " + points[n] + " is missing or out of place"
                    : "something follows the last point";
            throw new IOException(file + ": after the sweep the file does not hold exactly the " + points.length
                    + " points of this run in order (" + what + "); it was changed while the sweep ran, or this is a "
                    + "defect: run the same command with --resume to repair it");
        }
    }

    /** Closes the files; deletes the journal when every point is written. */
    @Override
    public synchronized void close() throws IOException {
        try {
            csv.close();
            json.close();
            if (journal != null) {
                journal.close();
            }
        } finally {
            if (complete()) {
                Files.deleteIfExists(journalPath);
                Files.deleteIfExists(journalPath.resolveSibling(journalPath.getFileName() + ".tmp"));
            }
            if (lock != null) {
                lock.close();
            }
        }
    }

    /** The CSV file. */
    public Path csvPath() {
        return csvPath;
    }

    /** The JSON-lines file. */
    public Path jsonPath() {
        return jsonPath;
    }
}
