package rdstab.solver.eigen;

import dev.ludovic.netlib.arpack.ARPACK;
import java.util.ArrayList;
import java.util.List;
import org.ejml.data.DMatrixSparseCSC;
import org.netlib.util.doubleW;
import org.netlib.util.intW;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.linear.Factorizations;
import rdstab.solver.linear.Ordering;
import rdstab.solver.linear.SparseFactorization;
import rdstab.solver.linear.SymbolicAnalysis;
import rdstab.solver.linear.SparseOps;

/**
 * Rightmost eigenvalues of J x = λ M x (J general sparse, M SPD) by shift-invert Arnoldi with
 * ARPACK's dnaupd/dneupd.
 *
 * <p><b>Operator.</b> ARPACK runs in mode 1 (bmat = "I", which = "LM") on OP = (J − σM)⁻¹M, applied
 * as one sparse LU solve and one product with M. An eigenpair OP x = ν x gives J x = λ M x with
 * λ = σ + 1/ν, so the largest |ν| are the eigenvalues nearest σ.
 *
 * <p><b>Shift.</b> With options.shift() = NaN, σ = b + 0.01·max(1,|b|) where b ≥ Re λ is the
 * Gershgorin/Bendixson bound of {@link SpectrumBounds}. For a real spectrum every λ ≤ b &lt; σ, and the
 * distance σ − λ grows as λ moves left, so the eigenvalues nearest σ are exactly the rightmost. For a
 * complex spectrum this need not hold, so 2k + 2 eigenvalues are computed and sorted by Re, and a
 * certificate is evaluated: every eigenvalue lies in the strip |Im λ| ≤ S (skew-part bound) and left
 * of σ, and every unconverged one lies outside the disc of radius R around σ (R = distance to the
 * farthest converged eigenvalue, by ARPACK's which = "LM" contract). Such an eigenvalue has
 * Re λ ≤ σ − √(R² − S²). Hence if √(R² − (σ − a)²) ≥ S, where a is the real part of the k-th returned
 * eigenvalue, no missed eigenvalue lies right of a and the returned set is the k rightmost
 * ({@link Spectrum#rightmostCertified()}). While the certificate fails (and σ lies right of the proven
 * bound), the count is doubled, up to min(n − 3, 8(k + 1)), reusing the factorization; the last
 * result is returned with certified = false if it still fails. A singular J − σM moves σ by 1e-6·max(1,|σ|)·2^attempt, at
 * most three times, before SINGULAR_SHIFT.
 *
 * <p><b>Stopping.</b> ARPACK stops when every wanted Ritz value satisfies its residual test
 * ‖OP v − ν v‖ ≤ tol·|ν| (tol = options.tolerance(), 0 meaning machine precision). If the restart
 * cap is hit (info = 1) or fewer than the wanted count converge, the run is repeated once with ncv
 * doubled (at most n) and twice the restarts; if fewer than k pairs have then converged,
 * EIGEN_NOT_CONVERGED is thrown saying how many of how many converged. Each returned pair carries its
 * own residual ‖Jx − λMx‖₂/(‖J‖₁‖x‖₂), recomputed in complex arithmetic (ARPACK's estimate is not used).
 *
 * <p><b>Small problems.</b> When n &lt; {@link #DENSE_BELOW} or the internal count does not fit ARPACK's
 * constraint nev + 2 ≤ ncv ≤ n, {@link DenseEigenSolver} is used. Not thread-safe per instance; ARPACK
 * calls are serialised process-wide.
 */
public final class ShiftInvertArnoldi implements EigenSolver {

    /** Problems smaller than this go to the dense solver. */
    public static final int DENSE_BELOW = 50;
    /** Relative size of a shift perturbation after a singular factorization. */
    static final double SHIFT_PERTURBATION = 1e-6;
    /** Number of shift perturbations before giving up. */
    static final int SHIFT_RETRIES = 3;
    /** While uncertified, the Krylov count is doubled up to min(n − 3, ENLARGEMENT_CAP·(k + 1)). */
    static final int ENLARGEMENT_CAP = 8;

    private final Ordering ordering;

