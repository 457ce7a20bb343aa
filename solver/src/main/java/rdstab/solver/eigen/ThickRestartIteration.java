package rdstab.solver.eigen;

import java.util.SplittableRandom;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.ejml.data.DMatrixSparseCSC;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.linear.SparseFactorization;
import rdstab.solver.linear.SparseOps;

/**
 * The kernel of {@link ThickRestartLanczos}: thick-restart Lanczos (Wu &amp; Simon 2000) for the largest
 * eigenvalues ν of OP = K⁻¹M, K = σM − J symmetric positive definite, M symmetric positive definite.
 * OP is self-adjoint in the M inner product ⟨x, y⟩ = xᵀMy, so all ν are real; with σ above the
 * spectrum every ν = 1/(σ − λ) is positive.
 *
 * <p><b>Relation kept.</b> OP V = V T + β v_{m} e_mᵀ with V = [v_0 … v_{m−1}] M-orthonormal and T
 * symmetric: tridiagonal after a fresh start, an arrow (diagonal of kept Ritz values, last column the
 * couplings β s_{m,i}) followed by a tridiagonal block after a restart. Each Lanczos step applies OP
 * once (one Cholesky solve; M v is stored with v, so one product with M per step) and
 * M-orthogonalises against the whole basis by two passes of classical Gram–Schmidt. A step whose new direction has M-norm below
 * {@link #BREAKDOWN}·‖OP v_j‖_M has found an invariant subspace: its coupling is set to 0 and the basis
 * continues with the next seeded pseudo-random vector orthogonalised against the basis.
 *
 * <p><b>Restart.</b> After ncv steps, T = S Θ Sᵀ (EJML's dense symmetric QR). The keep largest Ritz
 * pairs (y_i = V s_i) and v_m form the new basis, keep = nev + min(nconv, (ncv − nev)/2) as in ARPACK's
 * dsaup2 (more kept vectors once some have converged, against stagnation).
 *
 * <p><b>Convergence.</b> Ritz pair i is converged when ‖OP y_i − θ_i y_i‖_M = |β s_{m,i}| ≤ tol·θ_i
 * (tol = the requested tolerance, or 2⁻⁵³ when that is 0: ARPACK's criterion without its ε^{2/3}
 * floor, which θ &gt; 0 makes unnecessary). For a self-adjoint operator that residual bounds the
 * distance of θ_i to an eigenvalue of OP and its square over the gap bounds the error.
 * The iteration stops when the nev largest Ritz values are all converged or after maxRestarts restarts.
 *
 * <p>One instance per solve; nothing static is mutable, so solves in different threads do not
 * interact. The start vector and the breakdown replacements come from a {@link SplittableRandom}
 * with a fixed seed: the result is a deterministic function of the inputs.
 */
final class ThickRestartIteration {

    /** Seed of the start vector (any fixed value; this one is a date). */
    static final long SEED = 20240611L;
    /** Relative M-norm below which a new Lanczos direction counts as rounding noise (invariant subspace). */
    static final double BREAKDOWN = 1e-13;
    /** Default tolerance: the unit round-off 2⁻⁵³, as ARPACK's dlamch('EpsMach'). */
    static final double UNIT_ROUNDOFF = 0x1.0p-53;

    /** Outcome: the nev largest Ritz values (descending), their vectors, converged flags and counters. */
    record Result(double[] theta, double[][] vectors, boolean[] converged, int restarts, long operatorApplications) {
        int convergedCount() {
            int c = 0;
            for (boolean b : converged) {
                c += b ? 1 : 0;
            }
            return c;
        }
    }

    private final SparseFactorization chol;
    private final DMatrixSparseCSC m;
    private final int n;
    private final int nev;
    private final int ncv;
    private final int maxRestarts;
    private final double tol;
    private final SplittableRandom random = new SplittableRandom(SEED);
    private double[][] v;
    private double[][] mv;
    private double[][] spare;
    private double[][] spareM;
    private final double[][] t;
    private final double[] coef;
    private final double[] passCoef;
    private long ops;

