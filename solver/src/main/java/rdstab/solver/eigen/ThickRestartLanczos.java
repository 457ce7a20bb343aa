package rdstab.solver.eigen;

import java.util.ArrayList;
import java.util.List;
import org.ejml.data.DMatrixSparseCSC;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.linear.Factorizations;
import rdstab.solver.linear.Ordering;
import rdstab.solver.linear.SparseFactorization;
import rdstab.solver.linear.SparseOps;
import rdstab.solver.linear.SymbolicAnalysis;

/**
 * Rightmost eigenvalues of J x = λ M x for symmetric J and symmetric positive definite M by
 * shift-invert thick-restart Lanczos in the M inner product (Wu &amp; Simon, SIAM J. Matrix Anal. Appl.
 * 22 (2000) 602–616), in plain Java with no global state: solves in different threads run in
 * parallel (unlike {@link ShiftInvertLanczos}, whose ARPACK keeps Fortran SAVE state behind one lock).
 *
 * <p><b>Operator.</b> K = σM − J with σ strictly above the spectrum is symmetric positive definite
 * and factorized by sparse Cholesky ({@link Factorizations}, whose symbolic analysis is cached per
 * pattern). OP = K⁻¹M is self-adjoint in ⟨x, y⟩ = xᵀMy with eigenvalues ν = 1/(σ − λ) &gt; 0, and
 * λ = σ − 1/ν. With options.shift() = NaN, σ = bound + 0.01·max(1, |bound|) with the bound of
 * {@link SpectrumBounds} (the automatic shift of {@link ShiftInvertLanczos}). A shift that is not above
 * the spectrum makes the Cholesky fail; σ is then raised by 1e-6·max(1,|σ|)·2^attempt up to three
 * times, then SINGULAR_SHIFT is thrown.
 *
 * <p><b>Iteration and stopping</b> ({@link ThickRestartIteration}): block Lanczos with blocks of
 * {@link #BLOCK} vectors (the two solves of a block share one pass over the factor), full
 * reorthogonalization by two passes of classical Gram–Schmidt, thick restart keeping the largest Ritz
 * pairs; nev = k + 2 Ritz pairs are computed (so that a multiple eigenvalue at the edge of the wanted set
 * is not cut). The k wanted pairs must satisfy ‖OP y − θ y‖_M ≤ tol·θ_i and the two guards 1e-6·θ_i, with
 * tol = options.tolerance(), or {@link #DEFAULT_TOLERANCE} = 1e-10 when that is 0. That default gives the
 * eigenvalues to round-off: for a self-adjoint operator a Ritz value with residual r lies within
 * min(‖r‖, ‖r‖²/gap) of an eigenvalue (Kato–Temple; B. N. Parlett, <i>The Symmetric Eigenvalue
 * Problem</i>, ch. 10–11, from memory), so 1e-10 is at the unit round-off for any relative gap above 1e-6, and
 * the vectors are accurate to about 1e-10/gap. On the 2D model problem it needs about 44 solves where
 * the unit round-off needs about 60 (bench/RESULTS.md). Basis size ncv = options.subspace() or
 * max(2·nev + 1, 20), made a multiple of the block, at most n − block. One "restart" is one thick restart;
 * operatorApplications counts Cholesky solves (right-hand sides). Restart cap reached with fewer than k of
 * the wanted pairs converged → one retry with ncv doubled and twice the restarts, then
 * EIGEN_NOT_CONVERGED with the converged count. Deterministic: the only pseudo-random numbers are a
 * fixed-seed sequence (start block, and a fresh direction when the Krylov space becomes invariant).
 *
 * <p><b>Certificate.</b> {@link Spectrum#rightmostCertified()} is true when the {@link SpectrumBounds}
 * are rigorous and σ exceeds their bound on Re λ. Then every eigenvalue satisfies λ &lt; σ, so
 * ν = 1/(σ − λ) is increasing in λ and the k rightmost λ are exactly the k largest ν. The returned
 * pairs are the k largest converged Ritz values of OP; for a self-adjoint OP the i-th largest Ritz value
 * never exceeds the i-th largest eigenvalue (Cauchy interlacing) and lies within its residual of an
 * eigenvalue, so all k are the largest ν unless the Krylov space missed an eigenvector direction
 * entirely — the same assumption ARPACK's certificate rests on, made unlikely by the pseudo-random start
 * block and by computing k + 2 pairs. A single-vector Krylov space holds one direction of each multiple
 * eigenvalue, and the second copy emerges only from rounding, so a single-vector iteration stopped early
 * can miss it (with tolerance 1e-4 both the single-vector version of this class and ARPACK missed the
 * (3,1) mode of a square; with a basis of 16 and tolerance 1e-10 the single-vector version missed the
 * second copy of the (1,3)/(3,1) pair of the 256² model problem, the block version did not). A block of two finds
 * every eigenvalue of multiplicity up to two in exact arithmetic. The returned set is therefore the k
 * rightmost when σ is above the spectrum and all k converged (non-convergence throws, so a returned result
 * always has all k).
 *
 * <p>Each eigenvalue is reported as the Rayleigh quotient xᵀJx/xᵀMx of its Ritz vector
 * ({@link #rayleighQuotient}). Results go through {@link EigenChecks}: unit M-norm vectors, independent residuals
 * ‖Jx − λMx‖₂/(‖J‖₁‖x‖₂), rightmost first. Small problems (n &lt; {@link ShiftInvertArnoldi#DENSE_BELOW},
 * or n too small for a basis of nev + 2 blocks) go to {@link DenseEigenSolver}. Inputs are not modified. Thread-safe: an instance
 * holds only its (immutable) ordering.
 */
