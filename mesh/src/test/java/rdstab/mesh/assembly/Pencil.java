package rdstab.mesh.assembly;

import java.util.Arrays;

import org.ejml.data.DMatrixRMaj;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.CholeskyDecomposition_F64;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.ejml.ops.DConvertMatrixStruct;

/**
 * Test oracle for symmetric pencils J x = λ M x with any SPD M (consistent or lumped): EJML dense
 * Cholesky M = L Lᵀ and the dense symmetric eigen-decomposition of L⁻¹ J L⁻ᵀ (an algorithm
 * independent of our sparse path). Also reports the largest relative residual
 * ‖J x − λ M x‖ / (‖J‖_F ‖x‖) over the {@link #CHECKED} rightmost pairs.
 */
final class Pencil {

    /** Number of rightmost pairs whose vectors and residuals are formed. */
    static final int CHECKED = 8;

    final double[] values;      // descending
    final DMatrixRMaj vectors;  // columns, in the order of values (the first CHECKED only)
    final double maxResidual;

    private Pencil(double[] values, DMatrixRMaj vectors, double maxResidual) {
        this.values = values;
        this.vectors = vectors;
        this.maxResidual = maxResidual;
    }

    static Pencil of(DMatrixSparseCSC jSparse, DMatrixSparseCSC mSparse) {
        DMatrixRMaj j = DConvertMatrixStruct.convert(jSparse, (DMatrixRMaj) null);
        DMatrixRMaj m = DConvertMatrixStruct.convert(mSparse, (DMatrixRMaj) null);
        int n = j.numRows;
        DMatrixRMaj js = new DMatrixRMaj(n, n);
        CommonOps_DDRM.transpose(j, js);
        CommonOps_DDRM.add(0.5, j, 0.5, js, js);
        CholeskyDecomposition_F64<DMatrixRMaj> chol = DecompositionFactory_DDRM.chol(n, true);
        DMatrixRMaj mc = m.copy();
        if (!chol.decompose(mc)) {
            throw new IllegalStateException("M is not positive definite");
        }
        DMatrixRMaj l = chol.getT(null);
        DMatrixRMaj li = new DMatrixRMaj(n, n);
        CommonOps_DDRM.invert(l, li);
        DMatrixRMaj tmp = new DMatrixRMaj(n, n);
        DMatrixRMaj a = new DMatrixRMaj(n, n);
        CommonOps_DDRM.mult(li, js, tmp);
        CommonOps_DDRM.multTransB(tmp, li, a);
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(n, true, true);
        if (!eig.decompose(a)) {
            throw new IllegalStateException("EJML eigen-decomposition failed");
        }
        Integer[] order = new Integer[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (p, q) -> Double.compare(eig.getEigenvalue(q).getReal(), eig.getEigenvalue(p).getReal()));
        double[] lam = new double[n];
        DMatrixRMaj vec = new DMatrixRMaj(n, n);
        DMatrixRMaj lit = new DMatrixRMaj(n, n);
        CommonOps_DDRM.transpose(li, lit);
        double normJ = NormOps_DDRM.normF(j);
        double worst = 0;
        DMatrixRMaj x = new DMatrixRMaj(n, 1);
        DMatrixRMaj r1 = new DMatrixRMaj(n, 1);
        DMatrixRMaj r2 = new DMatrixRMaj(n, 1);
        for (int k = 0; k < n; k++) {
            lam[k] = eig.getEigenvalue(order[k]).getReal();
            if (k >= CHECKED) {
                continue;
            }
            CommonOps_DDRM.mult(lit, eig.getEigenVector(order[k]), x);
            for (int r = 0; r < n; r++) {
                vec.set(r, k, x.get(r));
            }
            CommonOps_DDRM.mult(j, x, r1);
            CommonOps_DDRM.mult(m, x, r2);
            CommonOps_DDRM.add(r1, -lam[k], r2, r1);
            worst = Math.max(worst, NormOps_DDRM.normF(r1) / (normJ * NormOps_DDRM.normF(x)));
        }
        return new Pencil(lam, vec, worst);
    }

    /** Observed order log(e1/e2)/log(ratio). */
    static double order(double e1, double e2, double ratio) {
        return Math.log(Math.abs(e1 / e2)) / Math.log(ratio);
    }
}
