package rdstab.mesh.assembly;

import java.util.Arrays;

import org.ejml.data.DMatrixRMaj;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.ejml.ops.DConvertMatrixStruct;

/** Test oracle: dense EJML eigenvalues of the symmetric pencil J x = λ M x with diagonal M. */
final class Spectra {

    private Spectra() {
    }

    /** Eigenvalues of M^{-1/2} J M^{-1/2} (J symmetrised as (J + Jᵀ)/2), sorted descending. */
    static double[] symmetricPencil(Discretization d, double[] u) {
        DMatrixRMaj j = DConvertMatrixStruct.convert(d.jacobian(u), (DMatrixRMaj) null);
        DMatrixSparseCSC m = d.mass();
        int n = j.numRows;
        DMatrixRMaj a = new DMatrixRMaj(n, n);
        for (int r = 0; r < n; r++) {
            for (int c = 0; c < n; c++) {
                double v = 0.5 * (j.get(r, c) + j.get(c, r));
                a.set(r, c, v / Math.sqrt(m.get(r, r) * m.get(c, c)));
            }
        }
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(n, false, true);
        if (!eig.decompose(a)) {
            throw new IllegalStateException("EJML eigen-decomposition failed");
        }
        double[] lam = new double[n];
        for (int i = 0; i < n; i++) {
            lam[i] = eig.getEigenvalue(i).getReal();
        }
        Arrays.sort(lam);
        double[] desc = new double[n];
        for (int i = 0; i < n; i++) {
            desc[i] = lam[n - 1 - i];
        }
        return desc;
    }

    /** Largest asymmetry max |J − Jᵀ| relative to max |J|. */
    static double asymmetry(DMatrixSparseCSC j) {
        DMatrixRMaj d = DConvertMatrixStruct.convert(j, (DMatrixRMaj) null);
        double max = 0;
        double asym = 0;
        for (int r = 0; r < d.numRows; r++) {
            for (int c = 0; c < d.numCols; c++) {
                max = Math.max(max, Math.abs(d.get(r, c)));
                asym = Math.max(asym, Math.abs(d.get(r, c) - d.get(c, r)));
            }
        }
        return asym / max;
    }

    /** Observed order log(e1/e2)/log(h1/h2). */
    static double order(double e1, double e2, double ratio) {
        return Math.log(Math.abs(e1 / e2)) / Math.log(ratio);
    }
}
