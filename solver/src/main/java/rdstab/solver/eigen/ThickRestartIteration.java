package rdstab.solver.eigen;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.ejml.data.DMatrixRMaj;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.linear.SparseFactorization;
import rdstab.solver.linear.SparseOps;

/**
 * The kernel of {@link ThickRestartLanczos}: block thick-restart Lanczos (Wu &amp; Simon 2000 for the
 * thick restart; the block recurrence as in Golub &amp; Underwood 1977) for the largest eigenvalues ν of
 * OP = K⁻¹M, K = σM − J symmetric positive definite, M symmetric positive definite. OP is self-adjoint in
 * the M inner product ⟨x, y⟩ = xᵀMy, so all ν are real; with σ above the spectrum every ν = 1/(σ − λ) &gt; 0.
 *
 * <p><b>Why blocks.</b> A Krylov space grown from one vector holds one direction of each multiple
 * eigenvalue; the second copy of a double eigenvalue (the (1,2) and (2,1) modes of a square plate) appears
 * only through rounding errors, so a single-vector iteration stopped at a moderate tolerance can miss it.
 * With a block of b vectors every eigenvalue of multiplicity up to b is found in exact arithmetic. The b
 * solves of a block are done together ({@link SparseFactorization#solve(double[][], double[][], int)}: the
 * factor streams through memory once for the block).
 *
 * <p><b>Relation kept.</b> OP V = V T + W R E_lastᵀ with V = [v_0 … v_{s−1}] M-orthonormal, T symmetric
 * (block tridiagonal after a fresh start; after a restart a diagonal of kept Ritz values with their
 * couplings to the next block), W the M-orthonormal block after V and R its b×b coupling to the last block
 * of V. Each block step applies OP to b vectors (one multi-right-hand-side Cholesky solve; M v is stored
 * with v, or is v itself when M = I), M-orthogonalises the results against the whole basis by two passes of
 * classical Gram–Schmidt, then against each other (modified Gram–Schmidt, twice), which gives the next
 * block and its R. A column whose remainder has M-norm below {@link #BREAKDOWN} of its size before has
 * found an invariant subspace: its coupling is set to 0 and a seeded pseudo-random vector, orthogonalised
 * against everything, takes its place.
 *
 * <p><b>Restart.</b> With T = S Θ Sᵀ (EJML's dense symmetric QR) the keep largest Ritz vectors y_i = V s_i
 * and W form the new basis, keep = nev + min(nconv, (s − nev)/2) as in ARPACK's dsaup2 (more kept vectors
 * once some have converged), adjusted so that the blocks fill the basis.
 *
 * <p><b>Convergence.</b> Ritz pair i is converged when ‖OP y_i − θ_i y_i‖_M = ‖R s_i,last‖₂ ≤ tol·θ_i, the
 * first {@code wanted} with the requested tolerance (2⁻⁵³ when that is 0), the rest (guards) with
 * {@link #GUARD_TOLERANCE} at most. For a self-adjoint operator that residual bounds the distance of θ_i to
 * an eigenvalue of OP, and its square over the gap to the rest of the spectrum bounds the error.
 *
 * <p>One instance per solve; nothing static is mutable, so solves in different threads do not interact.
 * The start block and the breakdown replacements come from a {@link SplittableRandom} with a fixed seed: the
 * result is a deterministic function of the inputs.
 */
final class ThickRestartIteration {

    /** Seed of the start block (any fixed value; this one is a date). */
    static final long SEED = 20240611L;
    /** Relative M-norm below which a new direction counts as rounding noise (invariant subspace). */
    static final double BREAKDOWN = 1e-13;
    /** Residual tolerance of the guard pairs (computed beyond the wanted ones, not returned as results). */
    static final double GUARD_TOLERANCE = 1e-6;
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
    /** M = I: the M-products are the vectors themselves (mv[i] is v[i]), no multiplications with M. */
    private final boolean identity;
    private final int n;
    private final int nev;
    private final int wanted;
    private final int ncv;
    private final int block;
    private final int maxRestarts;
    private final double tol;
    private final SplittableRandom random = new SplittableRandom(SEED);
    /** Basis v_0 … v_{ncv−1} followed by the next block (b more vectors). */
    private final double[][] v;
    private final double[][] mv;
    private final double[][] spare;
    private final double[][] spareM;
    private final double[][] t;
    /** Coupling of the block after the basis to its last block: W R E_lastᵀ. */
    private final double[][] r;
    /** coef[c][i]: summed Gram–Schmidt coefficient of the block's column c against basis vector i. */
    private final double[][] coef;
    private final double[][] passCoef;
    private final double[][] rhs;
    private final double[][] out;
    /** Coupling of the block being formed to the block it came from (see normaliseBlock). */
    private final double[][] rNew;
    /** Σ of the squared basis coefficients removed from each column of the block being formed. */
    private final double[] removed;
    private long ops;

