/**
 * Many stability checks: parameter sweeps, critical values and neutral curves.
 *
 * <p>Which class to use:
 * <ul>
 *   <li>{@link rdstab.solver.sweep.SweepGrid} with one or two {@link rdstab.solver.sweep.Axis}: the
 *       points of a sweep, their warm-start chains and the share of a {@link rdstab.solver.sweep.Shard}.</li>
 *   <li>{@link rdstab.solver.sweep.SweepRunner}: computes chains on a thread pool; every point becomes a
 *       {@link rdstab.solver.sweep.PointOutcome} with a {@link rdstab.solver.sweep.PointStatus}, failures
 *       included. Output files, ordering and resuming live in the command line module.</li>
 *   <li>{@link rdstab.solver.sweep.CriticalFinder}: the first neutral point or fold along one parameter.</li>
 *   <li>{@link rdstab.solver.sweep.NeutralCurve}: the critical value of the second parameter of a
 *       two-parameter sweep as a function of the first.</li>
 * </ul>
 * Nothing here prints; progress reaches the caller through {@link rdstab.solver.sweep.SweepRunner.Listener}.
 */
package rdstab.solver.sweep;
