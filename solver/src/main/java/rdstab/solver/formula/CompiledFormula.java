package rdstab.solver.formula;

/**
 * A formula prepared by {@link Formula#compile} for fast repeated evaluation, e.g. once per mesh
 * node. Evaluation does no name look-ups; constants were folded at compile time. Instances are
 * immutable and may be shared between threads.
 */
@FunctionalInterface
public interface CompiledFormula {

    /**
     * @param vars values of the variables, in the order of the list given to {@link Formula#compile}
     * @return the value of the formula (NaN or infinite where the arithmetic says so)
     */
    double evaluate(double[] vars);
}
