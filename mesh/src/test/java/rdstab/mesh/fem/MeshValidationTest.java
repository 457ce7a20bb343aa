package rdstab.mesh.fem;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.junit.jupiter.api.Test;

/** Triangle-mesh validation, generator geometry and quality, polygon validation, the mesh file format. */
class MeshValidationTest {

    private static final double[] X = {0, 1, 1, 0};
    private static final double[] Y = {0, 0, 1, 1};
    private static final int[] TRI = {0, 1, 2, 0, 2, 3};
    private static final int[] EDGES = {0, 1, 1, 2, 2, 3, 3, 0};
    private static final String[] PARTS = {"b", "r", "t", "l"};

    @Test
    void acceptsAValidSquareAndRejectsBrokenOnes() {
        TriangleMesh ok = new TriangleMesh(X, Y, TRI, EDGES, PARTS);
        assertEquals(1.0, ok.totalArea(), 1e-15);
        assertEquals(45.0, ok.minAngleDegrees(), 1e-12); // right isosceles triangles (elementary geometry)
        InvalidMeshException e = assertThrows(InvalidMeshException.class,
                () -> new TriangleMesh(X, Y, new int[] {0, 2, 1, 0, 2, 3}, EDGES, PARTS));
        assertTrue(e.getMessage().contains("inverted") && e.number() == 0, e.getMessage());
        e = assertThrows(InvalidMeshException.class, () -> new TriangleMesh(new double[] {0, 1, 2, 0}, new double[] {0, 0, 0, 1},
                TRI, EDGES, PARTS));
        assertTrue(e.getMessage().contains("degenerate") && e.item() == InvalidMeshException.Item.TRIANGLE, e.getMessage());
        e = assertThrows(InvalidMeshException.class, () -> new TriangleMesh(new double[] {0, 1, 1, 0, 5}, new double[] {0, 0, 1, 1, 5},
                TRI, EDGES, PARTS));
        assertTrue(e.getMessage().contains("node 4 is in no triangle"), e.getMessage());
        e = assertThrows(InvalidMeshException.class, () -> new TriangleMesh(X, Y, TRI, new int[] {0, 1, 1, 2, 2, 3},
                new String[] {"b", "r", "t"}));
        assertTrue(e.getMessage().contains("has no part name"), e.getMessage());
        e = assertThrows(InvalidMeshException.class, () -> new TriangleMesh(X, Y, TRI, new int[] {0, 1, 1, 2, 2, 3, 3, 0, 0, 2},
                new String[] {"b", "r", "t", "l", "x"}));
        assertTrue(e.getMessage().contains("not on the boundary"), e.getMessage());
    }

    @Test
    void generatorsMakeTheRightShapesWithGoodAngles() {
        // areas: π R² for the disk (polygon inscribed in the circle: area error O(h²)), π(Ro² − Ri²), 3/4 for the L
        TriangleMesh disk = MeshGenerators.disk(1.0, 0.05);
        assertEquals(Math.PI, disk.totalArea(), 0.01);
        assertEquals(List.of("edge"), disk.partNames());
        TriangleMesh ann = MeshGenerators.annulus(0.3, 1.0, 0.05);
        assertEquals(Math.PI * (1 - 0.09), ann.totalArea(), 0.01);
        assertEquals(List.of("outer", "inner"), ann.partNames());
        TriangleMesh l = MeshGenerators.lShape(0, 1, 0, 1, 0.05);
        assertEquals(0.75, l.totalArea(), 1e-12);
        TriangleMesh holed = MeshGenerators.polygon(new double[][] {{0, 0}, {2, 0}, {2, 1}, {0, 1}},
                new String[] {"bottom", "right", "top", "left"}, List.<double[][]>of(new double[][] {{0.5, 0.3}, {0.9, 0.3}, {0.9, 0.7}, {0.5, 0.7}}),
                List.<String[]>of(MeshGenerators.names(4, "hole")), 0.05);
        assertEquals(2 - 0.16, holed.totalArea(), 1e-12);
        assertEquals(java.util.Set.of("bottom", "right", "top", "left", "hole"), java.util.Set.copyOf(holed.partNames()));
        assertEquals(5, holed.partNames().size());
        for (TriangleMesh m : List.of(disk, ann, l, holed)) {
            // common practice, no source: angles above 20° keep P1 well conditioned; measured ≥ 29°
            assertTrue(m.minAngleDegrees() > 20, m + " min angle " + m.minAngleDegrees());
            assertTrue(m.maxEdgeLength() < 2.5 * 0.05, m + " longest edge " + m.maxEdgeLength());
        }
    }

    @Test
    void badPolygonsAreRefusedInPlainWords() {
        String[] four = MeshGenerators.names(4, "edge");
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> MeshGenerators.polygon(
                new double[][] {{0, 0}, {1, 1}, {1, 0}, {0, 1}}, four, List.of(), List.of(), 0.1));
        assertTrue(e.getMessage().contains("self-intersecting"), e.getMessage());
        double[][] square = {{0, 0}, {1, 0}, {1, 1}, {0, 1}};
        e = assertThrows(IllegalArgumentException.class, () -> MeshGenerators.polygon(square, four,
                List.<double[][]>of(new double[][] {{2, 2}, {3, 2}, {3, 3}, {2, 3}}), List.<String[]>of(four), 0.1));
        assertTrue(e.getMessage().contains("hole 1 lies outside the outer boundary"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> MeshGenerators.polygon(square, four,
                List.<double[][]>of(new double[][] {{0.5, 0.5}, {1.5, 0.5}, {1.5, 0.8}, {0.5, 0.8}}), List.<String[]>of(four), 0.1));
        assertTrue(e.getMessage().contains("hole 1 crosses"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> MeshGenerators.disk(1, -0.1));
        assertTrue(e.getMessage().contains("size"), e.getMessage());
    }

    @Test
    void meshFileRoundTripAndLineNumberedErrors() {
        TriangleMesh m = MeshGenerators.annulus(0.5, 1, 0.2);
        TriangleMesh back = MeshFileReader.parse(MeshFileReader.write(m));
        assertEquals(m.nodeCount(), back.nodeCount());
        assertEquals(m.totalArea(), back.totalArea(), 1e-12);
        assertEquals(m.partNames(), back.partNames());
        String degenerate = String.join("\n", "# a square with one flat triangle", "nodes 4", "0 0", "1 0", "2 0", "0 1",
                "triangles 2", "1 2 4", "1 2 3", "boundary 3", "1 2 b", "2 4 d", "4 1 l", "");
        MeshFileReader.MeshFileException e = assertThrows(MeshFileReader.MeshFileException.class,
                () -> MeshFileReader.parse(degenerate));
        assertEquals(9, e.line(), e.getMessage());
        assertTrue(e.getMessage().contains("triangle 2 is degenerate"), e.getMessage());
        e = assertThrows(MeshFileReader.MeshFileException.class, () -> MeshFileReader.parse("nodes 2\n0 0\n1 x\n"));
        assertEquals(3, e.line());
        e = assertThrows(MeshFileReader.MeshFileException.class,
                () -> MeshFileReader.parse("nodes 3\n0 0\n1 0\n0 1\ntriangles 1\n1 2 7\n"));
        assertTrue(e.getMessage().startsWith("line 6: node number 7 is out of range"), e.getMessage());
    }
}
