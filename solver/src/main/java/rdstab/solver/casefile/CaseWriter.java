package rdstab.solver.casefile;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.snakeyaml.engine.v2.api.Dump;
import org.snakeyaml.engine.v2.api.DumpSettings;
import org.snakeyaml.engine.v2.common.FlowStyle;
import rdstab.solver.model.BoundarySpec;
import rdstab.solver.model.Case;
import rdstab.solver.model.FieldSpec;
import rdstab.solver.model.Quantity;
import rdstab.solver.units.QuantityParser;

/**
 * Writes a case back as YAML that {@link CaseReader} reads to an equivalent case (same parameters in SI,
 * same formulas, same conditions, same results). A case written with a {@code self-heating:} section is
 * written in its expanded form: the physical inputs as parameters with units, the groups as derived
 * parameters, and the generated field and boundary conditions.
 */
public final class CaseWriter {

    private CaseWriter() {
    }

    /** The YAML text of a case. */
    public static String toYaml(Case c) {
        Map<String, Object> top = new LinkedHashMap<>();
        top.put("title", c.title());
        if (!c.about().isEmpty()) {
            top.put("about", c.about());
        }
        top.put("geometry", geometry(c));
        if (c.shape() != rdstab.solver.model.Shape.MESH_FILE) {
            top.put("mesh", mesh(c));
        }
        Map<String, Object> params = new LinkedHashMap<>();
        for (String name : c.parameters().keySet()) {
            if (c.physical().derived().containsKey(name)) {
                continue;
            }
            String unit = c.unitText(name);
            params.put(name, unit.isEmpty() ? (Object) c.parameter(name)
                    : Double.toString(c.displayValue(name)) + " " + unitForReading(name, c));
        }
        if (!params.isEmpty()) {
            top.put("parameters", params);
        }
        if (!c.physical().derived().isEmpty()) {
            Map<String, Object> d = new LinkedHashMap<>();
            c.physical().derived().forEach((k, f) -> d.put(k, f.toString()));
            top.put("derived", d);
        }
        List<Object> fields = new ArrayList<>();
        for (FieldSpec f : c.fields()) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("name", f.name());
            if (!f.unit().isEmpty()) {
                m.put("unit", f.unit());
            }
            m.put("diffusivity", f.diffusivity().toString());
            m.put("source", f.source().toString());
            m.put("initial", f.initial().toString());
            if (f.drift() != null) {
                m.put("drift", f.drift().toString());
            }
            fields.add(m);
        }
        top.put("fields", fields);
        Map<String, Object> bounds = new LinkedHashMap<>();
        c.boundaries().forEach((part, perField) -> {
            Map<String, Object> pf = new LinkedHashMap<>();
            perField.forEach((field, spec) -> pf.put(field, condition(spec)));
            bounds.put(part, pf);
        });
        top.put("boundaries", bounds);
        top.put("analysis", analysis(c));
        DumpSettings settings = DumpSettings.builder().setDefaultFlowStyle(FlowStyle.BLOCK).setWidth(4096).build();
        return new Dump(settings).dumpToString(top);
    }

    private static Map<String, Object> geometry(Case c) {
        Map<String, Object> geo = new LinkedHashMap<>();
        geo.put("shape", c.shape().word());
        switch (c.shape()) {
            case DISK -> geo.put("radius", text(c.to()));
            case ANNULUS -> {
                geo.put("inner-radius", text(c.from()));
                geo.put("outer-radius", text(c.to()));
            }
            case POLYGON -> {
                List<rdstab.solver.model.PlaneSpec.Ring> rings = c.plane().rings();
                geo.put("outer", ring(rings.get(0)));
                if (rings.size() > 1) {
                    List<Object> holes = new ArrayList<>();
                    for (int i = 1; i < rings.size(); i++) {
                        holes.add(ring(rings.get(i)));
                    }
                    geo.put("holes", holes);
                }
            }
            case MESH_FILE -> geo.put("file", java.nio.file.Path.of(c.source()).toAbsolutePath().getParent()
                    .relativize(c.plane().meshFile().toAbsolutePath()).toString());
            default -> {
                geo.put("from", text(c.from()));
                geo.put("to", text(c.to()));
                if (c.fromY() != null) {
                    geo.put("y-from", text(c.fromY()));
                    geo.put("y-to", text(c.toY()));
                }
            }
        }
        return geo;
    }

    private static Map<String, Object> ring(rdstab.solver.model.PlaneSpec.Ring r) {
        Map<String, Object> m = new LinkedHashMap<>();
        List<Object> pts = new ArrayList<>();
        for (double[] p : r.points()) {
            pts.add(List.of(p[0], p[1]));
        }
        m.put("points", pts);
        m.put("parts", List.of(r.parts()));
        return m;
    }

    private static Map<String, Object> mesh(Case c) {
        Map<String, Object> mesh = new LinkedHashMap<>();
        if (c.shape().triangles() && c.mesh().size() > 0) {
            mesh.put("size", c.mesh().size());
        } else {
            mesh.put("cells", c.mesh().cells());
        }
        if (c.mesh().cellsY() > 0) {
            mesh.put("cells-y", c.mesh().cellsY());
        }
        if (c.mesh().stretch() > 0 && !"none".equals(c.mesh().stretchTo())) {
            mesh.put("stretch", Map.of("toward", c.mesh().stretchTo(), "strength", c.mesh().stretch()));
        }
        return mesh;
    }

    private static String unitForReading(String name, Case c) {
        return c.physical().units().get(name).toString().replace("℃", "degC");
    }

    private static Object condition(BoundarySpec s) {
        if (s.kind().keys().length == 0) {
            return s.kind().word();
        }
        Map<String, Object> nums = new LinkedHashMap<>();
        s.numbers().forEach((k, q) -> nums.put(k, text(q)));
        return Map.of(s.kind().word(), nums);
    }

    private static Map<String, Object> analysis(Case c) {
        Map<String, Object> a = new LinkedHashMap<>();
        a.put("modes", c.analysis().modes());
        a.put("shift", Double.isNaN(c.analysis().shift()) ? "auto" : (Object) c.analysis().shift());
        a.put("newton-tolerance", c.analysis().newtonTolerance());
        a.put("newton-max-steps", c.analysis().newtonMaxSteps());
        a.put("eigen-tolerance", c.analysis().eigenTolerance());
        a.put("marginal-band", c.analysis().marginalBand());
        a.put("residual-limit", c.analysis().residualLimit());
        if (c.analysis().driftScheme() != null) {
            a.put("drift-scheme", c.analysis().driftScheme());
        }
        if (c.analysis().energyWeights() != null) {
            List<Object> w = new ArrayList<>();
            for (double x : c.analysis().energyWeights()) {
                w.add(x);
            }
            a.put("energy-weights", w);
        }
        a.put("amplification-budget", c.analysis().amplificationBudget());
        return a;
    }

    private static String text(Quantity q) {
        return q.formula().toString();
    }

    /** Exposed for tests: whether a unit's printed form reads back. */
    static boolean unitReadsBack(String unitText) {
        try {
            QuantityParser.unit(unitText.replace("℃", "degC"));
            return true;
        } catch (IllegalArgumentException e) {
            return false;
        }
    }
}
