package rdstab.solver.model;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import javax.measure.Unit;
import rdstab.solver.error.InputException;
import rdstab.solver.units.QuantityParser;

/**
 * A validated, immutable stability case: geometry, mesh, named parameters, fields, boundary
 * conditions and analysis options. Read one with {@link rdstab.solver.casefile.CaseReader}; change
 * a parameter with {@link #withParameter}, which returns a new case.
 *
 * @param source      where it came from (file path), for messages
 * @param title       one-line title
 * @param about       free description (may be empty)
 * @param shape       body shape
 * @param from        inner coordinate (0 = symmetry centre for cylinder and sphere; left end of a slab)
 * @param to          outer coordinate (surface of a cylinder or sphere; right end of a slab)
 * @param fromY       lower y of a rectangle (null in 1D)
 * @param toY         upper y of a rectangle (null in 1D)
 * @param mesh        resolution
 * @param parameters  named parameter values, in file order
 * @param fields      the fields, in file order (unknown numbering follows it)
 * @param boundaries  boundary part name → field name → condition
 * @param analysis    analysis options
 * @param physical    parameter units, derived parameters and the physical self-heating model (if any)
 * @param plane       the outline of a polygon or the mesh file of a mesh-file shape (null otherwise)
 */
public record Case(String source, String title, String about, Shape shape, Quantity from, Quantity to,
                   Quantity fromY, Quantity toY, MeshSpec mesh,
                   Map<String, Double> parameters, List<FieldSpec> fields,
                   Map<String, Map<String, BoundarySpec>> boundaries, AnalysisSpec analysis, PhysicalInputs physical,
                   PlaneSpec plane) {

    /** A case without units, derived parameters, polygon outline or mesh file. */
    public Case(String source, String title, String about, Shape shape, Quantity from, Quantity to,
                Quantity fromY, Quantity toY, MeshSpec mesh, Map<String, Double> parameters, List<FieldSpec> fields,
                Map<String, Map<String, BoundarySpec>> boundaries, AnalysisSpec analysis) {
        this(source, title, about, shape, from, to, fromY, toY, mesh, parameters, fields, boundaries, analysis,
                PhysicalInputs.none(), (PlaneSpec) null);
    }

    /** A case without a polygon outline or mesh file. */
    public Case(String source, String title, String about, Shape shape, Quantity from, Quantity to,
                Quantity fromY, Quantity toY, MeshSpec mesh, Map<String, Double> parameters, List<FieldSpec> fields,
                Map<String, Map<String, BoundarySpec>> boundaries, AnalysisSpec analysis, PhysicalInputs physical) {
        this(source, title, about, shape, from, to, fromY, toY, mesh, parameters, fields, boundaries, analysis, physical,
                (PlaneSpec) null);
    }

    /** A case without units or derived parameters. */
    public Case(String source, String title, String about, Shape shape, Quantity from, Quantity to,
                Quantity fromY, Quantity toY, MeshSpec mesh, Map<String, Double> parameters, List<FieldSpec> fields,
                Map<String, Map<String, BoundarySpec>> boundaries, AnalysisSpec analysis, PlaneSpec plane) {
        this(source, title, about, shape, from, to, fromY, toY, mesh, parameters, fields, boundaries, analysis,
                PhysicalInputs.none(), plane);
    }

    /** Coordinate names usable in formulas. */
    public static final List<String> COORDINATES_1D = List.of("x");

    public Case {
        parameters = Collections.unmodifiableMap(new LinkedHashMap<>(parameters));
        fields = List.copyOf(fields);
        Map<String, Map<String, BoundarySpec>> b = new LinkedHashMap<>();
        boundaries.forEach((k, v) -> b.put(k, Collections.unmodifiableMap(new LinkedHashMap<>(v))));
        boundaries = Collections.unmodifiableMap(b);
        physical = physical == null ? PhysicalInputs.none() : physical;
    }

    /** Field names in order. */
    public List<String> fieldNames() {
        List<String> names = new ArrayList<>();
        for (FieldSpec f : fields) {
            names.add(f.name());
        }
        return names;
    }

    /** Coordinate names usable in formulas: x (and y in 2D); r is accepted as a synonym of x for radial shapes. */
    public List<String> coordinateNames() {
        if (shape.dimension() == 2) {
            return List.of("x", "y");
        }
        return shape.radial() ? List.of("x", "r") : List.of("x");
    }

    /** Value of a parameter. */
    public double parameter(String name) {
        Double v = parameters.get(name);
        if (v == null) {
            throw unknownParameter(name, "command line");
        }
        return v;
    }

    /**
     * A copy with one parameter changed.
     *
     * @throws InputException when the case has no such parameter or the value is not finite
     */
    public Case withParameter(String name, double value) {
        if (physical.derived().containsKey(name)) {
            throw new InputException("command line", null, "parameter '" + name + "' is derived from others ("
                    + physical.derived().get(name) + "); change those instead");
        }
        if (!parameters.containsKey(name)) {
            throw unknownParameter(name, "command line");
        }
        if (!Double.isFinite(value)) {
            throw new InputException("command line", null, "parameter '" + name + "' must be a finite number, got " + value);
        }
        Unit<?> u = physical.units().get(name);
        if (u != null && QuantityParser.sameDimension(u, QuantityParser.kelvin()) && value <= 0) {
            throw new InputException("command line", null, "parameter '" + name + "' is an absolute temperature; "
                    + QuantityParser.fromSi(value, u) + " " + QuantityParser.display(u) + " is at or below absolute zero");
        }
        Map<String, Double> p = new LinkedHashMap<>();
        parameters.forEach((k, v) -> {
            if (!physical.derived().containsKey(k)) {
                p.put(k, v);
            }
        });
        p.put(name, value);
        return new Case(source, title, about, shape, from, to, fromY, toY, mesh, physical.withDerived(p), fields, boundaries,
                analysis, physical, plane);
    }

    /**
     * Reads a value for a parameter as typed on the command line: a plain number is taken in the unit the
     * parameter was given in (SI when none); a number with a unit ("40 degC", "0.3 m") is converted to SI
     * after checking that its dimension matches.
     */
    public double parseValue(String name, String text) {
        if (!parameters.containsKey(name)) {
            throw unknownParameter(name, "command line");
        }
        QuantityParser.Parsed q;
        try {
            q = QuantityParser.parse(text);
        } catch (IllegalArgumentException e) {
            throw new InputException("command line", name, e.getMessage());
        }
        Unit<?> declared = physical.units().get(name);
        if (!q.hasUnit()) {
            return declared == null ? q.value() : QuantityParser.toSi(q.value(), declared);
        }
        if (declared == null) {
            throw new InputException("command line", name, "parameter '" + name + "' was given without a unit in the case; "
                    + "give a plain number, found '" + text + "'");
        }
        if (!QuantityParser.sameDimension(declared, q.unit())) {
            throw new InputException("command line", name, "'" + text + "' has dimension " + QuantityParser.dimensionText(q.unit())
                    + " but parameter '" + name + "' has dimension " + QuantityParser.dimensionText(declared));
        }
        return q.si();
    }

    /** A parameter's value in the unit it was given in (the SI value when it has none). */
    public double displayValue(String name) {
        Unit<?> u = physical.units().get(name);
        return u == null ? parameter(name) : QuantityParser.fromSi(parameter(name), u);
    }

    /** The unit a parameter was given in, as text ("" when none). */
    public String unitText(String name) {
        Unit<?> u = physical.units().get(name);
        return u == null ? "" : QuantityParser.display(u);
    }

    /** A copy with other mesh settings. */
    public Case withMesh(MeshSpec m) {
        return new Case(source, title, about, shape, from, to, fromY, toY, m, parameters, fields, boundaries, analysis, physical, plane);
    }

    /** A copy with other analysis options. */
    public Case withAnalysis(AnalysisSpec a) {
        return new Case(source, title, about, shape, from, to, fromY, toY, mesh, parameters, fields, boundaries, a, physical, plane);
    }

    private InputException unknownParameter(String name, String where) {
        return new InputException(where, null, "the case " + source + " has no parameter '" + name
                + "'; its parameters are " + (parameters.isEmpty() ? "(none)" : String.join(", ", parameters.keySet())));
    }

    /** Inner coordinate value at the current parameters. */
    public double fromValue() {
        return from.value(parameters);
    }

    /** Outer coordinate value at the current parameters. */
    public double toValue() {
        return to.value(parameters);
    }
}