    /**
     * @param chol        Cholesky factors of K = σM − J (used through solve only)
     * @param m           M, not modified
     * @param nev         number of wanted (largest) Ritz pairs, 1 ≤ nev &lt; ncv
     * @param ncv         basis size, ncv ≤ n − 1 (one more vector, v_ncv, is kept)
     * @param maxRestarts cap on thick restarts
     * @param tolerance   relative tolerance of the Ritz residual (0 = unit round-off)
     */
    ThickRestartIteration(SparseFactorization chol, DMatrixSparseCSC m, int nev, int ncv, int maxRestarts,
                          double tolerance) {
        this.chol = chol;
        this.m = m;
        this.n = m.numCols;
        if (nev < 1 || ncv <= nev || ncv > n - 1) {
            throw new IllegalArgumentException("need 1 <= nev < ncv <= n - 1, got nev = " + nev + ", ncv = " + ncv
                    + ", n = " + n);
        }
        this.nev = nev;
        this.ncv = ncv;
        this.maxRestarts = maxRestarts;
        this.tol = tolerance > 0 ? tolerance : UNIT_ROUNDOFF;
        this.v = new double[ncv + 1][n];
        this.mv = new double[ncv + 1][n];
        this.spare = new double[ncv + 1][];
        this.spareM = new double[ncv + 1][];
        this.t = new double[ncv][ncv];
        this.coef = new double[ncv + 1];
        this.passCoef = new double[ncv + 1];
    }

    /** Runs the iteration from the seeded start vector. */
    Result run() {
        randomUnitVector(0);
        int kept = 0;
        for (int restart = 0; ; restart++) {
            double beta = extend(kept);
            Projected p = Projected.of(t, ncv);
            boolean[] conv = new boolean[nev];
            int nconv = 0;
            for (int i = 0; i < nev; i++) {
                conv[i] = Math.abs(beta * p.s[ncv - 1][i]) <= tol * p.theta[i];
                nconv += conv[i] ? 1 : 0;
            }
            if (nconv == nev || restart >= maxRestarts) {
                return new Result(java.util.Arrays.copyOf(p.theta, nev), ritzVectors(p, nev), conv, restart, ops);
            }
            kept = Math.min(nev + Math.min(nconv, (ncv - nev) / 2), ncv - 1);
            restartWith(p, kept, beta);
        }
    }

    /** Lanczos steps j = kept … ncv − 1; returns β of the last step (the coupling to v_ncv). */
    private double extend(int kept) {
        double beta = 0.0;
        for (int j = kept; j < ncv; j++) {
            double[] w = v[j + 1];
            chol.solve(mv[j], w);
            ops++;
            orthogonalise(w, j + 1);
            double alpha = coef[j];
            if (!Double.isFinite(alpha)) {
                throw new ConvergenceException(ConvergenceException.Reason.NOT_FINITE,
                        "the Lanczos iteration produced a non-finite value (step " + j + ")", (int) ops, Double.NaN);
            }
            t[j][j] = alpha;
            SparseOps.multiply(m, w, mv[j + 1]);
            beta = Math.sqrt(Math.max(0.0, EigenChecks.dot(w, mv[j + 1])));
            double removed = 0.0;
            for (int i = 0; i <= j; i++) {
                removed += coef[i] * coef[i];
            }
            double normBefore = Math.sqrt(removed + beta * beta); // ‖OP v_j‖_M by Pythagoras
            if (beta <= BREAKDOWN * normBefore) {
                beta = 0.0;
                randomUnitVector(j + 1);
            } else {
                scale(1.0 / beta, w, mv[j + 1]);
            }
            if (j + 1 < ncv) {
                t[j][j + 1] = beta;
                t[j + 1][j] = beta;
            }
        }
        return beta;
    }

    /**
     * M-orthogonalises x against v_0 … v_{count−1} by two passes of classical Gram–Schmidt ("twice is
     * enough" unless x is numerically in the span, which the caller's breakdown test catches). The
     * summed coefficients ⟨x, v_i⟩ land in coef[0..count).
     */
    private void orthogonalise(double[] x, int count) {
        java.util.Arrays.fill(coef, 0.0);
        for (int pass = 0; pass < 2; pass++) {
            for (int i = 0; i < count; i++) {
                passCoef[i] = EigenChecks.dot(x, mv[i]);
                coef[i] += passCoef[i];
            }
            for (int i = 0; i < count; i++) {
                axpy(-passCoef[i], v[i], x);
            }
        }
    }