    /**
     * @param chol        Cholesky factors of K = σM − J (used through solve only)
     * @param m           M, not modified
     * @param nev         number of computed (largest) Ritz pairs, 1 ≤ nev &lt; ncv
     * @param wanted      the first {@code wanted} of them must meet {@code tolerance}; the others (guards) only
     *                    {@link #GUARD_TOLERANCE} or {@code tolerance}, whichever is looser
     * @param ncv         basis size, a multiple of block, nev + 2·block ≤ ncv ≤ n − block
     * @param block       block size b ≥ 1
     * @param maxRestarts cap on thick restarts
     * @param tolerance   relative tolerance of the Ritz residual (0 = unit round-off)
     */
    ThickRestartIteration(SparseFactorization chol, DMatrixSparseCSC m, int nev, int wanted, int ncv, int block,
                          int maxRestarts, double tolerance) {
        this.chol = chol;
        this.m = m;
        this.n = m.numCols;
        if (nev < 1 || block < 1 || ncv < nev + 2 * block || ncv > n - block || ncv % block != 0) {
            throw new IllegalArgumentException("need 1 <= nev, nev + 2*block <= ncv <= n - block, ncv a multiple of"
                    + " block, got nev = " + nev
                    + ", block = " + block + ", ncv = " + ncv + ", n = " + n);
        }
        this.nev = nev;
        this.wanted = Math.max(1, Math.min(wanted, nev));
        this.ncv = ncv;
        this.block = block;
        this.maxRestarts = maxRestarts;
        this.tol = tolerance > 0 ? tolerance : UNIT_ROUNDOFF;
        this.identity = isIdentity(m);
        this.v = new double[ncv + block][n];
        this.mv = identity ? v.clone() : new double[ncv + block][n];
        this.spare = new double[ncv][];
        this.spareM = new double[ncv][];
        this.t = new double[ncv][ncv];
        this.r = new double[block][block];
        this.coef = new double[block][ncv + block];
        this.passCoef = new double[block][ncv + block];
        this.rhs = new double[block][];
        this.out = new double[block][];
        this.rNew = new double[block][block];
        this.removed = new double[block];
    }

    /** Runs the iteration from the seeded start block. */
    Result run() {
        for (int c = 0; c < block; c++) {
            randomUnitVector(c);
        }
        int kept = 0;
        for (int restart = 0; ; restart++) {
            int size = extend(kept);
            Projected p = Projected.of(t, size);
            boolean[] conv = new boolean[nev];
            int nconv = 0;
            for (int i = 0; i < nev; i++) {
                double bound = i < wanted ? tol : Math.max(tol, GUARD_TOLERANCE);
                conv[i] = residual(p, size, i) <= bound * p.theta[i];
                nconv += conv[i] ? 1 : 0;
            }
            if (nconv == nev || restart >= maxRestarts) {
                return new Result(Arrays.copyOf(p.theta, nev), ritzVectors(p, size, nev), conv, restart, ops);
            }
            kept = Math.min(nev + Math.min(nconv, (size - nev) / 2), ncv - 2 * block);
            kept += (ncv - kept) % block;
            restartWith(p, size, kept);
        }
    }

    /** ‖OP y_i − θ_i y_i‖_M = ‖R s_i,last‖₂ for the Ritz pair i of the projected matrix of this size. */
    private double residual(Projected p, int size, int i) {
        double sum = 0;
        for (int a = 0; a < block; a++) {
            double x = 0;
            for (int c = 0; c < block; c++) {
                x += r[a][c] * p.s[size - block + c][i];
            }
            sum += x * x;
        }
        return Math.sqrt(sum);
    }

