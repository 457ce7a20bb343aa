package rdstab.solver.formula;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** Test helper: evaluate formula text with named values, all passed as compile-time variables. */
final class Eval {

    private Eval() {
    }

    static double at(Formula f, Map<String, Double> values) {
        List<String> names = new ArrayList<>(values.keySet());
        double[] v = new double[names.size()];
        for (int i = 0; i < v.length; i++) {
            v[i] = values.get(names.get(i));
        }
        return f.compile(names, Map.of()).evaluate(v);
    }

    static double at(String text, Map<String, Double> values) {
        return at(Formula.parse(text), values);
    }

    static double of(String text) {
        return at(text, Map.of());
    }

    /** x, y, z in that order. */
    static Map<String, Double> xyz(double x, double y, double z) {
        Map<String, Double> m = new LinkedHashMap<>();
        m.put("x", x);
        m.put("y", y);
        m.put("z", z);
        return m;
    }
}
