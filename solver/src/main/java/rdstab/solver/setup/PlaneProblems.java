package rdstab.solver.setup;

import java.util.ArrayDeque;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import rdstab.mesh.assembly.Discretization;
import rdstab.mesh.assembly.FiniteDifference2D;
import rdstab.mesh.assembly.PointKernel;
import rdstab.mesh.boundary.BoundaryCondition;
import rdstab.mesh.fem.MeshGenerators;
import rdstab.mesh.fem.P1Triangles;
import rdstab.mesh.fem.TriangleMesh;
import rdstab.mesh.grid.Grid1D;
import rdstab.mesh.grid.RectangleGrid;
import rdstab.solver.casefile.CaseReader;
import rdstab.solver.error.InputException;
import rdstab.solver.model.Case;
import rdstab.solver.model.FieldSpec;
import rdstab.solver.model.MeshSpec;
import rdstab.solver.model.PlaneSpec;
import rdstab.solver.model.Shape;

/**
 * The 2D half of {@link ProblemBuilder}: a rectangle becomes a {@link FiniteDifference2D} on a
 * {@link RectangleGrid}; the triangle shapes become {@link P1Triangles} on a generated or read
 * {@link TriangleMesh}. Before anything is assembled the {@link MemoryEstimate} is checked.
 *
 * <p>Rectangle stretching: {@code toward: left} or {@code right} clusters the x nodes toward that
 * edge; {@code both} clusters toward all four edges (both directions, both ends).
 */
final class PlaneProblems {

    private PlaneProblems() {
    }

    static Problem build(Case c) {
        FormulaKernel kernel = new FormulaKernel(c);
        Discretization full;
        Discretization transport;
        try {
            if (c.shape() == Shape.RECTANGLE) {
                RectangleGrid grid = grid(c);
                long nodes = grid.nodeCount();
                int nf = c.fields().size();
                MemoryEstimate.banded(nodes * nf, nf, Math.min(grid.nx(), grid.ny()) + 1L, 5L * nf * nf * nodes)
                        .require(c.source(), "--cells N, or mesh: cells / cells-y");
                BoundaryCondition[][] e = new BoundaryCondition[4][];
                String[] names = {"left", "right", "bottom", "top"};
                for (int k = 0; k < 4; k++) {
                    e[k] = conditions(c, names[k]);
                }
                full = new FiniteDifference2D(grid, kernel, e[0], e[1], e[2], e[3]);
                transport = new FiniteDifference2D(grid, new NoSourceKernel(kernel.copy()), e[0], e[1], e[2], e[3]);
            } else {
                TriangleMesh mesh = mesh(c);
                int nf = c.fields().size();
                MemoryEstimate.banded((long) mesh.nodeCount() * nf, nf, levelWidth(mesh), 7L * nf * nf * mesh.nodeCount())
                        .require(c.source(), c.shape() == Shape.MESH_FILE ? "a coarser mesh file"
                                : "a larger mesh: size, or --cells N");
                Map<String, BoundaryCondition[]> bc = new LinkedHashMap<>();
                for (String part : c.boundaries().keySet()) {
                    bc.put(part, conditions(c, part));
                }
                full = new P1Triangles(mesh, kernel, bc);
                transport = new P1Triangles(mesh, new NoSourceKernel(kernel.copy()), bc);
            }
        } catch (IllegalArgumentException e) {
            if (e instanceof InputException) {
                throw e;
            }
            throw new InputException(c.source(), "geometry", e.getMessage());
        }
        return new Problem(c, full, transport, ProblemBuilder.initialGuess(c, full));
    }

    private static BoundaryCondition[] conditions(Case c, String part) {
        List<FieldSpec> fields = c.fields();
        BoundaryCondition[] out = new BoundaryCondition[fields.size()];
        for (int f = 0; f < out.length; f++) {
            out[f] = ProblemBuilder.condition(c, part, fields.get(f));
        }
        return out;
    }