    /**
     * Block steps from the block at {@code start} until the basis is full; returns the basis size s (the
     * next block, W, is then v[s … s+b−1] with coupling r).
     */
    private int extend(int start) {
        int j = start;
        while (true) {
            for (int c = 0; c < block; c++) {
                rhs[c] = mv[j + c];
                out[c] = v[j + block + c];
            }
            chol.solve(rhs, out, block);
            ops += block;
            orthogonalise(out, block, j + block);
            for (int c = 0; c < block; c++) {
                double sq = 0;
                for (int i = 0; i < j + block; i++) {
                    sq += coef[c][i] * coef[c][i];
                }
                removed[c] = sq;
                for (int a = 0; a < block; a++) {
                    t[j + a][j + c] = coef[c][j + a];
                }
                if (!Double.isFinite(sq)) {
                    throw new ConvergenceException(ConvergenceException.Reason.NOT_FINITE,
                            "the Lanczos iteration produced a non-finite value (step " + (j + c) + ")", (int) ops,
                            Double.NaN);
                }
            }
            normaliseBlock(j + block);
            boolean last = j + block == ncv;
            for (int a = 0; a < block; a++) {
                for (int c = 0; c < block; c++) {
                    if (last) {
                        this.r[a][c] = rNew[a][c];
                    } else {
                        t[j + block + a][j + c] = rNew[a][c];
                        t[j + c][j + block + a] = rNew[a][c];
                    }
                }
            }
            if (last) {
                return j + block;
            }
            j += block;
        }
    }

    /**
     * M-orthonormalises the block v[at … at+b−1] (already M-orthogonal to v_0 … v_{at−1}) column by column,
     * filling rNew with the coupling: w_c = Σ_{a ≤ c} q_a rNew[a][c]. A column that vanishes is replaced by a
     * seeded random direction and gets a zero diagonal coupling.
     */
    private void normaliseBlock(int at) {
        for (int c = 0; c < block; c++) {
            Arrays.fill(rNew[c], 0, block, 0.0);
        }
        for (int c = 0; c < block; c++) {
            double[] w = v[at + c];
            double[] mw = mv[at + c];
            applyM(w, mw);
            double before = Math.sqrt(Math.max(0.0, EigenChecks.dot(w, mw)));
            for (int pass = 0; pass < 2; pass++) {
                for (int a = 0; a < c; a++) {
                    double h = EigenChecks.dot(w, mv[at + a]);
                    rNew[a][c] += h;
                    axpy(-h, v[at + a], w);
                }
                if (c > 0) {
                    applyM(w, mw);
                }
            }
            double norm = Math.sqrt(Math.max(0.0, EigenChecks.dot(w, mw)));
            double removedSq = removed[c];
            for (int a = 0; a < c; a++) {
                removedSq += rNew[a][c] * rNew[a][c];
            }
            double sizeBefore = Math.sqrt(removedSq + before * before); // ‖OP v‖_M by Pythagoras
            if (norm <= BREAKDOWN * sizeBefore || norm == 0.0) {
                rNew[c][c] = 0.0;
                randomUnitVector(at + c);
            } else {
                rNew[c][c] = norm;
                scale(1.0 / norm, w, mw);
            }
        }
    }

    /**
     * M-orthogonalises x[0 … nx−1] against v_0 … v_{count−1} by two passes of classical Gram–Schmidt
     * ("twice is enough" unless a vector is numerically in the span, which the caller's breakdown test
     * catches), all nx vectors in one sweep over the basis. The summed coefficients ⟨x_c, v_i⟩ land in
     * coef[c][0..count).
     */
    private void orthogonalise(double[][] x, int nx, int count) {
        for (int c = 0; c < nx; c++) {
            Arrays.fill(coef[c], 0, count, 0.0);
        }
        for (int pass = 0; pass < 2; pass++) {
            BasisOps.dots(mv, count, x, nx, passCoef);
            for (int c = 0; c < nx; c++) {
                for (int i = 0; i < count; i++) {
                    coef[c][i] += passCoef[c][i];
                }
            }
            BasisOps.subtract(v, count, passCoef, x, nx);
        }
    }