public final class ThickRestartLanczos implements EigenSolver {

    /** Name of the method in {@link Spectrum#method()}. */
    public static final String METHOD = "lanczos-java";

    /** Block size of the Lanczos iteration: double eigenvalues (squares, symmetric domains) are found exactly. */
    static final int BLOCK = 2;
    /** Residual tolerance used when the options ask for 0 ("the solver's default"); see the class comment. */
    static final double DEFAULT_TOLERANCE = 1e-10;

    private final Ordering ordering;

    /** With the default ordering ({@link Factorizations#defaultOrdering()}). */
    public ThickRestartLanczos() {
        this(Factorizations.defaultOrdering());
    }

    /** With a chosen fill-reducing ordering for the Cholesky of σM − J. */
    public ThickRestartLanczos(Ordering ordering) {
        this.ordering = ordering;
    }

    @Override
    public List<EigenPair> rightmost(DMatrixSparseCSC j, DMatrixSparseCSC m, EigenOptions options) {
        return solve(j, m, options).pairs();
    }

    @Override
    public Spectrum solve(DMatrixSparseCSC j, DMatrixSparseCSC m, EigenOptions options) {
        EigenChecks.requireProblem(j, m);
        int n = j.numCols;
        int k = options.count();
        int nev = k + 2;
        if (n < ShiftInvertArnoldi.DENSE_BELOW || basisSize(nev + 2 * BLOCK, nev, n) < nev + 2 * BLOCK) {
            return new DenseEigenSolver().solve(j, m, options.symmetric() ? options
                    : new EigenOptions(k, options.shift(), true, options.tolerance(), options.maxRestarts(),
                    options.subspace()));
        }
        SpectrumBounds bounds = SpectrumBounds.of(j, m);
        double sigma0 = Double.isNaN(options.shift()) ? bounds.automaticShift() : options.shift();
        long t0 = System.nanoTime();
        Shifted shifted = factorShifted(j, m, sigma0);
        long t1 = System.nanoTime();

        int ncv = basisSize(options.subspace() > 0 ? options.subspace() : Math.max(2 * nev + 1, 20), nev, n);
        ThickRestartIteration.Result run = new ThickRestartIteration(shifted.chol, m, nev, k, ncv, BLOCK,
                options.maxRestarts(), tolerance(options)).run();
        long ops = run.operatorApplications();
        int restarts = run.restarts();
        if (!leadingConverged(run, nev)) {
            run = new ThickRestartIteration(shifted.chol, m, nev, k, basisSize(2 * ncv, nev, n), BLOCK,
                    2 * options.maxRestarts(), tolerance(options)).run();
            ops += run.operatorApplications();
            restarts += run.restarts();
        }
        if (!leadingConverged(run, k)) {
            throw new ConvergenceException(ConvergenceException.Reason.EIGEN_NOT_CONVERGED,
                    "Thick-restart Lanczos converged " + run.convergedCount() + " of " + nev + " eigenvalues (" + k
                            + " requested) after " + restarts + " restarts, also with a doubled subspace.",
                    restarts, Double.NaN);
        }
        List<EigenChecks.Mode> modes = new ArrayList<>();
        double[] jx = new double[n];
        double[] mx = new double[n];
        for (int c = 0; c < nev; c++) {
            if (run.converged()[c]) {
                double[] x = run.vectors()[c];
                modes.add(new EigenChecks.Mode(rayleighQuotient(j, m, x, jx, mx, shifted.sigma - 1.0 / run.theta()[c]),
                        0.0, x, new double[n]));
            }
        }
        List<EigenPair> pairs = EigenChecks.finish(modes, k, j, m);
        boolean certified = bounds.rigorous() && shifted.sigma > bounds.reUpper();
        long t2 = System.nanoTime();
        return new Spectrum(pairs, shifted.sigma, k, run.convergedCount(), ops, restarts, certified,
                bounds.rigorous() ? bounds.imBound() : Double.NaN, METHOD, (t1 - t0) * 1e-9 - shifted.orderingSeconds,
                (t2 - t1) * 1e-9, shifted.orderingSeconds, shifted.chol.nonZerosOfFactors());
    }

