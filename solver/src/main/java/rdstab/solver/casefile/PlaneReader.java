package rdstab.solver.casefile;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import rdstab.mesh.fem.MeshFileReader;
import rdstab.mesh.fem.TriangleMesh;
import rdstab.solver.error.InputException;
import rdstab.solver.model.PlaneSpec;

/**
 * Reads the outline of a polygon shape and the mesh file of a mesh-file shape (the geometry keys
 * {@code outer}, {@code holes} and {@code file}; see cases/README.md).
 *
 * <p>A mesh file must lie inside the case file's folder (or below it): absolute paths and paths
 * that leave the folder (through "..", or a link that points outside) are refused, so a case file
 * cannot make the tool read arbitrary files.
 */
final class PlaneReader {

    private static final Set<String> RING = Set.of("points", "name", "parts");

    private PlaneReader() {
    }

    /** The outer ring and holes of a polygon. */
    static PlaneSpec polygon(CaseNode geo, Map<String, CaseNode> g) {
        CaseNode outer = g.get("outer");
        if (outer == null) {
            throw geo.error("a polygon needs 'outer: {points: [[x, y], ...], name: PART}'");
        }
        List<PlaneSpec.Ring> rings = new ArrayList<>();
        rings.add(ring(outer));
        if (g.containsKey("holes")) {
            for (CaseNode h : g.get("holes").items()) {
                rings.add(ring(h));
            }
        }
        return new PlaneSpec(rings, null, geo.place());
    }

    private static PlaneSpec.Ring ring(CaseNode node) {
        Map<String, CaseNode> e = node.entries(RING);
        CaseNode pts = e.get("points");
        if (pts == null) {
            throw node.error("missing key 'points' (a list of [x, y] corners)");
        }
        List<CaseNode> items = pts.items();
        if (items.size() < 3) {
            throw pts.error("a ring needs at least 3 corner points, found " + items.size());
        }
        double[][] p = new double[items.size()][];
        for (int i = 0; i < p.length; i++) {
            List<CaseNode> xy = items.get(i).items();
            if (xy.size() != 2) {
                throw items.get(i).error("a corner is [x, y], found " + xy.size() + " numbers");
            }
            p[i] = new double[] {xy.get(0).number(), xy.get(1).number()};
        }
        String[] parts = new String[p.length];
        if (e.containsKey("name") == e.containsKey("parts")) {
            throw node.error("give either 'name: PART' (one part for the whole ring) or 'parts: [...]' (one name per side)");
        }
        if (e.containsKey("name")) {
            java.util.Arrays.fill(parts, partName(e.get("name")));
        } else {
            List<CaseNode> names = e.get("parts").items();
            if (names.size() != p.length) {
                throw e.get("parts").error("one part name per side is needed (" + p.length + " sides), found " + names.size());
            }
            for (int i = 0; i < p.length; i++) {
                parts[i] = partName(names.get(i));
            }
        }
        return new PlaneSpec.Ring(p, parts);
    }

    private static String partName(CaseNode n) {
        String s = n.text().trim();
        if (!s.matches("[A-Za-z_][A-Za-z0-9_-]*")) {
            throw n.error("part name '" + s + "' must start with a letter or '_' and use only letters, digits, '_' and '-'");
        }
        return s;
    }

    /** Part names of a polygon, in order of first appearance. */
    static List<String> parts(PlaneSpec plane) {
        Set<String> out = new LinkedHashSet<>();
        for (PlaneSpec.Ring r : plane.rings()) {
            out.addAll(List.of(r.parts()));
        }
        return List.copyOf(out);
    }

    /** Resolves the mesh file inside the case file's folder. */
    static PlaneSpec meshFile(CaseNode geo, Map<String, CaseNode> g, String caseSource) {
        CaseNode f = g.get("file");
        if (f == null) {
            throw geo.error("a mesh-file shape needs 'file: NAME' (a mesh file in the case file's folder)");
        }
        String name = f.text().trim();
        Path base = Path.of(caseSource).toAbsolutePath().normalize().getParent();
        Path rel;
        try {
            rel = Path.of(name);
        } catch (java.nio.file.InvalidPathException e) {
            throw f.error("not a valid file name: '" + name + "'");
        }
        Path file = base.resolve(rel).normalize();
        if (rel.isAbsolute() || !file.startsWith(base)) {
            throw f.error("the mesh file must be given relative to the case file's folder and stay inside it; found '"
                    + name + "'");
        }
        try {
            if (Files.exists(file) && !file.toRealPath().startsWith(base.toRealPath())) {
                throw f.error("the mesh file '" + name + "' is a link that leads outside the case file's folder");
            }
        } catch (IOException e) {
            throw new UncheckedIOException("cannot resolve " + file + ": " + e.getMessage(), e);
        }
        return new PlaneSpec(List.of(), file, f.place());
    }

    /** Reads and validates a mesh file; errors name the mesh file and its line. */
    static TriangleMesh readMesh(Path file) {
        try (BufferedReader r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            return MeshFileReader.read(r);
        } catch (NoSuchFileException e) {
            throw new InputException(file.toString(), null, "no such mesh file");
        } catch (MeshFileReader.MeshFileException e) {
            throw new InputException(file.toString(), e.line() > 0 ? String.valueOf(e.line()) : null, e.problem());
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + file + ": " + e.getMessage(), e);
        }
    }
}