    /** With the default ordering ({@link Factorizations#defaultOrdering()}). */
    public ShiftInvertArnoldi() {
        this(Factorizations.defaultOrdering());
    }

    /** With a chosen fill-reducing ordering for the LU of J − σM. */
    public ShiftInvertArnoldi(Ordering ordering) {
        this.ordering = ordering;
    }

    @Override
    public List<EigenPair> rightmost(DMatrixSparseCSC j, DMatrixSparseCSC m, EigenOptions options) {
        return solve(j, m, options).pairs();
    }

    /** Solves and returns the pairs with the evidence (shift used, counts, certificate, timings). */
    public Spectrum solve(DMatrixSparseCSC j, DMatrixSparseCSC m, EigenOptions options) {
        EigenChecks.requireProblem(j, m);
        int n = j.numCols;
        int k = options.count();
        int nev = 2 * k + 2;
        if (n < DENSE_BELOW || nev + 2 > n) {
            return new DenseEigenSolver().solve(j, m, options);
        }
        SpectrumBounds bounds = SpectrumBounds.of(j, m);
        double sigma = Double.isNaN(options.shift()) ? bounds.automaticShift() : options.shift();

        long t0 = System.nanoTime();
        double[] shiftHolder = {sigma, 0.0};
        SparseFactorization lu = factorShifted(j, m, shiftHolder, ordering);
        sigma = shiftHolder[0];
        double orderingSeconds = shiftHolder[1];
        long t1 = System.nanoTime();

        int nevCap = Math.max(nev, Math.min(n - 3, ENLARGEMENT_CAP * (k + 1)));
        long ops = 0;
        int restarts = 0;
        boolean pivoted = false;
        while (true) {
            Run run = converge(lu, m, n, k, nev, options);
            ops += run.operatorApplications;
            restarts += run.restarts;
            List<EigenChecks.Mode> modes = new ArrayList<>();
            double farthest = collect(run, sigma, n, modes);
            List<EigenPair> pairs = EigenChecks.finish(modes, k, j, m);
            if (!pivoted && SymbolicAnalysis.withoutInterchanges(lu) && worstResidual(pairs) > PIVOT_RETRY_RESIDUAL) {
                // the LU without row interchanges passed its backward-error test but the operator near-singular
                // (shift very close to an eigenvalue) amplified its errors: redo with partial pivoting
                pivoted = true;
                double[] again = {sigma, 0.0};
                lu = factorShifted(j, m, again, ordering, true);
                sigma = again[0];
                continue;
            }
            boolean certifiable = bounds.rigorous() && sigma > bounds.reUpper() && pairs.size() >= k;
            boolean certified = false;
            if (certifiable) {
                double gap = sigma - pairs.get(k - 1).re();
                double reach = farthest * farthest - gap * gap;
                certified = reach >= 0 && Math.sqrt(reach) >= bounds.imBound();
            }
            if (certified || !certifiable || nev >= nevCap) {
                long t2 = System.nanoTime();
                return new Spectrum(pairs, sigma, k, run.converged, ops, restarts, certified,
                        bounds.rigorous() ? bounds.imBound() : Double.NaN, "arnoldi", (t1 - t0) * 1e-9 - orderingSeconds,
                        (t2 - t1) * 1e-9, orderingSeconds, lu.nonZerosOfFactors());
            }
            nev = Math.min(nevCap, 2 * nev);
        }
    }

    /** Eigenpair residual above which the solve is repeated on a pivoted LU (well above a good solve's 1e-14). */
    static final double PIVOT_RETRY_RESIDUAL = 1e-10;

    private static double worstResidual(List<EigenPair> pairs) {
        double w = 0;
        for (EigenPair p : pairs) {
            w = Math.max(w, p.residual());
        }
        return w;
    }

