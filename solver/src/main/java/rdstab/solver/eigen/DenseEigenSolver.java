package rdstab.solver.eigen;

import java.util.ArrayList;
import java.util.List;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.data.ZMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_ZDRM;
import org.ejml.interfaces.decomposition.CholeskyDecomposition_F64;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.ejml.interfaces.linsol.LinearSolverDense;
import org.ejml.ops.DConvertMatrixStruct;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.linear.SparseOps;

/**
 * All eigenvalues of J x = λ M x by a dense QR algorithm (EJML), for small n and as a test oracle.
 *
 * <p>Reduction to a standard problem: diagonal M → A = M^{-1/2} J M^{-1/2}, x = M^{-1/2} y; general SPD
 * M = L Lᵀ → A = L⁻¹ J L⁻ᵀ, x = L⁻ᵀ y. Symmetric J (options.symmetric) uses EJML's symmetric
 * eigensolver on (A + Aᵀ)/2; otherwise the general one. EJML returns no eigenvectors for complex
 * eigenvalues, so those (and any EJML leaves out) are computed by two steps of complex inverse
 * iteration with the shift λ(1 + 1e-10), only for the modes returned. Cost O(n³) time, O(n²) memory.
 * The shift in the options is ignored (there is no shift).
 */
public final class DenseEigenSolver implements EigenSolver {

    @Override
    public List<EigenPair> rightmost(DMatrixSparseCSC j, DMatrixSparseCSC m, EigenOptions options) {
        return solve(j, m, options).pairs();
    }

    /** Solves and reports the evidence; computed = n, always certified. */
    public Spectrum solve(DMatrixSparseCSC j, DMatrixSparseCSC m, EigenOptions options) {
        EigenChecks.requireProblem(j, m);
        long t0 = System.nanoTime();
        int n = j.numCols;
        DMatrixRMaj a = DConvertMatrixStruct.convert(j, (DMatrixRMaj) null);
        DMatrixRMaj back; // x = back · y
        if (SparseOps.isDiagonal(m)) {
            double[] d = SparseOps.diagonal(m);
            back = new DMatrixRMaj(n, n);
            for (int i = 0; i < n; i++) {
                if (!(d[i] > 0)) {
                    throw new IllegalArgumentException("M must be positive definite; diagonal entry " + i + " is " + d[i]);
                }
                back.set(i, i, 1.0 / Math.sqrt(d[i]));
            }
        } else {
            DMatrixRMaj md = DConvertMatrixStruct.convert(m, (DMatrixRMaj) null);
            CholeskyDecomposition_F64<DMatrixRMaj> chol = DecompositionFactory_DDRM.chol(n, true);
            if (!chol.decompose(md)) {
                throw new IllegalArgumentException("M is not positive definite (dense Cholesky failed)");
            }
            DMatrixRMaj lower = chol.getT(null);
            DMatrixRMaj linv = lower.copy();
            CommonOps_DDRM.invert(linv);
            back = new DMatrixRMaj(n, n);
            CommonOps_DDRM.transpose(linv, back);
        }
        DMatrixRMaj tmp = new DMatrixRMaj(n, n);
        CommonOps_DDRM.mult(a, back, tmp);
        DMatrixRMaj std = new DMatrixRMaj(n, n);
        CommonOps_DDRM.multTransA(back, tmp, std);
        if (options.symmetric()) {
            DMatrixRMaj t = new DMatrixRMaj(n, n);
            CommonOps_DDRM.transpose(std, t);
            CommonOps_DDRM.add(0.5, std, 0.5, t, std);
        }
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(n, true, options.symmetric());
        if (!eig.decompose(std.copy())) {
            throw new ConvergenceException(ConvergenceException.Reason.EIGEN_NOT_CONVERGED,
                    "The dense QR eigen-algorithm did not converge for n = " + n + ".", -1, Double.NaN);
        }
        List<Integer> order = new ArrayList<>();
        for (int i = 0; i < eig.getNumberOfEigenvalues(); i++) {
            Complex_F64 v = eig.getEigenvalue(i);
            if (!Double.isFinite(v.real) || !Double.isFinite(v.imaginary)) {
                throw new ConvergenceException(ConvergenceException.Reason.NOT_FINITE,
                        "The dense eigen-algorithm produced a non-finite eigenvalue.", -1, Double.NaN);
            }
            if (v.imaginary >= 0) {
                order.add(i);
            }
        }
        order.sort((p, q) -> {
            Complex_F64 u = eig.getEigenvalue(p);
            Complex_F64 v = eig.getEigenvalue(q);
            int c = Double.compare(v.real, u.real);
            return c != 0 ? c : Double.compare(v.imaginary, u.imaginary);
        });
        List<EigenChecks.Mode> modes = new ArrayList<>();
        int covered = 0;
        for (int idx : order) {
            if (covered >= options.count()) {
                break;
            }
            Complex_F64 lam = eig.getEigenvalue(idx);
            double[] yr = new double[n];
            double[] yi = new double[n];
            DMatrixRMaj vec = lam.imaginary == 0 ? eig.getEigenVector(idx) : null;
            if (vec != null) {
                System.arraycopy(vec.data, 0, yr, 0, n);
            } else {
                inverseIteration(std, lam.real, lam.imaginary, yr, yi);
            }
            double[] xr = new double[n];
            double[] xi = new double[n];
            multiply(back, yr, xr);
            multiply(back, yi, xi);
            EigenChecks.Mode mode = new EigenChecks.Mode(lam.real, lam.imaginary, xr, xi);
            modes.add(mode);
            covered += mode.multiplicity();
        }
        List<EigenPair> pairs = EigenChecks.finish(modes, options.count(), j, m);
        double seconds = (System.nanoTime() - t0) * 1e-9;
        return new Spectrum(pairs, Double.NaN, options.count(), n, 0, 0, true, Double.NaN, "dense", 0.0, seconds);
    }

