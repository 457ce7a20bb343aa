package rdstab.mesh.fem;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.locationtech.jts.algorithm.Orientation;
import org.locationtech.jts.algorithm.locate.IndexedPointInAreaLocator;
import org.locationtech.jts.geom.Coordinate;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.GeometryFactory;
import org.locationtech.jts.geom.LineString;
import org.locationtech.jts.geom.LinearRing;
import org.locationtech.jts.geom.Location;
import org.locationtech.jts.geom.Polygon;
import org.locationtech.jts.operation.distance.IndexedFacetDistance;
import org.locationtech.jts.triangulate.ConformingDelaunayTriangulationBuilder;
import org.locationtech.jts.triangulate.DelaunayTriangulationBuilder;

/**
 * Meshes a polygon with holes to a target edge length h.
 *
 * <h2>Method</h2>
 * <ol>
 *   <li>Validation (plain-word {@link IllegalArgumentException}s): at least 3 distinct finite points
 *   per ring; a ring that crosses itself ("self-intersecting"); a hole that crosses the outer
 *   boundary; a hole outside the outer boundary; two holes that overlap.</li>
 *   <li>Boundary refinement: every side is split into ⌈ℓ/h⌉ equal pieces.</li>
 *   <li>Interior seeding: an equilateral lattice of spacing h, keeping the points inside the polygon
 *   at distance ≥ 0.55 h from the boundary (so no sliver forms against a boundary piece).</li>
 *   <li>Triangulation: JTS's Delaunay triangulation of all points; triangles whose centroid lies
 *   outside the polygon (in a hole or in the convex hull outside) are dropped. When the remaining
 *   boundary is not exactly the set of boundary pieces (a piece was not a Delaunay edge), the
 *   triangulation is redone with JTS's conforming Delaunay triangulation, the pieces as
 *   constraints (slower; it may add points on the pieces).</li>
 *   <li>Tagging: each boundary edge takes the part name of the side it lies on.</li>
 *   <li>Quality check: the smallest angle must be at least {@link #MIN_ANGLE_DEGREES}; otherwise the
 *   polygon has a sharper corner or a narrower passage than the size resolves, and the message says
 *   so.</li>
 * </ol>
 */
final class PolygonMesher {

    /** Smallest angle accepted in a generated mesh (degrees). */
    static final double MIN_ANGLE_DEGREES = 10.0;

    private static final GeometryFactory GF = new GeometryFactory();

    /** A closed loop of boundary points with the part name of each side (side i: point i to point i+1). */
    record BoundaryLoop(double[][] points, String[] parts) {
    }

    private PolygonMesher() {
    }

    static TriangleMesh polygon(double[][] outer, String[] outerParts, List<double[][]> holes, List<String[]> holeParts,
                                double size) {
        if (holes == null || holeParts == null || holes.size() != holeParts.size()) {
            throw new IllegalArgumentException("every hole needs its list of part names");
        }
        checkRing(outer, outerParts, "outer boundary");
        for (int i = 0; i < holes.size(); i++) {
            checkRing(holes.get(i), holeParts.get(i), "hole " + (i + 1));
        }
        LinearRing shell = ring(outer);
        List<LinearRing> holeRings = new ArrayList<>();
        for (double[][] h : holes) {
            holeRings.add(ring(h));
        }
        validate(shell, holeRings);
        Polygon poly = GF.createPolygon(shell, holeRings.toArray(new LinearRing[0]));
        double extent = Math.max(poly.getEnvelopeInternal().getWidth(), poly.getEnvelopeInternal().getHeight());
        MeshGenerators.checkSize(size, extent);
        List<BoundaryLoop> loops = new ArrayList<>();
        loops.add(refine(outer, outerParts, size));
        for (int i = 0; i < holes.size(); i++) {
            loops.add(refine(holes.get(i), holeParts.get(i), size));
        }
        return mesh(loops, lattice(poly, size), 1e-9 * extent);
    }

