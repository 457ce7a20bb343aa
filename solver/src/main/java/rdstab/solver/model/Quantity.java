package rdstab.solver.model;

import java.util.Map;
import rdstab.solver.formula.Formula;

/**
 * A number in a case file that may be a literal, a parameter name or a formula of parameters,
 * remembered with where it was written so that errors can point at it.
 *
 * @param formula the parsed formula
 * @param place   line:column and key path in the case file
 */
public record Quantity(Formula formula, String place) {

    /** The value for the given parameter values (the formula may use parameters only). */
    public double value(Map<String, Double> parameters) {
        Formula f = formula.substitute(parameters);
        if (!f.isConstant()) {
            throw new IllegalStateException("unresolved names " + f.names() + " at " + place);
        }
        return f.constantValue();
    }

    /** A literal number. */
    public static Quantity of(double v, String place) {
        return new Quantity(Formula.parse(Double.toString(v)), place);
    }
}