    /** Two steps of inverse iteration on A − μI, μ = λ(1 + 1e-10) + tiny, in complex arithmetic. */
    private static void inverseIteration(DMatrixRMaj a, double re, double im, double[] yr, double[] yi) {
        int n = a.numRows;
        double mag = Math.max(1.0, Math.hypot(re, im));
        double muRe = re + 1e-10 * mag;
        ZMatrixRMaj shifted = new ZMatrixRMaj(n, n);
        for (int r = 0; r < n; r++) {
            for (int c = 0; c < n; c++) {
                double v = a.get(r, c);
                shifted.set(r, c, r == c ? v - muRe : v, r == c ? -im : 0.0);
            }
        }
        LinearSolverDense<ZMatrixRMaj> lu = LinearSolverFactory_ZDRM.lu(n);
        if (!lu.setA(shifted)) {
            throw new ConvergenceException(ConvergenceException.Reason.SINGULAR_SHIFT,
                    "Inverse iteration for an eigenvector met a singular shifted matrix.", -1, Double.NaN);
        }
        ZMatrixRMaj b = new ZMatrixRMaj(n, 1);
        ZMatrixRMaj x = new ZMatrixRMaj(n, 1);
        java.util.SplittableRandom rnd = new java.util.SplittableRandom(7L);
        for (int i = 0; i < n; i++) {
            b.set(i, 0, rnd.nextDouble(-1, 1), rnd.nextDouble(-1, 1));
        }
        for (int step = 0; step < 2; step++) {
            lu.solve(b, x);
            double norm = 0.0;
            for (int i = 0; i < 2 * n; i++) {
                norm = Math.max(norm, Math.abs(x.data[i]));
            }
            for (int i = 0; i < 2 * n; i++) {
                b.data[i] = x.data[i] / norm;
            }
        }
        for (int i = 0; i < n; i++) {
            yr[i] = b.data[2 * i];
            yi[i] = b.data[2 * i + 1];
        }
    }

    private static void multiply(DMatrixRMaj a, double[] x, double[] y) {
        int n = a.numRows;
        for (int r = 0; r < n; r++) {
            double s = 0.0;
            for (int c = 0; c < a.numCols; c++) {
                s += a.get(r, c) * x[c];
            }
            y[r] = s;
        }
    }
}