    private static void checkRing(double[][] pts, String[] parts, String what) {
        if (pts == null || pts.length < 3) {
            throw new IllegalArgumentException(what + " needs at least 3 points, got " + (pts == null ? 0 : pts.length));
        }
        if (parts == null || parts.length != pts.length) {
            throw new IllegalArgumentException(what + " needs one part name per side (" + pts.length + "), got "
                    + (parts == null ? 0 : parts.length));
        }
        for (int i = 0; i < pts.length; i++) {
            if (pts[i] == null || pts[i].length != 2 || !Double.isFinite(pts[i][0]) || !Double.isFinite(pts[i][1])) {
                throw new IllegalArgumentException(what + ": point " + (i + 1) + " must be two finite numbers [x, y]");
            }
            double[] q = pts[(i + 1) % pts.length];
            if (pts[i][0] == q[0] && pts[i][1] == q[1]) {
                throw new IllegalArgumentException(what + ": points " + (i + 1) + " and " + ((i + 1) % pts.length + 1)
                        + " are the same; list each corner once (the ring closes by itself)");
            }
            if (parts[i] == null || parts[i].isBlank()) {
                throw new IllegalArgumentException(what + ": side " + (i + 1) + " has no part name");
            }
        }
    }

    private static LinearRing ring(double[][] pts) {
        Coordinate[] c = new Coordinate[pts.length + 1];
        for (int i = 0; i < pts.length; i++) {
            c[i] = new Coordinate(pts[i][0], pts[i][1]);
        }
        c[pts.length] = c[0].copy();
        return GF.createLinearRing(c);
    }

    private static void validate(LinearRing shell, List<LinearRing> holes) {
        if (!shell.isSimple()) {
            throw new IllegalArgumentException("the outer boundary is a self-intersecting polygon (its sides cross); "
                    + "list the corners in order around the shape");
        }
        Polygon outerArea = GF.createPolygon(shell);
        for (int i = 0; i < holes.size(); i++) {
            LinearRing h = holes.get(i);
            if (!h.isSimple()) {
                throw new IllegalArgumentException("hole " + (i + 1) + " is a self-intersecting polygon (its sides cross)");
            }
            if (h.intersects(shell)) {
                throw new IllegalArgumentException("hole " + (i + 1) + " crosses or touches the outer boundary; a hole "
                        + "must lie strictly inside the outer boundary");
            }
            if (!outerArea.contains(h)) {
                throw new IllegalArgumentException("hole " + (i + 1) + " lies outside the outer boundary");
            }
            Polygon hi = GF.createPolygon(h);
            for (int j = 0; j < i; j++) {
                if (hi.intersects(GF.createPolygon(holes.get(j)))) {
                    throw new IllegalArgumentException("holes " + (j + 1) + " and " + (i + 1) + " overlap or touch");
                }
            }
        }
    }

    /** Splits every side into ⌈ℓ/h⌉ equal pieces. */
    private static BoundaryLoop refine(double[][] pts, String[] parts, double h) {
        List<double[]> out = new ArrayList<>();
        List<String> names = new ArrayList<>();
        for (int i = 0; i < pts.length; i++) {
            double[] p = pts[i];
            double[] q = pts[(i + 1) % pts.length];
            int m = Math.max(1, (int) Math.ceil(Math.hypot(q[0] - p[0], q[1] - p[1]) / h - 1e-9));
            for (int k = 0; k < m; k++) {
                double s = (double) k / m;
                out.add(new double[] {p[0] + s * (q[0] - p[0]), p[1] + s * (q[1] - p[1])});
                names.add(parts[i]);
            }
        }
        return new BoundaryLoop(out.toArray(new double[0][]), names.toArray(new String[0]));
    }

    /** Equilateral lattice points of spacing h inside the polygon, at least 0.55 h from its boundary. */
    private static List<double[]> lattice(Polygon poly, double h) {
        IndexedPointInAreaLocator inside = new IndexedPointInAreaLocator(poly);
        IndexedFacetDistance dist = new IndexedFacetDistance(poly.getBoundary());
        org.locationtech.jts.geom.Envelope env = poly.getEnvelopeInternal();
        double dy = h * Math.sqrt(3) / 2;
        List<double[]> out = new ArrayList<>();
        int row = 0;
        for (double y = env.getMinY() + dy / 2; y < env.getMaxY(); y += dy, row++) {
            for (double x = env.getMinX() + (row % 2 == 0 ? h / 2 : h); x < env.getMaxX(); x += h) {
                Coordinate c = new Coordinate(x, y);
                if (inside.locate(c) == Location.INTERIOR && dist.distance(GF.createPoint(c)) >= 0.55 * h) {
                    out.add(new double[] {x, y});
                }
            }
        }
        return out;
    }