    /** One ARPACK run, repeated once with a doubled subspace and restart cap when it falls short. */
    private static Run converge(SparseFactorization lu, DMatrixSparseCSC m, int n, int k, int nev, EigenOptions options) {
        int ncv = initialSubspace(options, nev, n);
        int restarts = options.maxRestarts();
        Run run = iterate(lu, m, n, nev, ncv, restarts, options.tolerance());
        if (run.info != 0 || run.converged < nev) {
            run = iterate(lu, m, n, nev, Math.min(n, 2 * ncv), 2 * restarts, options.tolerance());
        }
        if (run.converged < k || run.dr == null) {
            throw new ConvergenceException(ConvergenceException.Reason.EIGEN_NOT_CONVERGED,
                    "Shift-invert Arnoldi converged " + run.converged + " of " + nev + " eigenvalues (" + k
                            + " requested) after " + run.restarts + " restarts, also with a doubled subspace ("
                            + ArpackSupport.describeIteration("dnaupd", run.info) + ").",
                    run.restarts, Double.NaN);
        }
        return run;
    }

    /**
     * Maps converged Ritz pairs ν to λ = σ + 1/ν, appending one mode per real eigenvalue or conjugate
     * pair; returns the largest |λ − σ| found.
     */
    private static double collect(Run run, double sigma, int n, List<EigenChecks.Mode> modes) {
        double farthest = 0.0;
        for (int c = 0; c < run.converged; c++) {
            double nr = run.dr[c];
            double ni = run.di[c];
            double[] zr = column(run.z, n, c);
            if (ni == 0.0) {
                double lam = sigma + 1.0 / nr;
                modes.add(new EigenChecks.Mode(lam, 0.0, zr, new double[n]));
                farthest = Math.max(farthest, Math.abs(lam - sigma));
            } else if (c + 1 < run.dr.length) {
                // columns c, c+1 hold Re and Im of the vector of ν = nr + i|ni| (dneupd convention);
                // λ = σ + conj(ν)/|ν|² has Im λ = −|ν_i|/|ν|² for that vector, so keep the conjugate
                double[] zi = column(run.z, n, c + 1);
                double anu = Math.abs(ni);
                double d = nr * nr + anu * anu;
                double lr = sigma + nr / d;
                double li = anu / d;
                modes.add(new EigenChecks.Mode(lr, li, zr, EigenChecks.negate(zi)));
                farthest = Math.max(farthest, Math.hypot(lr - sigma, li));
                c++;
            }
        }
        return farthest;
    }

    /** LU of J − σM; on SINGULAR_SHIFT moves σ (holder[0]) and retries. */
    static SparseFactorization factorShifted(DMatrixSparseCSC j, DMatrixSparseCSC m, double[] holder, Ordering ordering) {
        return factorShifted(j, m, holder, ordering, false);
    }

    /** As {@link #factorShifted(DMatrixSparseCSC, DMatrixSparseCSC, double[], Ordering)}, optionally with row pivoting. */
    static SparseFactorization factorShifted(DMatrixSparseCSC j, DMatrixSparseCSC m, double[] holder, Ordering ordering,
                                             boolean pivoted) {
        double sigma0 = holder[0];
        ConvergenceException last = null;
        for (int attempt = 0; attempt <= SHIFT_RETRIES; attempt++) {
            double sigma = attempt == 0 ? sigma0
                    : sigma0 + SHIFT_PERTURBATION * Math.max(1.0, Math.abs(sigma0)) * (1 << (attempt - 1));
            try {
                DMatrixSparseCSC shifted = SparseOps.add(1.0, j, -sigma, m);
                long ta = System.nanoTime();
                SymbolicAnalysis analysis = Factorizations.analysis(shifted, false, ordering);
                if (holder.length > 1) {
                    holder[1] += (System.nanoTime() - ta) * 1e-9;
                }
                SparseFactorization f = pivoted ? analysis.factorPivoted(shifted) : analysis.factor(shifted);
                holder[0] = sigma;
                return f;
            } catch (ConvergenceException e) {
                if (e.reason() != ConvergenceException.Reason.SINGULAR_SHIFT) {
                    throw e;
                }
                last = e;
            }
        }
        throw new ConvergenceException(ConvergenceException.Reason.SINGULAR_SHIFT,
                "J - sigma*M stayed singular for sigma = " + sigma0 + " and " + SHIFT_RETRIES
                        + " small perturbations of it.", -1, Double.NaN, last);
    }

    static int initialSubspace(EigenOptions options, int nev, int n) {
        int ncv = options.subspace() > 0 ? options.subspace() : Math.max(2 * nev + 1, 20);
        return Math.min(n, Math.max(ncv, nev + 2));
    }

