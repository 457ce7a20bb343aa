package rdstab.solver.casefile;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.snakeyaml.engine.v2.api.LoadSettings;
import org.snakeyaml.engine.v2.api.lowlevel.Compose;
import org.snakeyaml.engine.v2.exceptions.MarkedYamlEngineException;
import org.snakeyaml.engine.v2.exceptions.YamlEngineException;
import org.snakeyaml.engine.v2.nodes.Node;
import rdstab.solver.error.InputException;
import rdstab.solver.formula.Formula;
import rdstab.solver.formula.FormulaException;
import rdstab.solver.model.AnalysisSpec;
import rdstab.solver.model.BoundarySpec;
import rdstab.solver.model.Case;
import rdstab.solver.model.FieldSpec;
import rdstab.solver.model.MeshSpec;
import rdstab.solver.model.PhysicalInputs;
import rdstab.solver.model.PlaneSpec;
import rdstab.solver.model.Quantity;
import rdstab.solver.model.Shape;
import rdstab.solver.units.QuantityParser;

/**
 * Reads a YAML case file into a validated {@link Case}. The format is documented in
 * {@code cases/README.md}; every error is an {@link InputException} naming the file, line:column,
 * key path and what was expected.
 *
 * <p>Safety limits: files larger than {@link #MAX_FILE_BYTES} are refused before parsing; YAML
 * aliases are limited to {@link #MAX_ALIASES} (defeats alias-expansion attacks); duplicate keys and
 * recursive keys are refused; no tags are constructed into objects, nothing is included, no
 * environment variables are expanded.
 */
public final class CaseReader {

    /** Largest case file accepted, in bytes. */
    public static final int MAX_FILE_BYTES = 1 << 20;
    /** Largest number of YAML aliases accepted. */
    public static final int MAX_ALIASES = 20;
    /** Largest cell count per direction. */
    public static final int MAX_CELLS = 4_000_000;

    private static final Set<String> TOP = new java.util.LinkedHashSet<>(List.of("title", "about", "geometry", "mesh",
            "parameters", "derived", "self-heating", "fields", "boundaries", "analysis"));
    private static final Set<String> GEOMETRY = Set.of("shape", "from", "to", "y-from", "y-to", "radius", "inner-radius",
            "outer-radius", "outer", "holes", "file");
    private static final Set<String> MESH = Set.of("cells", "cells-y", "stretch", "size");
    private static final Set<String> STRETCH = Set.of("toward", "strength");
    private static final Set<String> FIELD = Set.of("name", "unit", "diffusivity", "source", "initial", "drift");
    private static final Set<String> ANALYSIS = Set.of("modes", "shift", "newton-tolerance", "newton-max-steps",
            "eigen-tolerance", "marginal-band", "residual-limit", "drift-scheme", "energy-weights", "amplification-budget");
    private static final Set<String> RESERVED = Set.of("x", "y", "r", "pi", "exp", "log", "sqrt", "sin", "cos",
            "tan", "tanh", "abs", "min", "max", "pow", "sign");

    private CaseReader() {
    }

