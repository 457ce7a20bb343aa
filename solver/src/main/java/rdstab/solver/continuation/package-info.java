/**
 * Branches of steady states through one parameter: Keller's pseudo-arclength continuation through folds, with the
 * stability of every point and the special points located.
 *
 * <h2>Which class to use</h2>
 * <ul>
 *   <li>{@link rdstab.solver.continuation.BranchTracer#trace} — trace a case from its Newton solution at one end of a
 *       range; {@link rdstab.solver.continuation.BranchTracer#resume} — continue from a row of an earlier trace.</li>
 *   <li>{@link rdstab.solver.continuation.TraceOptions} — range, step control and guards (validated).</li>
 *   <li>{@link rdstab.solver.continuation.TraceResult} — the rows ({@link rdstab.solver.continuation.BranchRow}),
 *       the special points ({@link rdstab.solver.continuation.SpecialPoint}: fold, stationary crossing, Hopf) and the
 *       evidence; what reports and plots read.</li>
 *   <li>{@link rdstab.solver.continuation.ParameterFamily} — the case as F(u; p), ∂F/∂p and the scaled inner
 *       product the arclength is measured in.</li>
 * </ul>
 */
package rdstab.solver.continuation;