    private static double[] column(double[] z, int n, int c) {
        double[] out = new double[n];
        System.arraycopy(z, c * n, out, 0, n);
        return out;
    }

    /** Raw output of one dnaupd/dneupd run. */
    private record Run(int info, int converged, int restarts, long operatorApplications, double[] dr, double[] di,
                       double[] z) {
    }

    private static Run iterate(SparseFactorization lu, DMatrixSparseCSC m, int n, int nev, int ncv, int maxRestarts,
                               double tolerance) {
        synchronized (ArpackSupport.LOCK) {
            ARPACK arpack = ArpackSupport.arpack();
            intW ido = new intW(0);
            intW info = new intW(1); // 1: resid holds our starting vector
            doubleW tol = new doubleW(tolerance);
            double[] resid = new double[n];
            ArpackSupport.startVector(resid);
            double[] v = new double[n * ncv];
            int[] iparam = new int[ArpackSupport.IPARAM_LENGTH];
            int[] ipntr = new int[ArpackSupport.IPNTR_LENGTH];
            double[] workd = new double[3 * n];
            int lworkl = 3 * ncv * ncv + 6 * ncv;
            double[] workl = new double[lworkl];
            iparam[ArpackSupport.ISHIFT] = 1;
            iparam[ArpackSupport.MXITER] = maxRestarts;
            iparam[ArpackSupport.NB] = 1;
            iparam[ArpackSupport.MODE] = 1;
            double[] x = new double[n];
            double[] mx = new double[n];
            double[] y = new double[n];
            while (true) {
                arpack.dnaupd(ido, "I", n, "LM", nev, tol, resid, ncv, v, n, iparam, ipntr, workd, workl, lworkl, info);
                if (ido.val != ArpackSupport.IDO_FIRST && ido.val != ArpackSupport.IDO_APPLY_OP) {
                    break;
                }
                int xo = ipntr[ArpackSupport.IPNTR_X] - 1;
                int yo = ipntr[ArpackSupport.IPNTR_Y] - 1;
                System.arraycopy(workd, xo, x, 0, n);
                SparseOps.multiply(m, x, mx);
                lu.solve(mx, y);
                System.arraycopy(y, 0, workd, yo, n);
            }
            int restarts = iparam[ArpackSupport.MXITER];
            long ops = iparam[ArpackSupport.NUMOP];
            if (info.val == 3 || (info.val == 1 && iparam[ArpackSupport.NCONV] == 0)) {
                return new Run(info.val, iparam[ArpackSupport.NCONV], restarts, ops, null, null, null);
            }
            if (info.val != 0 && info.val != 1) {
                throw new ConvergenceException(ConvergenceException.Reason.EIGEN_NOT_CONVERGED,
                        ArpackSupport.describeIteration("dnaupd", info.val), restarts, Double.NaN);
            }
            boolean[] select = new boolean[ncv];
            // dneupd can return more values than nev + 1, the size its documentation gives for DR, DI and Z: dnaup2
            // may report more than nev converged (it enlarges nev against stagnation), and the reordering of the Schur
            // form in this ARPACK version counts the selected values again (arpack-ng issue 465; here an overflow on a
            // strongly convective operator). As dneupd's own note on that case advises, DR and DI get room for ncv
            // values and Z shares V (allowed when the Arnoldi basis is not needed afterwards), which has ncv columns.
            double[] dr = new double[ncv + 1];
            double[] di = new double[ncv + 1];
            double[] z = v;
            double[] workev = new double[3 * ncv];
            intW einfo = new intW(0);
            arpack.dneupd(true, "A", select, dr, di, z, n, 0.0, 0.0, workev, "I", n, "LM", new intW(nev), tol.val, resid, ncv, v,
                    n, iparam, ipntr, workd, workl, lworkl, einfo);
            if (einfo.val != 0) {
                throw new ConvergenceException(ConvergenceException.Reason.EIGEN_NOT_CONVERGED,
                        ArpackSupport.describeNonsymmetricPost(einfo.val), restarts, Double.NaN);
            }
            return new Run(info.val, iparam[ArpackSupport.NCONV], restarts, ops, dr, di, z);
        }
    }
}