    /** Reads a case file. */
    public static Case read(Path file) {
        String name = file.toString();
        byte[] bytes;
        try {
            long size = Files.size(file);
            if (size > MAX_FILE_BYTES) {
                throw new InputException(name, null, "case file is " + size + " bytes; the limit is " + MAX_FILE_BYTES);
            }
            bytes = Files.readAllBytes(file);
        } catch (java.nio.file.NoSuchFileException e) {
            throw new InputException(name, null, "no such case file");
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + name + ": " + e.getMessage(), e);
        }
        return parse(new String(bytes, StandardCharsets.UTF_8), name);
    }

    /** Parses case text; {@code source} names it in messages. */
    public static Case parse(String text, String source) {
        if (text.length() > MAX_FILE_BYTES) {
            throw new InputException(source, null, "case text is " + text.length() + " characters; the limit is " + MAX_FILE_BYTES);
        }
        LoadSettings settings = LoadSettings.builder().setLabel(source).setAllowDuplicateKeys(false)
                .setAllowRecursiveKeys(false).setMaxAliasesForCollections(MAX_ALIASES)
                .setCodePointLimit(MAX_FILE_BYTES).setUseMarks(true).build();
        Optional<Node> root;
        try {
            root = new Compose(settings).composeString(text);
        } catch (MarkedYamlEngineException e) {
            String at = e.getProblemMark().map(m -> (m.getLine() + 1) + ":" + (m.getColumn() + 1)).orElse(null);
            throw new InputException(source, at, "not valid YAML: " + oneLine(e.getProblem()));
        } catch (YamlEngineException e) {
            throw new InputException(source, firstSpecialCharacter(text), "not valid YAML: " + oneLine(e.getMessage()));
        }
        if (root.isEmpty()) {
            throw new InputException(source, "1:1", "the case file is empty; expected keys " + String.join(", ", TOP));
        }
        return new CaseReader.Reading(new CaseNode(root.get(), "", source)).build();
    }

    /** line:column of the first character YAML does not allow (control characters), or 1:1. */
    static String firstSpecialCharacter(String text) {
        int line = 1;
        int col = 1;
        for (int i = 0; i < text.length(); i++) {
            char ch = text.charAt(i);
            if (ch == '\n') {
                line++;
                col = 1;
                continue;
            }
            if ((ch < 0x20 && ch != '\t' && ch != '\r') || ch == 0x7f || ch == 0xFFFE || ch == 0xFFFF) {
                return line + ":" + col + " (character U+" + String.format("%04X", (int) ch) + ")";
            }
            col++;
        }
        return "1:1";
    }

    private static String oneLine(String s) {
        return s == null ? "" : s.replaceAll("\\s+", " ").trim();
    }

    /** State of one reading. */
    private static final class Reading {
        private final CaseNode root;
        private final String source;
        private final Map<String, Double> parameters = new LinkedHashMap<>();
        private final Map<String, javax.measure.Unit<?>> units = new LinkedHashMap<>();
        private final Map<String, Formula> derived = new LinkedHashMap<>();

        Reading(CaseNode root) {
            this.root = root;
            this.source = root.source();
        }

        Case build() {
            Map<String, CaseNode> top = root.entries(TOP);
            String title = top.containsKey("title") ? top.get("title").text() : source;
            String about = top.containsKey("about") ? top.get("about").text() : "";
            if (top.containsKey("parameters")) {
                readParameters(top.get("parameters"));
            }
            CaseNode geo = require(root, top, "geometry");
            Map<String, CaseNode> g = geo.entries(GEOMETRY);
            CaseNode shapeNode = require(geo, g, "shape");
            Shape shape = Shape.byWord(shapeNode.text().trim());
            if (shape == null) {
                throw shapeNode.error("unknown shape '" + shapeNode.text() + "'; expected slab, cylinder, sphere, rectangle, "
                        + "disk, annulus, l-shape, polygon or mesh-file");
            }
            checkGeometryKeys(shape, g);
            SelfHeatingSection.Generated model = null;
            if (top.containsKey("self-heating")) {
                model = selfHeating(top, shape, g);
            }
            if (top.containsKey("derived")) {
                readDerived(top.get("derived"));
            }
            Quantity from;
            Quantity to;
            Quantity fromY = null;
            Quantity toY = null;
            PlaneSpec plane = null;
            List<String> parts;
            switch (shape) {
                case DISK -> {
                    from = Quantity.of(0, geo.place());
                    to = quantity(require(geo, g, "radius"));
                    parts = List.of("edge");
                }
                case ANNULUS -> {
                    from = quantity(require(geo, g, "inner-radius"));
                    to = quantity(require(geo, g, "outer-radius"));
                    if (!(from.value(parameters) > 0)) {
                        throw g.get("inner-radius").error("the inner radius must be > 0, found " + from.value(parameters));
                    }
                    parts = List.of("inner", "outer");
                }
                case POLYGON -> {
                    plane = PlaneReader.polygon(geo, g);
                    from = Quantity.of(0, geo.place());
                    to = Quantity.of(1, geo.place());
                    parts = PlaneReader.parts(plane);
                }
                case MESH_FILE -> {
                    plane = PlaneReader.meshFile(geo, g, source);
                    from = Quantity.of(0, geo.place());
                    to = Quantity.of(1, geo.place());
                    parts = PlaneReader.readMesh(plane.meshFile()).partNames();
                }
                default -> {
                    from = g.containsKey("from") ? quantity(g.get("from")) : Quantity.of(0, geo.place());
                    to = model != null ? Quantity.of(1, geo.place()) : quantity(require(geo, g, "to"));
                    if (shape.dimension() == 2) {
                        fromY = g.containsKey("y-from") ? quantity(g.get("y-from")) : Quantity.of(0, geo.place());
                        toY = quantity(require(geo, g, "y-to"));
                        if (!(toY.value(parameters) > fromY.value(parameters))) {
                            throw geo.error("'y-to' (" + toY.value(parameters) + ") must be greater than 'y-from' ("
                                    + fromY.value(parameters) + ")");
                        }
                    }
                    parts = shape == Shape.L_SHAPE ? List.of("edge") : boundaryParts(shape, from.value(parameters) == 0.0);
                }
            }
            checkExtent(shape, from, to, geo);
            MeshSpec mesh;
            if (shape == Shape.MESH_FILE) {
                if (top.containsKey("mesh")) {
                    throw top.get("mesh").error("a mesh-file shape brings its own mesh; remove the 'mesh' section");
                }
                mesh = new MeshSpec(0, 0, "none", 0, 0);
            } else if (model != null && !top.containsKey("mesh")) {
                mesh = new MeshSpec(200, 0, "none", 0, 0);
            } else {
                mesh = readMesh(require(root, top, "mesh"), shape);
            }
            List<FieldSpec> fields = model != null ? model.fields() : readFields(require(root, top, "fields"), shape);
            Map<String, Map<String, BoundarySpec>> bcs = model != null ? model.boundaries()
                    : readBoundaries(require(root, top, "boundaries"), shape, from.value(parameters) == 0.0, fields, parts);
            AnalysisSpec analysis = top.containsKey("analysis") ? readAnalysis(top.get("analysis"), fields.size())
                    : AnalysisSpec.defaults();
            PhysicalInputs physical = new PhysicalInputs(units, derived, model == null ? null : model.model());
            return new Case(source, title, about, shape, from, to, fromY, toY, mesh, parameters, fields, bcs, analysis,
                    physical, plane);
        }

        private SelfHeatingSection.Generated selfHeating(Map<String, CaseNode> top, Shape shape, Map<String, CaseNode> g) {
            CaseNode node = top.get("self-heating");
            for (String k : List.of("fields", "boundaries")) {
                if (top.containsKey(k)) {
                    throw top.get(k).error("a self-heating case generates its field and boundary conditions; remove '" + k + "'");
                }
            }
            if (g.containsKey("from") || g.containsKey("to")) {
                throw node.error("a self-heating case takes its size from 'size' (half-thickness or radius); remove geometry from/to");
            }
            if (shape.dimension() != 1) {
                throw node.error("the self-heating model is for a slab, cylinder or sphere, found '" + shape.word() + "'");
            }
            SelfHeatingSection.Generated m = SelfHeatingSection.read(node, shape);
            for (String name : m.parameters().keySet()) {
                if (parameters.containsKey(name)) {
                    throw node.error("parameter '" + name + "' is set by the self-heating section; remove it from 'parameters'");
                }
            }
            parameters.putAll(m.parameters());
            units.putAll(m.units());
            for (Map.Entry<String, Formula> e : m.derived().entrySet()) {
                derived.put(e.getKey(), e.getValue());
                parameters.put(e.getKey(), e.getValue().substitute(parameters).constantValue());
            }
            return m;
        }

        private void readDerived(CaseNode node) {
            for (Map.Entry<String, CaseNode> e : node.entries().entrySet()) {
                checkName(e.getKey(), e.getValue(), "derived parameter");
                if (parameters.containsKey(e.getKey())) {
                    throw e.getValue().error("derived parameter '" + e.getKey() + "' is already a parameter");
                }
                Formula f = formula(e.getValue(), parameters.keySet(), new LinkedHashMap<>(), "derived");
                double v = f.substitute(parameters).constantValue();
                if (!Double.isFinite(v)) {
                    throw e.getValue().error("derived parameter '" + e.getKey() + "' evaluates to " + v);
                }
                derived.put(e.getKey(), f);
                parameters.put(e.getKey(), v);
            }
        }

        private void checkGeometryKeys(Shape shape, Map<String, CaseNode> g) {
            Set<String> allowed = switch (shape) {
                case SLAB, CYLINDER, SPHERE -> Set.of("shape", "from", "to");
                case RECTANGLE, L_SHAPE -> Set.of("shape", "from", "to", "y-from", "y-to");
                case DISK -> Set.of("shape", "radius");
                case ANNULUS -> Set.of("shape", "inner-radius", "outer-radius");
                case POLYGON -> Set.of("shape", "outer", "holes");
                case MESH_FILE -> Set.of("shape", "file");
            };
            for (Map.Entry<String, CaseNode> e : g.entrySet()) {
                if (!allowed.contains(e.getKey())) {
                    throw e.getValue().error("'" + e.getKey() + "' does not apply to the shape " + shape.word()
                            + "; its geometry keys are " + String.join(", ", new java.util.TreeSet<>(allowed)));
                }
            }
        }

        private CaseNode require(CaseNode parent, Map<String, CaseNode> entries, String key) {
            CaseNode n = entries.get(key);
            if (n == null) {
                throw parent.error("missing key '" + key + "'");
            }
            return n;
        }

        private void readParameters(CaseNode node) {
            for (Map.Entry<String, CaseNode> e : node.entries().entrySet()) {
                checkName(e.getKey(), e.getValue(), "parameter");
                CaseNode v = e.getValue();
                if (!v.isScalar()) {
                    throw v.error("parameter '" + e.getKey() + "' must be a number (optionally with a unit, e.g. '25 degC')");
                }
                QuantityParser.Parsed q;
                try {
                    q = QuantityParser.parse(v.text());
                } catch (IllegalArgumentException ex) {
                    throw v.error("parameter '" + e.getKey() + "' must be a number optionally followed by a unit; "
                            + ex.getMessage());
                }
                if (q.hasUnit()) {
                    if (QuantityParser.sameDimension(q.unit(), QuantityParser.kelvin()) && q.si() <= 0) {
                        throw v.error("parameter '" + e.getKey() + "' = " + v.text().trim() + " is at or below absolute zero");
                    }
                    units.put(e.getKey(), q.unit());
                }
                parameters.put(e.getKey(), q.si());
            }
        }

        private void checkName(String name, CaseNode at, String what) {
            if (!name.matches("[A-Za-z_][A-Za-z0-9_]*")) {
                throw at.error(what + " name '" + name + "' must start with a letter or '_' and use only ASCII letters, digits and '_'");
            }
            if (RESERVED.contains(name)) {
                throw at.error(what + " name '" + name + "' is reserved (coordinates, pi and function names)");
            }
        }

        private void checkExtent(Shape shape, Quantity from, Quantity to, CaseNode geo) {
            double a = from.value(parameters);
            double b = to.value(parameters);
            if (!(b > a)) {
                throw geo.error(switch (shape) {
                    case DISK -> "the radius must be > 0, found " + b;
                    case ANNULUS -> "'outer-radius' (" + b + ") must be greater than 'inner-radius' (" + a + ")";
                    default -> "'to' (" + b + ") must be greater than 'from' (" + a + ")";
                });
            }
            if (shape.radial() && a < 0) {
                throw geo.error("a " + shape.word() + " needs from >= 0 (0 = the centre), found " + a);
            }
        }

        private MeshSpec readMesh(CaseNode node, Shape shape) {
            Map<String, CaseNode> m = node.entries(MESH);
            if (shape.triangles()) {
                return readTriangleMesh(node, m, shape);
            }
            if (m.containsKey("size")) {
                throw m.get("size").error("'size' applies to triangle shapes (disk, annulus, l-shape, polygon); "
                        + "use 'cells' here");
            }
            int cells = require(node, m, "cells").integer(2, MAX_CELLS);
            int cellsY = 0;
            if (shape.dimension() == 2) {
                cellsY = m.containsKey("cells-y") ? m.get("cells-y").integer(2, MAX_CELLS) : cells;
            } else if (m.containsKey("cells-y")) {
                throw m.get("cells-y").error("cells-y applies to 2D shapes only");
            }
            String toward = "none";
            double strength = 0;
            if (m.containsKey("stretch")) {
                CaseNode s = m.get("stretch");
                Map<String, CaseNode> se = s.entries(STRETCH);
                toward = require(s, se, "toward").text().trim();
                if (!Set.of("left", "right", "both", "none").contains(toward)) {
                    throw se.get("toward").error("stretch toward must be left, right, both or none, found '" + toward + "'");
                }
                strength = require(s, se, "strength").number();
                if (strength < 0 || strength > 10) {
                    throw se.get("strength").error("stretch strength must be from 0 to 10, found " + strength);
                }
            }
            return new MeshSpec(cells, cellsY, toward, strength);
        }

        /** Triangle shapes: 'size' (target edge length) or 'cells' (elements across the larger extent), not both. */
        private MeshSpec readTriangleMesh(CaseNode node, Map<String, CaseNode> m, Shape shape) {
            for (String k : List.of("cells-y", "stretch")) {
                if (m.containsKey(k)) {
                    throw m.get(k).error("'" + k + "' does not apply to the triangle shape " + shape.word() + "; use 'size'");
                }
            }
            if (m.containsKey("size") == m.containsKey("cells")) {
                throw node.error("a " + shape.word() + " mesh needs either 'size' (target element edge length) or 'cells' "
                        + "(elements across the shape), not both");
            }
            if (m.containsKey("cells")) {
                return new MeshSpec(m.get("cells").integer(2, 4000), 0, "none", 0, 0);
            }
            double size = positive(m.get("size"));
            return new MeshSpec(0, 0, "none", 0, size);
        }

        private List<FieldSpec> readFields(CaseNode node, Shape shape) {
            List<CaseNode> items = node.items();
            if (items.isEmpty()) {
                throw node.error("at least one field is needed");
            }
            List<String> names = new ArrayList<>();
            for (CaseNode item : items) {
                Map<String, CaseNode> f = item.entries(FIELD);
                String name = require(item, f, "name").text().trim();
                checkName(name, f.get("name"), "field");
                if (names.contains(name) || parameters.containsKey(name)) {
                    throw f.get("name").error("field name '" + name + "' is already used by a "
                            + (names.contains(name) ? "field" : "parameter"));
                }
                names.add(name);
            }
            Set<String> coords = new LinkedHashSet<>(shape.dimension() == 2 ? List.of("x", "y")
                    : shape.radial() ? List.of("x", "r") : List.of("x"));
            Set<String> withFields = new LinkedHashSet<>(names);
            withFields.addAll(coords);
            withFields.addAll(parameters.keySet());
            Set<String> noFields = new LinkedHashSet<>(coords);
            noFields.addAll(parameters.keySet());
            List<FieldSpec> out = new ArrayList<>();
            for (int i = 0; i < items.size(); i++) {
                CaseNode item = items.get(i);
                Map<String, CaseNode> f = item.entries(FIELD);
                Map<String, String> places = new LinkedHashMap<>();
                places.put("field", item.place());
                Formula k = formula(require(item, f, "diffusivity"), withFields, places, "diffusivity");
                if (k.names().isEmpty() || parameters.keySet().containsAll(k.names())) {
                    double kv = k.substitute(parameters).constantValue();
                    if (!(kv > 0)) {
                        throw f.get("diffusivity").error("diffusivity of field '" + names.get(i) + "' must be > 0, found " + kv);
                    }
                }
                Formula s = f.containsKey("source") ? formula(f.get("source"), withFields, places, "source") : Formula.parse("0");
                Formula u0 = f.containsKey("initial") ? formula(f.get("initial"), noFields, places, "initial") : Formula.parse("0");
                if (f.containsKey("drift")) {
                    checkNoFieldIn(f.get("drift"), names, "drift", "a drift may depend on position and parameters only");
                }
                Formula c = f.containsKey("drift") ? formula(f.get("drift"), noFields, places, "drift") : null;
                String unit = f.containsKey("unit") ? f.get("unit").text() : "";
                out.add(new FieldSpec(names.get(i), unit, k, s, u0, c, places));
            }
            return out;
        }

        /** Refuses a formula that names a field where fields are not allowed, with the reason. */
        private void checkNoFieldIn(CaseNode node, List<String> fieldNames, String key, String why) {
            Formula f;
            try {
                f = Formula.parse(node.text());
            } catch (FormulaException e) {
                return; // reported with its position by formula()
            }
            for (String n : f.names()) {
                if (fieldNames.contains(n)) {
                    throw formulaError(node, firstOccurrence(node.text(), n), key + " formula names the field '" + n + "'; " + why);
                }
            }
        }

        private Formula formula(CaseNode node, Set<String> allowed, Map<String, String> places, String key) {
            places.put(key, node.place());
            String text = node.text();
            Formula f;
            try {
                f = Formula.parse(text);
            } catch (FormulaException e) {
                throw formulaError(node, e.position(), e.problem());
            }
            for (String n : f.names()) {
                if (!allowed.contains(n)) {
                    int pos = firstOccurrence(text, n);
                    throw formulaError(node, pos, "unknown name '" + n + "' in " + key + " formula; known here: "
                            + (allowed.isEmpty() ? "(none)" : String.join(", ", allowed)));
                }
            }
            return f;
        }

        private InputException formulaError(CaseNode node, int position, String problem) {
            int[] lc = node.lineColumn();
            int col = lc[1] + Math.max(position, 0) + (node.quoted() ? 1 : 0);
            return new InputException(source, lc[0] + ":" + col + " (" + node.path() + ")", problem);
        }

        private Quantity quantity(CaseNode node) {
            Map<String, String> dummy = new LinkedHashMap<>();
            Formula f = formula(node, parameters.keySet(), dummy, "number");
            double v = f.substitute(parameters).constantValue();
            if (!Double.isFinite(v)) {
                throw node.error("the value is not a finite number (" + v + ")");
            }
            return new Quantity(f, node.place());
        }

        private Map<String, Map<String, BoundarySpec>> readBoundaries(CaseNode node, Shape shape, boolean centre,
                                                                     List<FieldSpec> fields, List<String> parts) {
            Map<String, CaseNode> b = node.entries(new LinkedHashSet<>(shape.radial() ? allParts(shape) : parts));
            Map<String, Map<String, BoundarySpec>> out = new LinkedHashMap<>();
            Set<String> fieldNames = new LinkedHashSet<>();
            fields.forEach(f -> fieldNames.add(f.name()));
            for (String part : parts) {
                CaseNode p = b.get(part);
                if (p == null) {
                    throw node.error("boundary '" + part + "' has no condition; every one of " + String.join(", ", parts)
                            + " needs one per field");
                }
                Map<String, CaseNode> perField = p.entries(fieldNames);
                Map<String, BoundarySpec> specs = new LinkedHashMap<>();
                for (String fn : fieldNames) {
                    CaseNode c = perField.get(fn);
                    if (c == null) {
                        throw p.error("boundary '" + part + "' has no condition for field '" + fn + "'");
                    }
                    specs.put(fn, condition(c));
                }
                out.put(part, specs);
            }
            if (centre && shape.radial() && b.containsKey("inner")) {
                CaseNode p = b.get("inner");
                for (CaseNode c : p.entries(fieldNames).values()) {
                    BoundarySpec s = condition(c);
                    if (s.kind() != BoundarySpec.Kind.INSULATED) {
                        throw c.error("the centre r = 0 is a symmetry point: it takes no condition (or 'insulated'), found '"
                                + s.kind().word() + "'");
                    }
                }
            }
            return out;
        }

        private BoundarySpec condition(CaseNode c) {
            if (c.isScalar()) {
                String w = c.text().trim();
                BoundarySpec.Kind k = BoundarySpec.Kind.byWord(w);
                if (k == null || k.keys().length > 0) {
                    throw c.error("expected 'insulated' or 'outlet', or a mapping such as {fixed: 0}, {flux: q}, "
                            + "{convective: {h: Bi, ambient: 0}} or {inlet: 1}; found '" + w + "'");
                }
                return new BoundarySpec(k, Map.of(), c.place());
            }
            Map<String, CaseNode> e = c.entries();
            if (e.size() != 1) {
                throw c.error("a condition is one of fixed, flux, insulated, convective, inlet, outlet; found " + e.size() + " keys");
            }
            Map.Entry<String, CaseNode> only = e.entrySet().iterator().next();
            BoundarySpec.Kind k = BoundarySpec.Kind.byWord(only.getKey());
            if (k == null) {
                Set<String> words = new LinkedHashSet<>();
                for (BoundarySpec.Kind x : BoundarySpec.Kind.values()) {
                    words.add(x.word());
                }
                throw only.getValue().error("unknown condition '" + only.getKey() + "'" + CaseNode.suggestion(only.getKey(), words)
                        + "; expected one of: " + String.join(", ", words));
            }
            Map<String, Quantity> numbers = new LinkedHashMap<>();
            String[] keys = k.keys();
            if (keys.length == 0) {
                return new BoundarySpec(k, numbers, c.place());
            }
            if (keys.length == 1 && only.getValue().isScalar()) {
                numbers.put(keys[0], quantity(only.getValue()));
            } else {
                Map<String, CaseNode> nums = only.getValue().entries(new LinkedHashSet<>(List.of(keys)));
                for (String key : keys) {
                    numbers.put(key, quantity(require(only.getValue(), nums, key)));
                }
            }
            if (k == BoundarySpec.Kind.CONVECTIVE && numbers.get("h").value(parameters) < 0) {
                throw only.getValue().error("heat-transfer coefficient h must be >= 0, found " + numbers.get("h").value(parameters));
            }
            return new BoundarySpec(k, numbers, c.place());
        }

        private AnalysisSpec readAnalysis(CaseNode node, int fieldCount) {
            Map<String, CaseNode> a = node.entries(ANALYSIS);
            AnalysisSpec d = AnalysisSpec.defaults();
            int modes = a.containsKey("modes") ? a.get("modes").integer(1, 200) : d.modes();
            double shift = d.shift();
            if (a.containsKey("shift") && !"auto".equals(a.get("shift").text().trim())) {
                shift = a.get("shift").number();
            }
            double nt = a.containsKey("newton-tolerance") ? positive(a.get("newton-tolerance")) : d.newtonTolerance();
            int ns = a.containsKey("newton-max-steps") ? a.get("newton-max-steps").integer(1, 10000) : d.newtonMaxSteps();
            double et = a.containsKey("eigen-tolerance") ? a.get("eigen-tolerance").number() : d.eigenTolerance();
            if (et < 0) {
                throw a.get("eigen-tolerance").error("eigen-tolerance must be >= 0 (0 = the eigen-solver's default), found " + et);
            }
            double mb = a.containsKey("marginal-band") ? positive(a.get("marginal-band")) : d.marginalBand();
            double rl = a.containsKey("residual-limit") ? positive(a.get("residual-limit")) : d.residualLimit();
            String scheme = "centred";
            if (a.containsKey("drift-scheme")) {
                scheme = a.get("drift-scheme").text().trim();
                if (!scheme.equals("centred") && !scheme.equals("upwind")) {
                    throw a.get("drift-scheme").error("drift-scheme must be centred or upwind, found '" + scheme + "'");
                }
            }
            double[] weights = a.containsKey("energy-weights") ? weights(a.get("energy-weights"), fieldCount) : null;
            int budget = a.containsKey("amplification-budget") ? a.get("amplification-budget").integer(0, 100_000_000)
                    : AnalysisSpec.DEFAULT_AMPLIFICATION_BUDGET;
            return new AnalysisSpec(modes, shift, nt, ns, et, mb, rl, scheme, weights, budget);
        }

        private double[] weights(CaseNode node, int fieldCount) {
            List<CaseNode> items = node.items();
            if (items.size() != fieldCount) {
                throw node.error("energy-weights needs one weight per field (" + fieldCount + "), found " + items.size());
            }
            double[] w = new double[fieldCount];
            for (int i = 0; i < fieldCount; i++) {
                w[i] = positive(items.get(i));
            }
            return w;
        }

        private double positive(CaseNode n) {
            double v = n.number();
            if (!(v > 0)) {
                throw n.error("expected a number > 0, found " + v);
            }
            return v;
        }
    }

    /** Reads and validates a triangle-mesh file; errors name that file and its line (exit 2). */
    public static rdstab.mesh.fem.TriangleMesh readMeshFile(Path file) {
        return PlaneReader.readMesh(file);
    }

    /** Boundary parts that need a condition for a shape. */
    public static List<String> boundaryParts(Shape shape, boolean centre) {
        switch (shape) {
            case SLAB:
                return List.of("left", "right");
            case CYLINDER:
            case SPHERE:
                return centre ? List.of("outer") : List.of("inner", "outer");
            default:
                return List.of("left", "right", "bottom", "top");
        }
    }

    private static List<String> allParts(Shape shape) {
        return shape.radial() ? List.of("inner", "outer") : boundaryParts(shape, false);
    }

    private static int firstOccurrence(String text, String name) {
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("(?<![A-Za-z0-9_])" + java.util.regex.Pattern.quote(name)
                + "(?![A-Za-z0-9_])").matcher(text);
        return m.find() ? m.start() : 0;
    }
}