    /**
     * Triangulates boundary loops (the first is the outer boundary, the others holes) and interior
     * points; tags the boundary edges; checks the quality.
     */
    static TriangleMesh mesh(List<BoundaryLoop> loops, List<double[]> interior, double tol) {
        List<double[]> nodes = new ArrayList<>();
        Map<Coordinate, Integer> id = new HashMap<>();
        Map<Long, String> sidePart = new HashMap<>();
        List<Coordinate> all = new ArrayList<>();
        List<LineString> constraints = new ArrayList<>();
        LinearRing shell = null;
        List<LinearRing> holes = new ArrayList<>();
        for (BoundaryLoop loop : loops) {
            double[][] p = loop.points();
            int first = nodes.size();
            Coordinate[] ringC = new Coordinate[p.length + 1];
            for (int i = 0; i < p.length; i++) {
                ringC[i] = new Coordinate(p[i][0], p[i][1]);
                add(ringC[i], nodes, id, all);
            }
            ringC[p.length] = ringC[0].copy();
            for (int i = 0; i < p.length; i++) {
                int a = first + i;
                int b = first + (i + 1) % p.length;
                sidePart.put(key(a, b), loop.parts()[i]);
                constraints.add(GF.createLineString(new Coordinate[] {ringC[i], ringC[i + 1]}));
            }
            LinearRing r = GF.createLinearRing(ringC);
            if (shell == null) {
                shell = r;
            } else {
                holes.add(r);
            }
        }
        for (double[] q : interior) {
            add(new Coordinate(q[0], q[1]), nodes, id, all);
        }
        Polygon domain = GF.createPolygon(shell, holes.toArray(new LinearRing[0]));
        DelaunayTriangulationBuilder plain = new DelaunayTriangulationBuilder();
        plain.setSites(GF.createMultiPointFromCoords(all.toArray(new Coordinate[0])));
        plain.setTolerance(tol);
        List<int[]> kept = keep(plain.getTriangles(GF), domain, nodes, id, all);
        if (!conforms(kept, sidePart)) {
            ConformingDelaunayTriangulationBuilder b = new ConformingDelaunayTriangulationBuilder();
            b.setSites(GF.createMultiPointFromCoords(all.toArray(new Coordinate[0])));
            b.setConstraints(GF.createMultiLineString(constraints.toArray(new LineString[0])));
            b.setTolerance(tol);
            kept = keep(b.getTriangles(GF), domain, nodes, id, all);
        }
        return assemble(nodes, kept, sidePart, loops);
    }

    /** Triangles whose centroid is inside the domain, as counter-clockwise node triples. */
    private static List<int[]> keep(Geometry tris, Polygon domain, List<double[]> nodes, Map<Coordinate, Integer> id,
                                    List<Coordinate> all) {
        IndexedPointInAreaLocator inside = new IndexedPointInAreaLocator(domain);
        List<int[]> kept = new ArrayList<>();
        for (int t = 0; t < tris.getNumGeometries(); t++) {
            Coordinate[] c = tris.getGeometryN(t).getCoordinates();
            Coordinate centroid = new Coordinate((c[0].x + c[1].x + c[2].x) / 3, (c[0].y + c[1].y + c[2].y) / 3);
            if (inside.locate(centroid) != Location.INTERIOR) {
                continue;
            }
            int[] v = {add(c[0], nodes, id, all), add(c[1], nodes, id, all), add(c[2], nodes, id, all)};
            if (!Orientation.isCCW(new Coordinate[] {c[0], c[1], c[2], c[0]})) {
                int s = v[1];
                v[1] = v[2];
                v[2] = s;
            }
            kept.add(v);
        }
        return kept;
    }

    /** True when the edges of exactly one kept triangle are exactly the boundary pieces. */
    private static boolean conforms(List<int[]> kept, Map<Long, String> sidePart) {
        Map<Long, Integer> use = new HashMap<>();
        for (int[] t : kept) {
            for (int k = 0; k < 3; k++) {
                use.merge(key(t[k], t[(k + 1) % 3]), 1, Integer::sum);
            }
        }
        int boundary = 0;
        for (Map.Entry<Long, Integer> e : use.entrySet()) {
            if (e.getValue() == 1) {
                if (!sidePart.containsKey(e.getKey())) {
                    return false;
                }
                boundary++;
            }
        }
        return boundary == sidePart.size();
    }

