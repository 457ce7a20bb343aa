package rdstab.solver.continuation;

import java.util.List;
import java.util.Map;

/**
 * One row of a traced branch: a step point, or a located special point (then {@code label} names it).
 *
 * @param row          row number in the output, from 0
 * @param step         continuation steps accepted up to this row (a special point shares the step of the row before it)
 * @param arclength    arclength s from the start in the scaled inner product of {@link ParameterFamily}
 * @param parameter    the parameter value p
 * @param norm         M-norm of the state: sqrt(Σ w_i u_i² / Σ w_i) over all fields and nodes (fixed values included)
 * @param max          largest nodal value of each field
 * @param eigenvalues  rightmost eigenvalues, rightmost first, each with its residual
 * @param growthRate   Re λ of the rightmost eigenvalue
 * @param frequency    |Im λ| of the rightmost eigenvalue (0 when it is real)
 * @param stability    "stable", "unstable" or "marginal" (|growth rate| within max(marginal band, its error bound))
 * @param label        "" for a step point; the special point's word otherwise
 * @param point        the full state and unit tangent (what a restart needs)
 * @param nextStep     the arclength step the tracer was going to try next from this row
 */
public record BranchRow(int row, int step, double arclength, double parameter, double norm, Map<String, Double> max,
                        List<Eigenvalue> eigenvalues, double growthRate, double frequency, String stability, String label,
                        BranchPoint point, double nextStep) {

    public BranchRow {
        max = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(max));
        eigenvalues = List.copyOf(eigenvalues);
    }
}
