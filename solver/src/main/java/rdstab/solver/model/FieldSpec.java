package rdstab.solver.model;

import rdstab.solver.formula.Formula;

/**
 * One field (temperature, concentration, ...) of a case.
 *
 * @param name         the name used in formulas and reports
 * @param unit         unit label for reports (may be empty)
 * @param diffusivity  k(x, fields, parameters) &gt; 0
 * @param source       s(x, fields, parameters)
 * @param initial      initial guess for Newton, a formula of x and parameters
 * @param drift        drift velocity c(x, parameters), or null for none
 * @param places       where each item was written: keys "diffusivity", "source", "initial", "drift"
 */
public record FieldSpec(String name, String unit, Formula diffusivity, Formula source, Formula initial, Formula drift,
                        java.util.Map<String, String> places) {

    /** Where the item was written, or the field's own place. */
    public String placeOf(String item) {
        return places.getOrDefault(item, places.getOrDefault("field", ""));
    }
}
