/**
 * Sparse direct factorizations for the shift-invert eigen-solvers and Newton steps.
 *
 * <h2>Which class to use</h2>
 * <ul>
 *   <li>{@link rdstab.solver.linear.Factorizations#factor} — the entry point; pass
 *       {@code symmetricPositive = true} only when A is known SPD.</li>
 *   <li>{@link rdstab.solver.linear.SparseLU} — any square non-singular matrix (J − σM for a
 *       non-symmetric J).</li>
 *   <li>{@link rdstab.solver.linear.SparseCholesky} — SPD matrices (σM − J for symmetric J with σ
 *       above the spectrum, or M itself).</li>
 *   <li>{@link rdstab.solver.linear.Ordering} — the fill-reducing hook: identity (1D banded
 *       problems are already optimal) or reverse Cuthill–McKee; a nested dissection for 2D is future
 *       work.</li>
 * </ul>
 * Both factorizations report a numerically singular matrix as
 * {@link rdstab.solver.error.ConvergenceException} with reason {@code SINGULAR_SHIFT}.
 */
package rdstab.solver.linear;
