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
import rdstab.solver.linear.SymbolicAnalysis;
import rdstab.solver.linear.SparseFactorization;
import rdstab.solver.linear.SparseOps;

/**
 * Rightmost eigenvalues of J x = λ M x for symmetric J and SPD M by shift-invert Lanczos with
 * ARPACK's dsaupd/dseupd in mode 3.
 *
 * <p><b>Operator.</b> bmat = "G" with B = M, OP = (J − σM)⁻¹M, which = "LM"; OP is self-adjoint in the
 * M inner product, the spectrum is real, and dseupd maps the Ritz values back to λ = σ + 1/ν.
 * σ must lie strictly above the spectrum so that σM − J is positive definite: it is factorized by
 * sparse Cholesky and OP x = −(σM − J)⁻¹ M x. Because every λ &lt; σ, the eigenvalues nearest σ are the
 * rightmost, and the result is certified whenever σ exceeds the rigorous bound of
 * {@link SpectrumBounds}. With options.shift() = NaN, σ = bound + 0.01·max(1,|bound|). A user shift
 * that is not above the spectrum makes the Cholesky fail; σ is then raised by 1e-6·max(1,|σ|)·2^attempt
 * up to three times, then SINGULAR_SHIFT is thrown (use {@link ShiftInvertArnoldi} for interior shifts).
 *
 * <p><b>Stopping.</b> ARPACK's Ritz residual test with tol = options.tolerance() (0 = machine
 * precision); k + 2 Ritz values are computed so that a multiple eigenvalue at the edge of the wanted set
 * is not cut. Restart cap reached → one retry with ncv doubled and twice the restarts, then
 * EIGEN_NOT_CONVERGED with the converged count. Residuals ‖Jx − λMx‖₂/(‖J‖₁‖x‖₂) are recomputed.
 * Small problems (n &lt; {@link ShiftInvertArnoldi#DENSE_BELOW}) go to {@link DenseEigenSolver}.
 */
public final class ShiftInvertLanczos implements EigenSolver {

    private final Ordering ordering;

    /** With the default ordering ({@link Factorizations#defaultOrdering()}). */
    public ShiftInvertLanczos() {
        this(Factorizations.defaultOrdering());
    }

    /** With a chosen fill-reducing ordering for the Cholesky of σM − J. */
    public ShiftInvertLanczos(Ordering ordering) {
        this.ordering = ordering;
    }

    @Override
    public List<EigenPair> rightmost(DMatrixSparseCSC j, DMatrixSparseCSC m, EigenOptions options) {
        return solve(j, m, options).pairs();
    }

    /** Solves and returns the pairs with the evidence. */
    public Spectrum solve(DMatrixSparseCSC j, DMatrixSparseCSC m, EigenOptions options) {
        EigenChecks.requireProblem(j, m);
        int n = j.numCols;
        int k = options.count();
        int nev = k + 2;
        if (n < ShiftInvertArnoldi.DENSE_BELOW || nev + 1 > n) {
            return new DenseEigenSolver().solve(j, m, options.symmetric() ? options
                    : new EigenOptions(k, options.shift(), true, options.tolerance(), options.maxRestarts(), options.subspace()));
        }
        SpectrumBounds bounds = SpectrumBounds.of(j, m);
        double sigma0 = Double.isNaN(options.shift()) ? bounds.automaticShift() : options.shift();

        long t0 = System.nanoTime();
        SparseFactorization chol = null;
        double sigma = sigma0;
        ConvergenceException last = null;
        double orderingSeconds = 0;
        for (int attempt = 0; attempt <= ShiftInvertArnoldi.SHIFT_RETRIES && chol == null; attempt++) {
            sigma = attempt == 0 ? sigma0 : sigma0 + ShiftInvertArnoldi.SHIFT_PERTURBATION
                    * Math.max(1.0, Math.abs(sigma0)) * (1 << (attempt - 1));
            try {
                DMatrixSparseCSC shifted = SparseOps.add(sigma, m, -1.0, j);
                long ta = System.nanoTime();
                SymbolicAnalysis analysis = Factorizations.analysis(shifted, true, ordering);
                orderingSeconds += (System.nanoTime() - ta) * 1e-9;
                chol = analysis.factor(shifted);
            } catch (ConvergenceException e) {
                if (e.reason() != ConvergenceException.Reason.SINGULAR_SHIFT) {
                    throw e;
                }
                last = e;
            }
        }
        if (chol == null) {
            throw new ConvergenceException(ConvergenceException.Reason.SINGULAR_SHIFT,
                    "sigma*M - J is not positive definite for sigma = " + sigma0
                            + " (or small raises of it): the Lanczos shift must lie above the spectrum.",
                    -1, Double.NaN, last);
        }
        long t1 = System.nanoTime();

        int ncv = Math.min(n, Math.max(options.subspace() > 0 ? options.subspace() : Math.max(2 * nev + 1, 20), nev + 1));
        Run run = iterate(chol, m, n, nev, ncv, options.maxRestarts(), options.tolerance(), sigma);
        if (run.info != 0 || run.converged < nev) {
            run = iterate(chol, m, n, nev, Math.min(n, 2 * ncv), 2 * options.maxRestarts(), options.tolerance(), sigma);
        }
        if (run.converged < k || run.d == null) {
            throw new ConvergenceException(ConvergenceException.Reason.EIGEN_NOT_CONVERGED,
                    "Shift-invert Lanczos converged " + run.converged + " of " + nev + " eigenvalues (" + k
                            + " requested) after " + run.restarts + " restarts, also with a doubled subspace ("
                            + ArpackSupport.describeIteration("dsaupd", run.info) + ").", run.restarts, Double.NaN);
        }
        List<EigenChecks.Mode> modes = new ArrayList<>();
        for (int c = 0; c < run.converged; c++) {
            double[] zc = new double[n];
            System.arraycopy(run.z, c * n, zc, 0, n);
            modes.add(new EigenChecks.Mode(run.d[c], 0.0, zc, new double[n]));
        }
        List<EigenPair> pairs = EigenChecks.finish(modes, k, j, m);
        boolean certified = bounds.rigorous() && sigma > bounds.reUpper();
        long t2 = System.nanoTime();
        return new Spectrum(pairs, sigma, k, run.converged, run.operatorApplications, run.restarts, certified,
                bounds.rigorous() ? bounds.imBound() : Double.NaN, "lanczos", (t1 - t0) * 1e-9 - orderingSeconds,
                (t2 - t1) * 1e-9, orderingSeconds, chol.nonZerosOfFactors());
    }

