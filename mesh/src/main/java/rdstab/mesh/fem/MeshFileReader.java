package rdstab.mesh.fem;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.StringReader;
import java.util.ArrayList;
import java.util.List;

/**
 * Reads rdstab's plain text triangle-mesh format (documented in cases/README.md):
 * <pre>
 *   # comment lines and blank lines are ignored anywhere
 *   nodes 4                 # section header with the count
 *   0 0                     # x y, one node per line; nodes are numbered 1, 2, … in this order
 *   1 0
 *   1 1
 *   0 1
 *   triangles 2
 *   1 2 3                   # three node numbers, counter-clockwise
 *   1 3 4
 *   boundary 4
 *   1 2 bottom              # two node numbers and the name of the boundary part
 *   2 3 right
 *   3 4 top
 *   4 1 left
 * </pre>
 * The sections come in this order. Every error is a {@link MeshFileException} naming the line
 * (also for mesh-level problems found by {@link TriangleMesh}'s validation, e.g. a degenerate
 * triangle names the line that lists it).
 */
public final class MeshFileReader {

    /** Largest node or triangle count accepted (memory guard). */
    public static final int MAX_ITEMS = 20_000_000;

    /** A mesh-file problem at a line (1-based; 0 when it concerns the file as a whole). */
    public static final class MeshFileException extends IllegalArgumentException {
        private static final long serialVersionUID = 1L;
        private final int line;
        private final String problem;

        MeshFileException(int line, String problem) {
            super((line > 0 ? "line " + line + ": " : "") + problem);
            this.line = line;
            this.problem = problem;
        }

        /** The 1-based line, or 0. */
        public int line() {
            return line;
        }

        /** The problem without the line. */
        public String problem() {
            return problem;
        }
    }

    private final BufferedReader in;
    private int lineNo;

    private MeshFileReader(BufferedReader in) {
        this.in = in;
    }

    /** Parses mesh text. */
    public static TriangleMesh parse(String text) {
        try {
            return new MeshFileReader(new BufferedReader(new StringReader(text))).read();
        } catch (IOException e) {
            throw new IllegalStateException("reading from a string failed", e);
        }
    }

    /** Reads a mesh from a reader (not closed). */
    public static TriangleMesh read(BufferedReader reader) throws IOException {
        return new MeshFileReader(reader).read();
    }

    private TriangleMesh read() throws IOException {
        int n = header("nodes");
        double[] x = new double[n];
        double[] y = new double[n];
        int[] nodeLine = new int[n];
        for (int i = 0; i < n; i++) {
            String[] t = fields(2, "a node line 'x y'");
            x[i] = number(t[0]);
            y[i] = number(t[1]);
            nodeLine[i] = lineNo;
        }
        int m = header("triangles");
        int[] tri = new int[3 * m];
        int[] triLine = new int[m];
        for (int k = 0; k < m; k++) {
            String[] t = fields(3, "a triangle line 'a b c' (three node numbers)");
            for (int c = 0; c < 3; c++) {
                tri[3 * k + c] = node(t[c], n);
            }
            triLine[k] = lineNo;
        }
        int e = header("boundary");
        int[] edges = new int[2 * e];
        String[] parts = new String[e];
        int[] edgeLine = new int[e];
        for (int k = 0; k < e; k++) {
            String[] t = fields(3, "a boundary line 'a b part-name'");
            edges[2 * k] = node(t[0], n);
            edges[2 * k + 1] = node(t[1], n);
            if (!t[2].matches("[A-Za-z_][A-Za-z0-9_-]*")) {
                throw new MeshFileException(lineNo, "part name '" + t[2] + "' must start with a letter or '_' and use "
                        + "only letters, digits, '_' and '-'");
            }
            parts[k] = t[2];
            edgeLine[k] = lineNo;
        }
        String extra = next();
        if (extra != null) {
            throw new MeshFileException(lineNo, "unexpected text after the boundary section: '" + extra + "'");
        }
        try {
            return new TriangleMesh(x, y, tri, edges, parts);
        } catch (InvalidMeshException ex) {
            int line = switch (ex.item()) {
                case NODE -> nodeLine[ex.number()];
                case TRIANGLE -> triLine[ex.number()];
                case EDGE -> edgeLine[ex.number()];
                case MESH -> 0;
            };
            throw new MeshFileException(line, renumber(ex.getMessage()));
        }
    }

