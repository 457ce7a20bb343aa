package rdstab.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Bad 2D geometry gives one plain line on stderr and exit 2 (the command-line contract). */
class PlaneGeometryErrorTest {

    @TempDir
    Path tmp;

    private static String polygonCase(String outer, String holes, String boundaries) {
        return String.join("\n",
                "title: plate",
                "geometry:",
                "  shape: polygon",
                "  outer: {points: " + outer + ", name: rim}",
                holes,
                "mesh: {size: 0.1}",
                "fields:",
                "  - name: u",
                "    diffusivity: 1",
                "    source: 0.5*exp(u)",
                "boundaries:",
                boundaries,
                "");
    }

    private CliRun check(String name, String text) throws IOException {
        Path p = tmp.resolve(name);
        Files.writeString(p, text);
        return CliRun.of("check", p.toString());
    }

    private static void oneLineExit2(CliRun r, String expected) {
        assertEquals(2, r.code(), r.err());
        String err = r.err().trim();
        assertFalse(err.contains("\n"), "one line: " + err);
        assertFalse(err.contains("Exception") || err.contains("\tat "), "no stack trace: " + err);
        assertTrue(err.contains(expected), err);
    }

    @Test
    void selfIntersectingPolygon() throws IOException {
        CliRun r = check("bow.yaml", polygonCase("[[0, 0], [1, 1], [1, 0], [0, 1]]", "", "  rim: {u: {fixed: 0}}"));
        oneLineExit2(r, "self-intersecting");
    }

    @Test
    void holeOutsideTheOuterBoundary() throws IOException {
        CliRun r = check("hole.yaml", polygonCase("[[0, 0], [1, 0], [1, 1], [0, 1]]",
                "  holes: [{points: [[2, 2], [3, 2], [3, 3]], name: hole}]",
                "  rim: {u: {fixed: 0}}\n  hole: {u: insulated}"));
        oneLineExit2(r, "hole 1 lies outside the outer boundary");
    }

    @Test
    void boundaryPartWithoutACondition() throws IOException {
        CliRun r = check("part.yaml", polygonCase("[[0, 0], [1, 0], [1, 1], [0, 1]]",
                "  holes: [{points: [[0.4, 0.4], [0.6, 0.4], [0.6, 0.6]], name: hole}]",
                "  rim: {u: {fixed: 0}}"));
        oneLineExit2(r, "boundary 'hole' has no condition");
    }

    @Test
    void degenerateTriangleInAMeshFileNamesItsLine() throws IOException {
        Files.writeString(tmp.resolve("flat.mesh"), String.join("\n", "# flat", "nodes 4", "0 0", "1 0", "2 0", "0 1",
                "triangles 2", "1 2 4", "1 2 3", "boundary 3", "1 2 b", "2 4 b", "4 1 b", ""));
        String text = String.join("\n", "title: read mesh", "geometry: {shape: mesh-file, file: flat.mesh}",
                "fields:", "  - name: u", "    diffusivity: 1", "boundaries:", "  b: {u: {fixed: 0}}", "");
        CliRun r = check("m.yaml", text);
        oneLineExit2(r, "flat.mesh:9: triangle 2 is degenerate");
    }

    @Test
    void meshFileOutsideTheCaseFolderIsRefused() throws IOException {
        String text = String.join("\n", "title: read mesh", "geometry: {shape: mesh-file, file: ../elsewhere.mesh}",
                "fields:", "  - name: u", "    diffusivity: 1", "boundaries:", "  b: {u: {fixed: 0}}", "");
        oneLineExit2(check("out.yaml", text), "stay inside");
    }

    /** A plate mesh far beyond the JVM's memory is refused before assembly, naming the options. */
    @Test
    void tooFineAGridIsRefusedByTheMemoryEstimate() throws IOException {
        String text = String.join("\n", "title: big plate", "geometry: {shape: rectangle, to: 1, y-to: 1}",
                "mesh: {cells: 10000, cells-y: 10000}", "fields:", "  - name: u", "    diffusivity: 1",
                "boundaries:", "  left: {u: {fixed: 0}}", "  right: {u: {fixed: 0}}", "  bottom: {u: {fixed: 0}}",
                "  top: {u: {fixed: 0}}", "");
        CliRun r = check("big.yaml", text);
        oneLineExit2(r, "--cells");
        assertTrue(r.err().contains("RDSTAB_JAVA_OPTS"), r.err());
    }
}