    private static int add(Coordinate c, List<double[]> nodes, Map<Coordinate, Integer> id, List<Coordinate> all) {
        Integer k = id.get(c);
        if (k != null) {
            return k;
        }
        id.put(new Coordinate(c.x, c.y), nodes.size());
        nodes.add(new double[] {c.x, c.y});
        all.add(new Coordinate(c.x, c.y));
        return nodes.size() - 1;
    }

    private static long key(int a, int b) {
        return ((long) Math.min(a, b) << 32) | Math.max(a, b);
    }

    private static TriangleMesh assemble(List<double[]> nodes, List<int[]> tris, Map<Long, String> sidePart,
                                         List<BoundaryLoop> loops) {
        // drop nodes in no kept triangle (none expected; guards against points outside the domain)
        int[] renum = new int[nodes.size()];
        java.util.Arrays.fill(renum, -1);
        int n = 0;
        for (int[] t : tris) {
            for (int v : t) {
                if (renum[v] < 0) {
                    renum[v] = n++;
                }
            }
        }
        double[] x = new double[n];
        double[] y = new double[n];
        for (int i = 0; i < renum.length; i++) {
            if (renum[i] >= 0) {
                x[renum[i]] = nodes.get(i)[0];
                y[renum[i]] = nodes.get(i)[1];
            }
        }
        int[] tri = new int[3 * tris.size()];
        Map<Long, Integer> edgeUse = new HashMap<>();
        for (int t = 0; t < tris.size(); t++) {
            for (int k = 0; k < 3; k++) {
                tri[3 * t + k] = renum[tris.get(t)[k]];
                edgeUse.merge(key(tris.get(t)[k], tris.get(t)[(k + 1) % 3]), 1, Integer::sum);
            }
        }
        List<Integer> ends = new ArrayList<>();
        List<String> parts = new ArrayList<>();
        for (Map.Entry<Long, Integer> e : edgeUse.entrySet()) {
            if (e.getValue() != 1) {
                continue;
            }
            int a = (int) (e.getKey() >>> 32);
            int b = (int) (long) e.getKey();
            String part = sidePart.get(e.getKey());
            if (part == null) {
                part = nearestSide(nodes.get(a), nodes.get(b), loops);
            }
            ends.add(renum[a]);
            ends.add(renum[b]);
            parts.add(part);
        }
        int[] edges = ends.stream().mapToInt(Integer::intValue).toArray();
        TriangleMesh mesh = new TriangleMesh(x, y, tri, edges, parts.toArray(new String[0]));
        double angle = mesh.minAngleDegrees();
        if (angle < MIN_ANGLE_DEGREES) {
            throw new IllegalArgumentException(String.format(Locale.ROOT, "the generated mesh has a smallest angle of %.1f "
                    + "degrees (at least %.0f needed): the shape has a corner sharper than that or a passage narrower than "
                    + "the element size; choose a smaller size or widen the shape", angle, MIN_ANGLE_DEGREES));
        }
        return mesh;
    }

    /** Part name of the loop side nearest to the midpoint of (a, b) (for edges split by the triangulator). */
    private static String nearestSide(double[] a, double[] b, List<BoundaryLoop> loops) {
        double mx = 0.5 * (a[0] + b[0]);
        double my = 0.5 * (a[1] + b[1]);
        double best = Double.POSITIVE_INFINITY;
        String name = null;
        for (BoundaryLoop loop : loops) {
            double[][] p = loop.points();
            for (int i = 0; i < p.length; i++) {
                double[] q = p[(i + 1) % p.length];
                double d = segmentDistance(mx, my, p[i], q);
                if (d < best) {
                    best = d;
                    name = loop.parts()[i];
                }
            }
        }
        return name;
    }

    private static double segmentDistance(double x, double y, double[] p, double[] q) {
        double ux = q[0] - p[0];
        double uy = q[1] - p[1];
        double t = ((x - p[0]) * ux + (y - p[1]) * uy) / (ux * ux + uy * uy);
        t = Math.max(0, Math.min(1, t));
        return Math.hypot(x - p[0] - t * ux, y - p[1] - t * uy);
    }
}