    /** out = M x (nothing to do when M = I, where out is x itself). */
    private void applyM(double[] x, double[] out) {
        if (!identity) {
            SparseOps.multiply(m, x, out);
        }
    }

    /** True when a is the identity matrix (exactly: n stored entries, all diagonal, all 1). */
    static boolean isIdentity(DMatrixSparseCSC a) {
        if (a.numRows != a.numCols || a.nz_length != a.numCols) {
            return false;
        }
        for (int c = 0; c < a.numCols; c++) {
            int q = a.col_idx[c];
            if (a.col_idx[c + 1] != q + 1 || a.nz_rows[q] != c || a.nz_values[q] != 1.0) {
                return false;
            }
        }
        return true;
    }

    /** Fills v[index] with a seeded pseudo-random vector, M-orthogonal to v_0 … v_{index−1}, unit M-norm. */
    private void randomUnitVector(int index) {
        for (int attempt = 0; attempt < 5; attempt++) {
            double[] x = v[index];
            fillRandom(x, random);
            applyM(x, mv[index]);
            double raw = Math.sqrt(Math.max(0.0, EigenChecks.dot(x, mv[index])));
            orthogonalise(new double[][] {x}, 1, index);
            applyM(x, mv[index]);
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

    /**
     * x_i uniform in [−1, 1). A method of its own, like the other long loops here: the JIT then compiles this
     * loop alone instead of the whole caller with everything it inlines (randomUnitVector runs once or twice
     * a solve; compiling it whole cost the C2 compiler 0.2 s of CPU in a one-shot 512² run).
     */
    private static void fillRandom(double[] x, SplittableRandom random) {
        for (int i = 0; i < x.length; i++) {
            x[i] = random.nextDouble(-1.0, 1.0);
        }
    }

    /** New basis [y_0 … y_{kept−1}, W], T = diag(θ) with the couplings R s_i,last of W to each y_i. */
    private void restartWith(Projected p, int size, int kept) {
        for (int i = 0; i < kept; i++) {
            if (spare[i] == null) {
                spare[i] = new double[n];
            }
            if (!identity && spareM[i] == null) {
                spareM[i] = new double[n];
            }
        }
        BasisOps.combine(v, size, p.s, kept, spare);
        if (identity) {
            System.arraycopy(spare, 0, spareM, 0, kept);
        } else {
            BasisOps.combine(mv, size, p.s, kept, spareM);
        }
        for (int i = 0; i < kept; i++) {
            double[] y = spare[i];
            double[] my = spareM[i];
            spare[i] = v[i];
            spareM[i] = mv[i];
            v[i] = y;
            mv[i] = my;
        }
        // Move the block W = v[size … size+b−1] to v[kept …]; the vectors there go to W's old slots.
        for (int c = 0; c < block; c++) {
            double[] x = v[kept + c];
            double[] mx = mv[kept + c];
            v[kept + c] = v[size + c];
            mv[kept + c] = mv[size + c];
            v[size + c] = x;
            mv[size + c] = mx;
        }
        for (double[] row : t) {
            Arrays.fill(row, 0.0);
        }
        for (int i = 0; i < kept; i++) {
            t[i][i] = p.theta[i];
            for (int a = 0; a < block; a++) {
                double x = 0;
                for (int c = 0; c < block; c++) {
                    x += r[a][c] * p.s[size - block + c][i];
                }
                t[kept + a][i] = x;
                t[i][kept + a] = x;
            }
        }
    }

    private double[][] ritzVectors(Projected p, int size, int count) {
        double[][] y = new double[count][n];
        BasisOps.combine(v, size, p.s, count, y);
        return y;
    }

    private static void axpy(double a, double[] x, double[] y) {
        for (int i = 0; i < y.length; i++) {
            y[i] += a * x[i];
        }
    }

    private static void scale(double a, double[] x, double[] y) {
        for (int i = 0; i < x.length; i++) {
            x[i] *= a;
        }
        if (y != x) {
            for (int i = 0; i < y.length; i++) {
                y[i] *= a;
            }
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
            Arrays.sort(order, (x, y) -> Double.compare(values[y], values[x]));
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
