/**
 * Sparse direct factorizations for the shift-invert eigen-solvers and Newton steps.
 *
 * <h2>Factorization contract</h2>
 * {@code F = Factorizations.factor(A, spd, ordering)} returns a {@link rdstab.solver.linear.SparseFactorization}
 * with F.solve(b) = A⁻¹b to the backward accuracy of the factorization (round-off of order
 * ε·growth·‖A‖); A is read, never modified or retained. The factor is computed for A(p, p), p the
 * fill-reducing ordering; the permutation is undone inside solve. A pivot at or below
 * ε·max(n,10)·‖A‖₁, a non-positive Cholesky pivot, or a non-finite solution raises
 * {@link rdstab.solver.error.ConvergenceException} with reason {@code SINGULAR_SHIFT}. Factorizations
 * keep scratch space: one instance per thread.
 *
 * <h2>Which class to use</h2>
 * <ul>
 *   <li>{@link rdstab.solver.linear.Factorizations#factor} — the entry point; pass
 *       {@code symmetricPositive = true} only when A is known SPD. It caches the symbolic analysis per
 *       pattern, so Newton steps, shifts, continuation steps and sweep points on one mesh pay for the
 *       ordering and the symbolic phase once.</li>
 *   <li>{@link rdstab.solver.linear.SymbolicAnalysis} — the pattern-only part (ordering, elimination tree,
 *       supernodes, structure of L), for callers that want to hold it explicitly. For LU the structure is
 *       that of A + Aᵀ and is fully reused by the unpivoted supernodal LU; the pivoted fallback reuses
 *       only the ordering (its patterns of L and U depend on the values).</li>
 *   <li>{@link rdstab.solver.linear.SupernodalCholesky} — SPD matrices (σM − J for symmetric J with σ
 *       above the spectrum, or M itself): left-looking supernodal, dense kernels on panels.</li>
 *   <li>SupernodalLU (package-private) — the first try for a non-symmetric matrix (J − σM): LU without row
 *       interchanges on the supernodal structure of A + Aᵀ, accepted only when no pivot is at round-off
 *       level and a test solve's backward error is ≤ 1e-10 (about 4× faster than EJML's LU on the two-field
 *       256² benchmark operator).</li>
 *   <li>{@link rdstab.solver.linear.SparseLU} — any square non-singular matrix (J − σM for a
 *       non-symmetric J), EJML's up-looking LU with partial pivoting on the pre-ordered matrix; the
 *       fallback when the supernodal LU is refused.</li>
 *   <li>{@link rdstab.solver.linear.SparseCholesky} — EJML's up-looking Cholesky, kept as a second
 *       opinion (slower: 2.9 s against 0.6 s for the 512² Laplacian with the same ordering, measured).</li>
 *   <li>{@link rdstab.solver.linear.Ordering} — the fill-reducing hook: {@code automatic()} (the default:
 *       natural order for narrow bands such as 1D meshes, graph nested dissection otherwise),
 *       {@code nestedDissection()}, {@code nestedDissection(coords)}, {@code approximateMinimumDegree()},
 *       {@code reverseCuthillMcKee()}, {@code identity()}.</li>
 * </ul>
 *
 * <h2>Choice by measurement (512² five-point Laplacian, n = 262 144, one core, unloaded machine)</h2>
 * Non-zeros of L / numeric Cholesky time: graph nested dissection 10.2 M / 0.58 s; approximate minimum
 * degree 9.9 M / 0.94 s (more, narrower supernodes); geometric nested dissection 12.8 M / 0.74 s;
 * the natural band would be about 134 M. Nested dissection is therefore the default.
 */
package rdstab.solver.linear;
