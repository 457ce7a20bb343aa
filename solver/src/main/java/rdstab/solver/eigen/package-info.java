/**
 * Rightmost eigenvalues of the linearised operator: J x = λ M x, M symmetric positive definite,
 * Re λ &gt; 0 means growth.
 *
 * <h2>Which class to use</h2>
 * <ul>
 *   <li>{@link rdstab.solver.eigen.EigenSolvers#create} — picks one of the below from n and the options.</li>
 *   <li>{@link rdstab.solver.eigen.ShiftInvertArnoldi} — the general case (non-symmetric J, complex
 *       spectra); sparse LU of J − σM; reports a certificate that the rightmost set is complete.</li>
 *   <li>{@link rdstab.solver.eigen.ThickRestartLanczos} — symmetric J, the default for it: pure-Java
 *       shift-invert thick-restart Lanczos, sparse Cholesky of σM − J, no global state (parallel solves).</li>
 *   <li>{@link rdstab.solver.eigen.ShiftInvertLanczos} — the same problem by ARPACK (serialised on one
 *       lock), kept as the cross-check; symmetric J (pure diffusion, gradient systems);
 *       sparse Cholesky of σM − J, real spectrum, cheaper and always certified with the automatic shift.</li>
 *   <li>{@link rdstab.solver.eigen.DenseEigenSolver} — all eigenvalues, O(n³): n up to a few hundred,
 *       and the independent oracle in tests.</li>
 * </ul>
 * Every solver returns pairs rightmost first, conjugates adjacent (positive Im first), each with an
 * independently computed residual; the {@code solve} methods return a {@link rdstab.solver.eigen.Spectrum}
 * with the shift used, counts, certificate and timings.
 */
package rdstab.solver.eigen;
