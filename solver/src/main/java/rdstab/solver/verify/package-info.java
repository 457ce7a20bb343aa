/**
 * Trust in the numbers: how large is the grid error of a growth rate, and is the verdict resolved by it.
 *
 * <h2>Which class to use</h2>
 * <ul>
 *   <li>{@link rdstab.solver.verify.GridStudy} — runs a case on systematically refined grids, follows the rightmost
 *       eigenvalues across levels by mode overlap, and estimates order, extrapolated value and GCI.</li>
 *   <li>{@link rdstab.solver.verify.RichardsonEstimate} — the formulas alone: observed order, Richardson extrapolation,
 *       Grid Convergence Index (Roache 1994; ASME V&amp;V 20), with stated fallbacks.</li>
 *   <li>{@link rdstab.solver.verify.ModeOverlap}, {@link rdstab.solver.verify.NodalInterpolation} — comparing fields
 *       and modes across 1D grids.</li>
 * </ul>
 * The nonlinear check of the linear prediction (time integration from base state plus a mode) lives in
 * {@code rdstab.solver.timestep}.
 */
package rdstab.solver.verify;