    /**
     * λ = xᵀJx / xᵀMx for a converged Ritz vector x. The Ritz value σ − 1/θ inherits the rounding of OP,
     * whose norm is 1/(σ − λ₁): with σ close to an eigenvalue the others lose about ε/(σ − λ₁) of relative
     * accuracy (a shift 1e-5 from λ₁ cost 2e-10 on λ₂ of a 1D Laplacian). The Rayleigh quotient of the
     * symmetric pair (J, M) is correct to second order in the vector's error (B. N. Parlett, <i>The
     * Symmetric Eigenvalue Problem</i>, ch. 4, from memory), so it is what is reported; the Ritz value is
     * kept when the quotient is not finite.
     */
    static double rayleighQuotient(DMatrixSparseCSC j, DMatrixSparseCSC m, double[] x, double[] jx, double[] mx,
                                   double ritz) {
        SparseOps.multiply(j, x, jx);
        SparseOps.multiply(m, x, mx);
        double q = EigenChecks.dot(x, jx) / EigenChecks.dot(x, mx);
        return Double.isFinite(q) ? q : ritz;
    }

    /** The residual tolerance: the requested one, or {@link #DEFAULT_TOLERANCE} for 0. */
    static double tolerance(EigenOptions options) {
        return options.tolerance() > 0 ? options.tolerance() : DEFAULT_TOLERANCE;
    }

    /** The requested basis size made a multiple of {@link #BLOCK}, at least nev + 2 blocks, at most n − BLOCK. */
    static int basisSize(int requested, int nev, int n) {
        int ncv = Math.max(requested, nev + 2 * BLOCK);
        ncv += (BLOCK - ncv % BLOCK) % BLOCK;
        int cap = n - BLOCK - (n - BLOCK) % BLOCK;
        return Math.min(ncv, cap);
    }

    /** True when the first {@code count} Ritz pairs (the largest θ) have all converged. */
    private static boolean leadingConverged(ThickRestartIteration.Result run, int count) {
        for (int i = 0; i < count; i++) {
            if (!run.converged()[i]) {
                return false;
            }
        }
        return true;
    }

    private record Shifted(SparseFactorization chol, double sigma, double orderingSeconds) {
    }

    /** Cholesky of σM − J, raising σ slightly (three times at most) when it is not positive definite. */
    private Shifted factorShifted(DMatrixSparseCSC j, DMatrixSparseCSC m, double sigma0) {
        ConvergenceException last = null;
        double orderingSeconds = 0;
        for (int attempt = 0; attempt <= ShiftInvertArnoldi.SHIFT_RETRIES; attempt++) {
            double sigma = attempt == 0 ? sigma0 : sigma0 + ShiftInvertArnoldi.SHIFT_PERTURBATION
                    * Math.max(1.0, Math.abs(sigma0)) * (1 << (attempt - 1));
            try {
                DMatrixSparseCSC shifted = SparseOps.add(sigma, m, -1.0, j);
                long ta = System.nanoTime();
                SymbolicAnalysis analysis = Factorizations.analysis(shifted, true, ordering);
                orderingSeconds += (System.nanoTime() - ta) * 1e-9;
                return new Shifted(analysis.factor(shifted), sigma, orderingSeconds);
            } catch (ConvergenceException e) {
                if (e.reason() != ConvergenceException.Reason.SINGULAR_SHIFT) {
                    throw e;
                }
                last = e;
            }
        }
        throw new ConvergenceException(ConvergenceException.Reason.SINGULAR_SHIFT,
                "sigma*M - J is not positive definite for sigma = " + sigma0
                        + " (or small raises of it): the Lanczos shift must lie above the spectrum.", -1, Double.NaN,
                last);
    }
}
