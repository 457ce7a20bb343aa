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
 * @param orderingSeconds        wall time of the fill-reducing ordering and symbolic analysis (0 when a cached
 *                               analysis of the same pattern was reused; NaN for the dense path)
 * @param factorNonZeros         stored non-zeros of the sparse factors (L, or L + U), −1 for the dense path
 */
public record Spectrum(List<EigenPair> pairs, double shift, int requested, int computed, long operatorApplications,
                       int restarts, boolean rightmostCertified, double imaginaryBound, String method,
                       double factorizationSeconds, double iterationSeconds, double orderingSeconds,
                       long factorNonZeros) {

    public Spectrum {
        pairs = List.copyOf(pairs);
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
