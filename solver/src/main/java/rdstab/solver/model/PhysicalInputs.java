package rdstab.solver.model;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import javax.measure.Unit;
import rdstab.solver.formula.Formula;

/**
 * What a case knows beyond bare numbers: the unit each parameter was given in, parameters derived
 * from others by formulas (dimensionless groups), and the physical self-heating model when the case
 * was written in physical units.
 *
 * @param units        parameter name → the unit it was given in (parameters without units are absent)
 * @param derived      derived parameter name → formula of other parameters, evaluated in file order
 * @param selfHeating  the physical self-heating model, or null
 */
public record PhysicalInputs(Map<String, Unit<?>> units, Map<String, Formula> derived, SelfHeatingModel selfHeating) {

    public PhysicalInputs {
        units = Collections.unmodifiableMap(new LinkedHashMap<>(units));
        derived = Collections.unmodifiableMap(new LinkedHashMap<>(derived));
    }

    /** Nothing beyond bare numbers. */
    public static PhysicalInputs none() {
        return new PhysicalInputs(Map.of(), Map.of(), null);
    }

    /** Values of the derived parameters for the given independent ones (added to a copy, in order). */
    public Map<String, Double> withDerived(Map<String, Double> independent) {
        Map<String, Double> all = new LinkedHashMap<>(independent);
        for (Map.Entry<String, Formula> e : derived.entrySet()) {
            Formula f = e.getValue().substitute(all);
            if (!f.isConstant()) {
                throw new IllegalStateException("derived parameter " + e.getKey() + " depends on unknown names " + f.names());
            }
            all.put(e.getKey(), f.constantValue());
        }
        return all;
    }
}
