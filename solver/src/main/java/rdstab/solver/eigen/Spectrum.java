package rdstab.solver.eigen;

import java.util.List;

/**
 * The result of an eigen-solve with its evidence.
 *
 * @param pairs                  eigenpairs, rightmost first, conjugate pairs adjacent (positive Im first)
 * @param shift                  shift σ actually used (after any automatic choice or perturbation; NaN for the dense path)
 * @param requested              number of eigenpairs asked for (k)
 * @param computed               number of Ritz pairs that converged in the Krylov method (≥ k; n for the dense path)
 * @param operatorApplications   number of applications of OP = (J − σM)⁻¹M (0 for the dense path)
 * @param restarts               implicit (ARPACK) or thick (Java Lanczos) restarts taken (0 for the dense path)
 * @param rightmostCertified     true when the returned set provably holds the k rightmost eigenvalues,
 *                               given the Gershgorin/Bendixson bounds and ARPACK's contract that the converged
 *                               Ritz values are the ones nearest σ (always true for the dense path)
 * @param imaginaryBound         proven bound S ≥ |Im λ| for every eigenvalue (NaN when no rigorous bound was available)
 * @param method                 "dense", "arnoldi", "lanczos" (ARPACK) or "lanczos-java" ({@link ThickRestartLanczos})
 * @param factorizationSeconds   wall time spent factorizing J − σM
 * @param iterationSeconds       wall time spent in the Krylov iteration and post-processing
 * @param orderingSeconds        wall time of the preparation: fill-reducing ordering, symbolic analysis (0 when a
 *                               cached analysis of the same pattern was reused) and any diagonal scaling; NaN for
 *                               the dense path
 * @param factorNonZeros         stored non-zeros of the sparse factors (L, or L + U), −1 for the dense path
 * @param scaling                the diagonal similarity the eigenvalues were computed under ({@link DiagonalScaling};
 *                               the identity for most problems); eigenvectors are always in the original
 *                               coordinates, residuals in those of the computation (see inOriginalCoordinates)
 */
public record Spectrum(List<EigenPair> pairs, double shift, int requested, int computed, long operatorApplications,
                       int restarts, boolean rightmostCertified, double imaginaryBound, String method,
                       double factorizationSeconds, double iterationSeconds, double orderingSeconds,
                       long factorNonZeros, DiagonalScaling scaling) {

    public Spectrum {
        pairs = List.copyOf(pairs);
    }

    /** Computed without a scaling. */
    public Spectrum(List<EigenPair> pairs, double shift, int requested, int computed, long operatorApplications,
                    int restarts, boolean rightmostCertified, double imaginaryBound, String method,
                    double factorizationSeconds, double iterationSeconds, double orderingSeconds, long factorNonZeros) {
        this(pairs, shift, requested, computed, operatorApplications, restarts, rightmostCertified, imaginaryBound,
                method, factorizationSeconds, iterationSeconds, orderingSeconds, factorNonZeros, DiagonalScaling.identity());
    }

    /**
     * This spectrum, computed for D⁻¹JD, taken back to the pencil (J, M): eigenvectors x = D x̃, normalised again.
     * The residuals stay those of the computation, ‖D⁻¹(Jx − λMx)‖₂/(‖D⁻¹JD‖₁‖D⁻¹x‖₂): the backward error in the
     * coordinates where the eigenvalue is well conditioned. Measured in the original coordinates they can be
     * larger, because D amplifies the rounding of x̃ where x̃ itself is tiny (a mode decaying towards where D is
     * large): 9e-8 against 1e-16 on a test chain with a 7e10 span (DiagonalScalingTest).
     */
    Spectrum inOriginalCoordinates(DiagonalScaling s, org.ejml.data.DMatrixSparseCSC m, double preparationSeconds) {
        long t0 = System.nanoTime();
        List<EigenPair> back = new java.util.ArrayList<>();
        for (EigenPair p : pairs) {
            back.add(EigenChecks.normalized(p.re(), p.im(), s.toOriginal(p.vectorRe()), s.toOriginal(p.vectorIm()), m,
                    p.residual()));
        }
        return new Spectrum(back, shift, requested, computed, operatorApplications, restarts, rightmostCertified,
                imaginaryBound, method, factorizationSeconds, iterationSeconds + (System.nanoTime() - t0) * 1e-9,
                orderingSeconds + preparationSeconds, factorNonZeros, s);
    }

    /** This spectrum with preparation time (a scaling looked for and not used) added to orderingSeconds. */
    Spectrum plusPreparation(double seconds) {
        return new Spectrum(pairs, shift, requested, computed, operatorApplications, restarts, rightmostCertified,
                imaginaryBound, method, factorizationSeconds, iterationSeconds, orderingSeconds + seconds, factorNonZeros,
                scaling);
    }

    /** Without the ordering time and factor size (the dense path). */
    public Spectrum(List<EigenPair> pairs, double shift, int requested, int computed, long operatorApplications,
                    int restarts, boolean rightmostCertified, double imaginaryBound, String method,
                    double factorizationSeconds, double iterationSeconds) {
        this(pairs, shift, requested, computed, operatorApplications, restarts, rightmostCertified, imaginaryBound,
                method, factorizationSeconds, iterationSeconds, Double.NaN, -1);
    }

    /** Largest Re λ found (the growth rate of the most unstable mode). */
    public double rightmostRealPart() {
        return pairs.isEmpty() ? Double.NaN : pairs.get(0).re();
    }

    /** Largest residual among the returned pairs. */
    public double worstResidual() {
        double w = 0.0;
        for (EigenPair p : pairs) {
            w = Math.max(w, p.residual());
        }
        return w;
    }
}
