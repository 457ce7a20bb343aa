/**
 * Time integration of the nonlinear semi-discrete system M du/dt = F(u), to check the linear prediction.
 *
 * <h2>Which class to use</h2>
 * <ul>
 *   <li>{@link rdstab.solver.timestep.DisturbanceSimulation} — from base state + amplitude × mode: measured growth
 *       rate against Re λ, and where each run ends (back to the base state, another steady state, runaway).</li>
 *   <li>{@link rdstab.solver.timestep.Rosenbrock2} — the integrator alone (ROS2, order 2, L-stable, error-controlled;
 *       fixed steps for convergence studies).</li>
 *   <li>{@link rdstab.solver.timestep.SemiDiscreteSystem} — what the integrator needs (G, its Jacobian, M), and the
 *       disturbance form of a discretization about a base state.</li>
 * </ul>
 * {@link rdstab.solver.timestep.SimulationResult} holds the time histories: the data records plots draw from.
 */
package rdstab.solver.timestep;