    private record Run(int info, int converged, int restarts, long operatorApplications, double[] d, double[] z) {
    }

    private static Run iterate(SparseFactorization chol, DMatrixSparseCSC m, int n, int nev, int ncv, int maxRestarts,
                               double tolerance, double sigma) {
        synchronized (ArpackSupport.LOCK) {
            ARPACK arpack = ArpackSupport.arpack();
            intW ido = new intW(0);
            intW info = new intW(1);
            doubleW tol = new doubleW(tolerance);
            double[] resid = new double[n];
            ArpackSupport.startVector(resid);
            double[] v = new double[n * ncv];
            int[] iparam = new int[ArpackSupport.IPARAM_LENGTH];
            int[] ipntr = new int[ArpackSupport.IPNTR_LENGTH];
            double[] workd = new double[3 * n];
            int lworkl = ncv * ncv + 8 * ncv;
            double[] workl = new double[lworkl];
            iparam[ArpackSupport.ISHIFT] = 1;
            iparam[ArpackSupport.MXITER] = maxRestarts;
            iparam[ArpackSupport.NB] = 1;
            iparam[ArpackSupport.MODE] = 3;
            double[] x = new double[n];
            double[] bx = new double[n];
            double[] y = new double[n];
            while (true) {
                arpack.dsaupd(ido, "G", n, "LM", nev, tol, resid, ncv, v, n, iparam, ipntr, workd, workl, lworkl, info);
                int xo = ipntr[ArpackSupport.IPNTR_X] - 1;
                int yo = ipntr[ArpackSupport.IPNTR_Y] - 1;
                if (ido.val == ArpackSupport.IDO_FIRST) {
                    System.arraycopy(workd, xo, x, 0, n);
                    SparseOps.multiply(m, x, bx);
                    applyInverse(chol, bx, y, workd, yo, n);
                } else if (ido.val == ArpackSupport.IDO_APPLY_OP) {
                    System.arraycopy(workd, ipntr[ArpackSupport.IPNTR_BX] - 1, bx, 0, n);
                    applyInverse(chol, bx, y, workd, yo, n);
                } else if (ido.val == ArpackSupport.IDO_APPLY_B) {
                    System.arraycopy(workd, xo, x, 0, n);
                    SparseOps.multiply(m, x, y);
                    System.arraycopy(y, 0, workd, yo, n);
                } else {
                    break;
                }
            }
            int restarts = iparam[ArpackSupport.MXITER];
            long ops = iparam[ArpackSupport.NUMOP];
            int nconv = iparam[ArpackSupport.NCONV];
            if (info.val == 3 || (info.val == 1 && nconv == 0)) {
                return new Run(info.val, nconv, restarts, ops, null, null);
            }
            if (info.val != 0 && info.val != 1) {
                throw new ConvergenceException(ConvergenceException.Reason.EIGEN_NOT_CONVERGED,
                        ArpackSupport.describeIteration("dsaupd", info.val), restarts, Double.NaN);
            }
            boolean[] select = new boolean[ncv];
            // dsaup2 may report more than nev converged (it enlarges nev against stagnation) and dseupd then returns
            // that many values and vectors, more than the nev its documentation sizes D and Z for (the overflow
            // ShiftInvertArnoldi met in dneupd): D gets room for all ncv, and Z is V itself, which the documentation
            // allows when the Lanczos basis is not needed afterwards
            double[] d = new double[ncv];
            double[] z = v;
            intW einfo = new intW(0);
            arpack.dseupd(true, "A", select, d, z, n, sigma, "G", n, "LM", new intW(nev), tol.val, resid, ncv, v, n,
                    iparam, ipntr, workd, workl, lworkl, einfo);
            if (einfo.val != 0) {
                throw new ConvergenceException(ConvergenceException.Reason.EIGEN_NOT_CONVERGED,
                        ArpackSupport.describeSymmetricPost(einfo.val), restarts, Double.NaN);
            }
            return new Run(info.val, iparam[ArpackSupport.NCONV], restarts, ops, d, z);
        }
    }

    /** y = −(σM − J)⁻¹ b = (J − σM)⁻¹ b, written to workd at yo. */
    private static void applyInverse(SparseFactorization chol, double[] b, double[] y, double[] workd, int yo, int n) {
        chol.solve(b, y);
        for (int i = 0; i < n; i++) {
            workd[yo + i] = -y[i];
        }
    }
}
