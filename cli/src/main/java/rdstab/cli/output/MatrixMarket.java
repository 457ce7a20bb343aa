package rdstab.cli.output;

import java.io.BufferedReader;
import java.io.BufferedWriter;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.Arrays;
import java.util.Locale;
import org.ejml.data.DMatrixSparseCSC;
import rdstab.solver.error.InputException;

/**
 * Matrix Market coordinate files (the NIST exchange format): a banner
 * {@code %%MatrixMarket matrix coordinate real general|symmetric}, comment lines starting with
 * {@code %}, a size line "rows cols entries", then one "row col value" line per entry, indices
 * 1-based. Values are written with Java's shortest round-trip representation, so a matrix written and
 * read back is equal entry by entry. Reading accepts real and integer fields, general and symmetric
 * (the lower triangle is stored; the mirror is added), sums duplicate entries (common practice, no
 * source) and reports a malformed file as an {@link InputException} naming the line.
 */
public final class MatrixMarket {

    private MatrixMarket() {
    }

    /**
     * Writes A atomically (temporary file then rename).
     *
     * @param symmetric write only the lower triangle with the "symmetric" banner (A must be symmetric)
     * @param comment   one comment line written below the banner (may be null)
     */
    public static void write(Path target, DMatrixSparseCSC a, boolean symmetric, String comment, boolean overwrite) {
        try {
            Path dir = target.toAbsolutePath().getParent();
            Files.createDirectories(dir);
            if (!overwrite && Files.exists(target)) {
                throw new UncheckedIOException(new IOException(target + " exists; pass --force to overwrite it"));
            }
            Path tmp = Files.createTempFile(dir, "." + target.getFileName(), ".tmp");
            try {
                try {
                    Files.setPosixFilePermissions(tmp, java.nio.file.attribute.PosixFilePermissions.fromString("rw-r--r--"));
                } catch (UnsupportedOperationException e) {
                    // not a POSIX file system: keep the default permissions
                }
                try (BufferedWriter w = Files.newBufferedWriter(tmp, StandardCharsets.US_ASCII)) {
                    writeTo(w, a, symmetric, comment);
                }
                Files.move(tmp, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
            } finally {
                Files.deleteIfExists(tmp);
            }
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write " + target + ": " + e.getMessage(), e);
        }
    }

    private static void writeTo(BufferedWriter w, DMatrixSparseCSC a, boolean symmetric, String comment) throws IOException {
        long count = 0;
        for (int j = 0; j < a.numCols; j++) {
            for (int q = a.col_idx[j]; q < a.col_idx[j + 1]; q++) {
                if (!symmetric || a.nz_rows[q] >= j) {
                    count++;
                }
            }
        }
        w.write("%%MatrixMarket matrix coordinate real " + (symmetric ? "symmetric" : "general") + "\n");
        if (comment != null) {
            w.write("% " + comment.replaceAll("\\R", " ") + "\n");
        }
        w.write(a.numRows + " " + a.numCols + " " + count + "\n");
        StringBuilder line = new StringBuilder(64);
        for (int j = 0; j < a.numCols; j++) {
            for (int q = a.col_idx[j]; q < a.col_idx[j + 1]; q++) {
                int i = a.nz_rows[q];
                if (symmetric && i < j) {
                    continue;
                }
                line.setLength(0);
                line.append(i + 1).append(' ').append(j + 1).append(' ').append(a.nz_values[q]).append('\n');
                w.append(line);
            }
        }
    }

    /** Reads a coordinate real/integer general/symmetric matrix. */
    public static DMatrixSparseCSC read(Path file) {
        String name = file.toString();
        try (BufferedReader r = Files.newBufferedReader(file, StandardCharsets.US_ASCII)) {
            String banner = r.readLine();
            if (banner == null || !banner.toLowerCase(Locale.ROOT).startsWith("%%matrixmarket")) {
                throw new InputException(name, "line 1", "a Matrix Market banner '%%MatrixMarket matrix coordinate real general'");
            }
            String[] b = banner.trim().toLowerCase(Locale.ROOT).split("\\s+");
            if (b.length < 5 || !b[1].equals("matrix") || !b[2].equals("coordinate")
                    || !(b[3].equals("real") || b[3].equals("integer")) || !(b[4].equals("general") || b[4].equals("symmetric"))) {
                throw new InputException(name, "line 1", "'matrix coordinate real|integer general|symmetric', found '" + banner.trim() + "'");
            }
            boolean symmetric = b[4].equals("symmetric");
            int lineNo = 1;
            String line;
            do {
                line = r.readLine();
                lineNo++;
            } while (line != null && (line.startsWith("%") || line.isBlank()));
            if (line == null) {
                throw new InputException(name, "line " + lineNo, "the size line 'rows columns entries'");
            }
            long[] size = numbers(line, 3, name, lineNo, "the size line 'rows columns entries'");
            if (size[0] < 1 || size[1] < 1 || size[0] > Integer.MAX_VALUE || size[1] > Integer.MAX_VALUE
                    || size[2] < 0 || size[2] > Integer.MAX_VALUE / 2) {
                throw new InputException(name, "line " + lineNo, "positive sizes, found '" + line.trim() + "'");
            }
            int rows = (int) size[0];
            int cols = (int) size[1];
            int entries = (int) size[2];
            int cap = symmetric ? 2 * entries : entries;
            int[] ri = new int[cap];
            int[] ci = new int[cap];
            double[] vals = new double[cap];
            int k = 0;
            for (int e = 0; e < entries; e++) {
                line = r.readLine();
                lineNo++;
                if (line == null) {
                    throw new InputException(name, "line " + lineNo, entries + " entries, the file ends after " + e);
                }
                if (line.startsWith("%") || line.isBlank()) {
                    e--;
                    continue;
                }
                int[] cut = fields(line);
                if (cut == null) {
                    throw new InputException(name, "line " + lineNo, "'row column value', found '" + line.trim() + "'");
                }
                int i;
                int j;
                double v;
                try {
                    i = Integer.parseInt(line, cut[0], cut[1], 10) - 1;
                    j = Integer.parseInt(line, cut[2], cut[3], 10) - 1;
                    v = Double.parseDouble(line.substring(cut[4], cut[5]));
                } catch (NumberFormatException ex) {
                    throw new InputException(name, "line " + lineNo, "'row column value' as numbers, found '" + line.trim() + "'");
                }
                if (i < 0 || i >= rows || j < 0 || j >= cols || !Double.isFinite(v)) {
                    throw new InputException(name, "line " + lineNo, "indices within 1.." + rows + " x 1.." + cols
                            + " and a finite value, found '" + line.trim() + "'");
                }
                ri[k] = i;
                ci[k] = j;
                vals[k++] = v;
                if (symmetric && i != j) {
                    ri[k] = j;
                    ci[k] = i;
                    vals[k++] = v;
                }
            }
            return compress(rows, cols, ri, ci, vals, k);
        } catch (NoSuchFileException e) {
            throw new UncheckedIOException("cannot read " + name + ": no such file", e);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + name + ": " + e.getMessage(), e);
        }
    }

