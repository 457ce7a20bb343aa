package rdstab.solver.casefile;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import javax.measure.Unit;
import rdstab.solver.formula.Formula;
import rdstab.solver.model.BoundarySpec;
import rdstab.solver.model.FieldSpec;
import rdstab.solver.model.Quantity;
import rdstab.solver.model.SelfHeatingModel;
import rdstab.solver.model.Shape;
import rdstab.solver.units.QuantityParser;

/**
 * Reads the {@code self-heating:} section: a body described in physical units, from which the
 * dimensionless Frank-Kamenetskii case is generated (field θ, insulated centre, convective or fixed
 * surface, derived groups δ, ε, Bi). Every input must carry a unit of the right dimension.
 */
final class SelfHeatingSection {

    /** Case-file key → parameter name and an example unit of the expected dimension. */
    private static final String[][] KEYS = {
        {"density", "rho", "kg/m^3"},
        {"heat-capacity", "cp", "J/(kg*K)"},
        {"conductivity", "k", "W/(m*K)"},
        {"size", "L", "m"},
        {"activation-energy", "E", "J/mol"},
        {"pre-exponential-factor", "A", "1/s"},
        {"heat-of-reaction", "Q", "J/kg"},
        {"surface-heat-transfer", "h", "W/(m^2*K)"},
        {"ambient-temperature", "Ta", "K"},
    };
    private static final Set<String> ALLOWED;

    static {
        java.util.LinkedHashSet<String> a = new java.util.LinkedHashSet<>();
        for (String[] k : KEYS) {
            a.add(k[0]);
        }
        a.add("kinetics");
        ALLOWED = a;
    }

    /** What the section generates. */
    record Generated(Map<String, Double> parameters, Map<String, Unit<?>> units, Map<String, Formula> derived,
                     List<FieldSpec> fields, Map<String, Map<String, BoundarySpec>> boundaries, SelfHeatingModel model) {
    }

    private SelfHeatingSection() {
    }

    static Generated read(CaseNode node, Shape shape) {
        Map<String, CaseNode> e = node.entries(ALLOWED);
        Map<String, Double> params = new LinkedHashMap<>();
        Map<String, Unit<?>> units = new LinkedHashMap<>();
        Unit<?> temperatureUnit = null;
        for (String[] k : KEYS) {
            CaseNode v = e.get(k[0]);
            if (v == null) {
                if (k[1].equals("h")) {
                    continue;
                }
                throw node.error("missing key '" + k[0] + "' (a quantity with a unit such as " + k[2] + ")");
            }
            QuantityParser.Parsed q = quantity(v, k[0], QuantityParser.unit(k[2]));
            if (!(q.si() > 0) && !k[1].equals("h")) {
                throw v.error(k[0] + " must be > 0, found " + v.text());
            }
            if (k[1].equals("h") && q.si() < 0) {
                throw v.error("surface-heat-transfer must be >= 0, found " + v.text());
            }
            params.put(k[1], q.si());
            units.put(k[1], q.unit());
            if (k[1].equals("Ta")) {
                temperatureUnit = q.unit();
            }
        }
        boolean arrhenius = false;
        if (e.containsKey("kinetics")) {
            String w = e.get("kinetics").text().trim();
            if (!w.equals("exponential") && !w.equals("arrhenius")) {
                throw e.get("kinetics").error("kinetics must be 'exponential' (exp(theta), the Frank-Kamenetskii limit) "
                        + "or 'arrhenius' (exp(theta/(1+eps*theta))), found '" + w + "'");
            }
            arrhenius = w.equals("arrhenius");
        }
        boolean convective = params.containsKey("h");
        Map<String, Formula> derived = new LinkedHashMap<>();
        derived.put("delta", Formula.parse(SelfHeatingModel.deltaFormula()));
        derived.put("eps", Formula.parse(SelfHeatingModel.epsFormula()));
        if (convective) {
            derived.put("Bi", Formula.parse(SelfHeatingModel.biotFormula()));
        }
        Map<String, String> places = Map.of("field", node.place());
        String source = arrhenius ? "delta*exp(theta/(1 + eps*theta))" : "delta*exp(theta)";
        FieldSpec theta = new FieldSpec("theta", "", Formula.parse("1"), Formula.parse(source), Formula.parse("0"), null, places);
        Map<String, Map<String, BoundarySpec>> b = new LinkedHashMap<>();
        BoundarySpec surface = convective
                ? new BoundarySpec(BoundarySpec.Kind.CONVECTIVE, Map.of("h", new Quantity(Formula.parse("Bi"), node.place()),
                        "ambient", Quantity.of(0, node.place())), node.place())
                : new BoundarySpec(BoundarySpec.Kind.FIXED, Map.of("value", Quantity.of(0, node.place())), node.place());
        if (shape == Shape.SLAB) {
            b.put("left", Map.of("theta", new BoundarySpec(BoundarySpec.Kind.INSULATED, Map.of(), node.place())));
            b.put("right", Map.of("theta", surface));
        } else {
            b.put("outer", Map.of("theta", surface));
        }
        return new Generated(params, units, derived, List.of(theta), b,
                new SelfHeatingModel(arrhenius, convective, temperatureUnit));
    }

    private static QuantityParser.Parsed quantity(CaseNode v, String key, Unit<?> expected) {
        QuantityParser.Parsed q;
        try {
            q = QuantityParser.parse(v.text());
        } catch (IllegalArgumentException ex) {
            throw v.error(ex.getMessage());
        }
        if (!q.hasUnit()) {
            throw v.error(key + " needs a unit (e.g. '" + v.text().trim() + " " + QuantityParser.display(expected) + "')");
        }
        if (!QuantityParser.sameDimension(q.unit(), expected)) {
            throw v.error(key + " has dimension " + QuantityParser.dimensionText(q.unit()) + " ('" + q.unitText()
                    + "'), expected " + QuantityParser.dimensionText(expected) + " (e.g. " + QuantityParser.display(expected) + ")");
        }
        if (QuantityParser.sameDimension(expected, QuantityParser.kelvin()) && q.si() <= 0) {
            throw v.error(key + " " + v.text().trim() + " is at or below absolute zero");
        }
        return q;
    }
}