    /** The rectangle grid of a case (see the class comment for stretching). */
    static RectangleGrid grid(Case c) {
        MeshSpec m = c.mesh();
        double a = c.fromValue();
        double b = c.toValue();
        double lo = c.fromY().value(c.parameters());
        double hi = c.toY().value(c.parameters());
        int ny = m.cellsY() > 0 ? m.cellsY() : m.cells();
        if ((long) (m.cells() + 1) * (ny + 1) > Integer.MAX_VALUE / 8) {
            throw new InputException(c.source(), "mesh", m.cells() + " x " + ny + " cells are too many; use fewer (--cells N)");
        }
        if (m.stretch() <= 0 || "none".equals(m.stretchTo())) {
            return RectangleGrid.uniform(a, b, m.cells(), lo, hi, ny);
        }
        return switch (m.stretchTo()) {
            case "left" -> RectangleGrid.tanh(a, b, m.cells(), m.stretch(), Grid1D.Cluster.LEFT, lo, hi, ny, 0, null);
            case "right" -> RectangleGrid.tanh(a, b, m.cells(), m.stretch(), Grid1D.Cluster.RIGHT, lo, hi, ny, 0, null);
            default -> RectangleGrid.tanh(a, b, m.cells(), m.stretch(), Grid1D.Cluster.BOTH, lo, hi, ny, m.stretch(),
                    Grid1D.Cluster.BOTH);
        };
    }

    /** The triangle mesh of a case: generated to the target size, or read from the mesh file. */
    static TriangleMesh mesh(Case c) {
        Map<String, Double> p = c.parameters();
        PlaneSpec plane = c.plane();
        if (c.shape() == Shape.MESH_FILE) {
            return CaseReader.readMeshFile(plane.meshFile());
        }
        double extent = switch (c.shape()) {
            case DISK, ANNULUS -> 2 * c.toValue();
            case L_SHAPE -> Math.max(c.toValue() - c.fromValue(), c.toY().value(p) - c.fromY().value(p));
            default -> polygonExtent(plane);
        };
        double h = c.mesh().size() > 0 ? c.mesh().size() : extent / c.mesh().cells();
        return switch (c.shape()) {
            case DISK -> MeshGenerators.disk(c.toValue(), h);
            case ANNULUS -> MeshGenerators.annulus(c.fromValue(), c.toValue(), h);
            case L_SHAPE -> MeshGenerators.lShape(c.fromValue(), c.toValue(), c.fromY().value(p), c.toY().value(p), h);
            default -> {
                List<PlaneSpec.Ring> rings = plane.rings();
                List<double[][]> holes = new java.util.ArrayList<>();
                List<String[]> holeParts = new java.util.ArrayList<>();
                for (PlaneSpec.Ring r : rings.subList(1, rings.size())) {
                    holes.add(r.points());
                    holeParts.add(r.parts());
                }
                yield MeshGenerators.polygon(rings.get(0).points(), rings.get(0).parts(), holes, holeParts, h);
            }
        };
    }

    private static double polygonExtent(PlaneSpec plane) {
        double[][] p = plane.rings().get(0).points();
        double minX = Double.POSITIVE_INFINITY;
        double maxX = Double.NEGATIVE_INFINITY;
        double minY = Double.POSITIVE_INFINITY;
        double maxY = Double.NEGATIVE_INFINITY;
        for (double[] q : p) {
            minX = Math.min(minX, q[0]);
            maxX = Math.max(maxX, q[0]);
            minY = Math.min(minY, q[1]);
            maxY = Math.max(maxY, q[1]);
        }
        return Math.max(maxX - minX, maxY - minY);
    }

    /**
     * Widest level of a breadth-first sweep from a pseudo-peripheral node (a sweep from node 0, then
     * from the last node it reached): the envelope width a banded ordering achieves, in nodes.
     */
    static long levelWidth(TriangleMesh mesh) {
        int[][] g = mesh.nodeGraph();
        int[] far = {0};
        sweep(g, 0, far);
        return sweep(g, far[0], far);
    }

    private static long sweep(int[][] g, int start, int[] last) {
        int n = g[0].length - 1;
        int[] level = new int[n];
        java.util.Arrays.fill(level, -1);
        int[] count = new int[n + 1];
        ArrayDeque<Integer> q = new ArrayDeque<>();
        level[start] = 0;
        q.add(start);
        int widest = 0;
        while (!q.isEmpty()) {
            int v = q.poll();
            last[0] = v;
            widest = Math.max(widest, ++count[level[v]]);
            for (int p = g[0][v]; p < g[0][v + 1]; p++) {
                int w = g[1][p];
                if (level[w] < 0) {
                    level[w] = level[v] + 1;
                    q.add(w);
                }
            }
        }
        return widest;
    }
}