    /** The mesh speaks of items from 0; the file counts from 1. */
    private static String renumber(String msg) {
        java.util.regex.Matcher mt = java.util.regex.Pattern.compile("(node|triangle|edge|nodes are numbered) (\\d+)")
                .matcher(msg);
        StringBuilder sb = new StringBuilder();
        while (mt.find()) {
            mt.appendReplacement(sb, mt.group(1) + " " + (Long.parseLong(mt.group(2)) + 1));
        }
        mt.appendTail(sb);
        String s = sb.toString();
        java.util.regex.Matcher pair = java.util.regex.Pattern.compile("\\((\\d+), (\\d+)\\)").matcher(s);
        sb = new StringBuilder();
        while (pair.find()) {
            pair.appendReplacement(sb, "(" + (Long.parseLong(pair.group(1)) + 1) + ", " + (Long.parseLong(pair.group(2)) + 1) + ")");
        }
        pair.appendTail(sb);
        return sb.toString().replace("uses a node twice", "uses a node twice (numbers from 1)");
    }

    private String next() throws IOException {
        String line;
        while ((line = in.readLine()) != null) {
            lineNo++;
            int hash = line.indexOf('#');
            String s = (hash >= 0 ? line.substring(0, hash) : line).trim();
            if (!s.isEmpty()) {
                return s;
            }
        }
        return null;
    }

    private int header(String word) throws IOException {
        String s = next();
        if (s == null) {
            throw new MeshFileException(lineNo, "the file ends before the '" + word + " COUNT' line");
        }
        String[] t = s.split("\\s+");
        if (t.length != 2 || !t[0].equals(word)) {
            throw new MeshFileException(lineNo, "expected '" + word + " COUNT', found '" + s + "'");
        }
        int n;
        try {
            n = Integer.parseInt(t[1]);
        } catch (NumberFormatException e) {
            throw new MeshFileException(lineNo, "the " + word + " count must be a whole number, found '" + t[1] + "'");
        }
        if (n < (word.equals("boundary") ? 3 : 1) || n > MAX_ITEMS) {
            throw new MeshFileException(lineNo, "the " + word + " count must be from " + (word.equals("boundary") ? 3 : 1)
                    + " to " + MAX_ITEMS + ", found " + n);
        }
        return n;
    }

    private String[] fields(int count, String what) throws IOException {
        String s = next();
        if (s == null) {
            throw new MeshFileException(lineNo, "the file ends early: expected " + what);
        }
        String[] t = s.split("\\s+");
        if (t.length != count) {
            throw new MeshFileException(lineNo, "expected " + what + ", found '" + s + "'");
        }
        return t;
    }

    private double number(String s) {
        try {
            double v = Double.parseDouble(s);
            if (Double.isFinite(v)) {
                return v;
            }
        } catch (NumberFormatException e) {
            // reported below
        }
        throw new MeshFileException(lineNo, "expected a finite number, found '" + s + "'");
    }

    private int node(String s, int n) {
        int v;
        try {
            v = Integer.parseInt(s);
        } catch (NumberFormatException e) {
            throw new MeshFileException(lineNo, "expected a node number, found '" + s + "'");
        }
        if (v < 1 || v > n) {
            throw new MeshFileException(lineNo, "node number " + v + " is out of range; nodes are numbered 1 to " + n);
        }
        return v - 1;
    }

    /** Writes a mesh in this format (for tests and for users who convert meshes). */
    public static String write(TriangleMesh mesh) {
        StringBuilder sb = new StringBuilder();
        sb.append("nodes ").append(mesh.nodeCount()).append('\n');
        for (int i = 0; i < mesh.nodeCount(); i++) {
            sb.append(mesh.x(i)).append(' ').append(mesh.y(i)).append('\n');
        }
        sb.append("triangles ").append(mesh.triangleCount()).append('\n');
        for (int t = 0; t < mesh.triangleCount(); t++) {
            sb.append(mesh.corner(t, 0) + 1).append(' ').append(mesh.corner(t, 1) + 1).append(' ')
              .append(mesh.corner(t, 2) + 1).append('\n');
        }
        sb.append("boundary ").append(mesh.edgeCount()).append('\n');
        List<String> names = new ArrayList<>(mesh.partNames());
        for (int e = 0; e < mesh.edgeCount(); e++) {
            sb.append(mesh.edgeEnd(e, 0) + 1).append(' ').append(mesh.edgeEnd(e, 1) + 1).append(' ')
              .append(names.get(mesh.edgePart(e))).append('\n');
        }
        return sb.toString();
    }
}