    /** Start and end of the first three blank-separated fields of a line, or null when there are fewer. */
    private static int[] fields(String line) {
        int[] cut = new int[6];
        int pos = 0;
        int len = line.length();
        for (int f = 0; f < 3; f++) {
            while (pos < len && Character.isWhitespace(line.charAt(pos))) {
                pos++;
            }
            if (pos == len) {
                return null;
            }
            cut[2 * f] = pos;
            while (pos < len && !Character.isWhitespace(line.charAt(pos))) {
                pos++;
            }
            cut[2 * f + 1] = pos;
        }
        return cut;
    }

    private static long[] numbers(String line, int count, String file, int lineNo, String expected) {
        String[] t = line.trim().split("\\s+");
        if (t.length < count) {
            throw new InputException(file, "line " + lineNo, expected + ", found '" + line.trim() + "'");
        }
        long[] out = new long[count];
        try {
            for (int i = 0; i < count; i++) {
                out[i] = Long.parseLong(t[i]);
            }
        } catch (NumberFormatException e) {
            throw new InputException(file, "line " + lineNo, expected + ", found '" + line.trim() + "'");
        }
        return out;
    }

    /** Compressed columns with sorted rows; duplicates summed. */
    static DMatrixSparseCSC compress(int rows, int cols, int[] ri, int[] ci, double[] vals, int k) {
        int[] start = new int[cols + 1];
        for (int e = 0; e < k; e++) {
            start[ci[e] + 1]++;
        }
        for (int j = 0; j < cols; j++) {
            start[j + 1] += start[j];
        }
        int[] fill = Arrays.copyOf(start, cols);
        int[] r = new int[k];
        double[] v = new double[k];
        for (int e = 0; e < k; e++) {
            int p = fill[ci[e]]++;
            r[p] = ri[e];
            v[p] = vals[e];
        }
        DMatrixSparseCSC a = new DMatrixSparseCSC(rows, cols, k);
        int nz = 0;
        long[] keyed = new long[0];
        for (int j = 0; j < cols; j++) {
            a.col_idx[j] = nz;
            int len = start[j + 1] - start[j];
            if (keyed.length < len) {
                keyed = new long[Math.max(len, 2 * keyed.length)];
            }
            for (int q = 0; q < len; q++) {
                keyed[q] = ((long) r[start[j] + q] << 32) | q;
            }
            Arrays.sort(keyed, 0, len);
            int lastRow = -1;
            for (int q = 0; q < len; q++) {
                int row = (int) (keyed[q] >>> 32);
                double val = v[start[j] + (int) (keyed[q] & 0xffffffffL)];
                if (row == lastRow) {
                    a.nz_values[nz - 1] += val;
                } else {
                    a.nz_rows[nz] = row;
                    a.nz_values[nz++] = val;
                    lastRow = row;
                }
            }
        }
        a.col_idx[cols] = nz;
        a.nz_length = nz;
        a.indicesSorted = true;
        return a;
    }
}