    /** Fills v[index] with a seeded pseudo-random vector, M-orthogonal to v_0 … v_{index−1}, unit M-norm. */
    private void randomUnitVector(int index) {
        for (int attempt = 0; attempt < 5; attempt++) {
            double[] x = v[index];
            for (int i = 0; i < n; i++) {
                x[i] = random.nextDouble(-1.0, 1.0);
            }
            double raw = Math.sqrt(mNormSquared(x));
            orthogonalise(x, index);
            SparseOps.multiply(m, x, mv[index]);
            double norm = Math.sqrt(Math.max(0.0, EigenChecks.dot(x, mv[index])));
            if (norm > 1e-8 * raw) {
                scale(1.0 / norm, x, mv[index]);
                return;
            }
        }
        throw new ConvergenceException(ConvergenceException.Reason.EIGEN_NOT_CONVERGED,
                "no new Lanczos direction could be found (the basis of " + index + " vectors spans the space)",
                (int) ops, Double.NaN);
    }

    /** New basis [y_0 … y_{kept−1}, v_ncv], T = diag(θ) with the arrow couplings β s_{ncv−1,i}. */
    private void restartWith(Projected p, int kept, double beta) {
        for (int i = 0; i < kept; i++) {
            double[] y = spare[i] == null ? new double[n] : spare[i];
            double[] my = spareM[i] == null ? new double[n] : spareM[i];
            java.util.Arrays.fill(y, 0.0);
            java.util.Arrays.fill(my, 0.0);
            for (int q = 0; q < ncv; q++) {
                double s = p.s[q][i];
                axpy(s, v[q], y);
                axpy(s, mv[q], my);
            }
            spare[i] = y;
            spareM[i] = my;
        }
        double[] last = v[ncv];
        double[] lastM = mv[ncv];
        for (int i = 0; i < kept; i++) {
            double[] y = spare[i];
            double[] my = spareM[i];
            spare[i] = v[i];
            spareM[i] = mv[i];
            v[i] = y;
            mv[i] = my;
        }
        double[] oldKept = v[kept];
        double[] oldKeptM = mv[kept];
        v[kept] = last;
        mv[kept] = lastM;
        v[ncv] = oldKept;
        mv[ncv] = oldKeptM;
        for (double[] row : t) {
            java.util.Arrays.fill(row, 0.0);
        }
        for (int i = 0; i < kept; i++) {
            t[i][i] = p.theta[i];
            t[i][kept] = beta * p.s[ncv - 1][i];
            t[kept][i] = t[i][kept];
        }
    }

    private double[][] ritzVectors(Projected p, int count) {
        double[][] y = new double[count][n];
        for (int i = 0; i < count; i++) {
            for (int q = 0; q < ncv; q++) {
                axpy(p.s[q][i], v[q], y[i]);
            }
        }
        return y;
    }

    private double mNormSquared(double[] x) {
        double[] mx = new double[n];
        SparseOps.multiply(m, x, mx);
        return Math.max(0.0, EigenChecks.dot(x, mx));
    }

    private static void axpy(double a, double[] x, double[] y) {
        for (int i = 0; i < y.length; i++) {
            y[i] += a * x[i];
        }
    }

    private static void scale(double a, double[] x, double[] y) {
        for (int i = 0; i < x.length; i++) {
            x[i] *= a;
            y[i] *= a;
        }
    }

    /** Eigen-decomposition of the projected matrix: θ descending, S[q][i] = component q of the i-th vector. */
    record Projected(double[] theta, double[][] s) {
        static Projected of(double[][] t, int size) {
            DMatrixRMaj a = new DMatrixRMaj(size, size);
            for (int r = 0; r < size; r++) {
                for (int c = 0; c < size; c++) {
                    a.set(r, c, 0.5 * (t[r][c] + t[c][r]));
                }
            }
            EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(size, true, true);
            if (!eig.decompose(a)) {
                throw new ConvergenceException(ConvergenceException.Reason.EIGEN_NOT_CONVERGED,
                        "EJML's symmetric eigen-solver failed on the projected " + size + "x" + size + " matrix", 0,
                        Double.NaN);
            }
            Integer[] order = new Integer[size];
            double[] values = new double[size];
            for (int i = 0; i < size; i++) {
                order[i] = i;
                values[i] = eig.getEigenvalue(i).real;
            }
            java.util.Arrays.sort(order, (x, y) -> Double.compare(values[y], values[x]));
            double[] theta = new double[size];
            double[][] s = new double[size][size];
            for (int i = 0; i < size; i++) {
                theta[i] = values[order[i]];
                DMatrixRMaj vec = eig.getEigenVector(order[i]);
                double norm = 0.0;
                for (int q = 0; q < size; q++) {
                    norm += vec.get(q) * vec.get(q);
                }
                norm = Math.sqrt(norm);
                for (int q = 0; q < size; q++) {
                    s[q][i] = vec.get(q) / norm;
                }
            }
            return new Projected(theta, s);
        }
    }
}
