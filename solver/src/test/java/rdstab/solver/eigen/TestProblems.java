package rdstab.solver.eigen;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.data.DMatrixSparseTriplet;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.ejml.ops.DConvertMatrixStruct;

/** Test matrices built from their textbook definitions, and an independent dense oracle. */
final class TestProblems {

    private TestProblems() {
    }

    static DMatrixSparseCSC csc(DMatrixSparseTriplet t) {
        return DConvertMatrixStruct.convert(t, (DMatrixSparseCSC) null);
    }

    static DMatrixSparseCSC diagonal(double[] d) {
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(d.length, d.length, d.length);
        for (int i = 0; i < d.length; i++) {
            t.addItem(i, i, d[i]);
        }
        return csc(t);
    }

    static DMatrixSparseCSC identity(int n) {
        double[] d = new double[n];
        java.util.Arrays.fill(d, 1.0);
        return diagonal(d);
    }

    /** Tridiagonal Toeplitz (sub, diag, sup). */
    static DMatrixSparseCSC tridiagonal(int n, double sub, double diag, double sup) {
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, 3 * n);
        for (int i = 0; i < n; i++) {
            t.addItem(i, i, diag);
            if (i > 0) {
                t.addItem(i, i - 1, sub);
            }
            if (i + 1 < n) {
                t.addItem(i, i + 1, sup);
            }
        }
        return csc(t);
    }

    /** u'' on (0, len), Dirichlet, n interior points, h = len/(n+1): (1, −2, 1)/h². */
    static DMatrixSparseCSC laplacian1d(int n, double len) {
        double h = len / (n + 1);
        return tridiagonal(n, 1 / (h * h), -2 / (h * h), 1 / (h * h));
    }

    /** Discrete Dirichlet eigenvalue −(4/h²) sin²(pπh/(2L)) (separation of variables on the grid). */
    static double laplacian1dEigenvalue(int p, int n, double len) {
        double h = len / (n + 1);
        double s = Math.sin(p * Math.PI * h / (2 * len));
        return -4 / (h * h) * s * s;
    }

    /** 5-point Laplacian on the unit square, N×N interior points, lexicographic order. */
    static DMatrixSparseCSC laplacian2d(int nn) {
        double h = 1.0 / (nn + 1);
        double c = 1 / (h * h);
        int n = nn * nn;
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, 5 * n);
        for (int iy = 0; iy < nn; iy++) {
            for (int ix = 0; ix < nn; ix++) {
                int r = iy * nn + ix;
                t.addItem(r, r, -4 * c);
                if (ix > 0) {
                    t.addItem(r, r - 1, c);
                }
                if (ix + 1 < nn) {
                    t.addItem(r, r + 1, c);
                }
                if (iy > 0) {
                    t.addItem(r, r - nn, c);
                }
                if (iy + 1 < nn) {
                    t.addItem(r, r + nn, c);
                }
            }
        }
        return csc(t);
    }

    /**
     * Two-species linear reaction–diffusion on (0, len), Dirichlet, interleaved unknowns (u_i, v_i):
     * J = K ⊗ I + diag(du, dv) ⊗ Δ_h with the 2×2 kinetic matrix K = [[k11, k12], [k21, k22]].
     */
    static DMatrixSparseCSC twoSpecies(int nodes, double len, double du, double dv, double k11, double k12, double k21,
                                       double k22) {
        double h = len / (nodes + 1);
        double c = 1 / (h * h);
        int n = 2 * nodes;
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, 8 * nodes);
        for (int i = 0; i < nodes; i++) {
            int u = 2 * i;
            int v = u + 1;
            t.addItem(u, u, k11 - 2 * du * c);
            t.addItem(u, v, k12);
            t.addItem(v, u, k21);
            t.addItem(v, v, k22 - 2 * dv * c);
            if (i > 0) {
                t.addItem(u, u - 2, du * c);
                t.addItem(v, v - 2, dv * c);
            }
            if (i + 1 < nodes) {
                t.addItem(u, u + 2, du * c);
                t.addItem(v, v + 2, dv * c);
            }
        }
        return csc(t);
    }

    /** All eigenvalues of M⁻¹J by EJML's general dense QR (no symmetric scaling), rightmost first. */
    static List<Complex_F64> oracle(DMatrixSparseCSC j, DMatrixSparseCSC m) {
        DMatrixRMaj a = DConvertMatrixStruct.convert(j, (DMatrixRMaj) null);
        DMatrixRMaj md = DConvertMatrixStruct.convert(m, (DMatrixRMaj) null);
        org.ejml.dense.row.CommonOps_DDRM.invert(md);
        DMatrixRMaj b = new DMatrixRMaj(a.numRows, a.numCols);
        org.ejml.dense.row.CommonOps_DDRM.mult(md, a, b);
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(b.numRows, false, false);
        if (!eig.decompose(b)) {
            throw new AssertionError("oracle failed");
        }
        List<Complex_F64> out = new ArrayList<>();
        for (int i = 0; i < eig.getNumberOfEigenvalues(); i++) {
            out.add(eig.getEigenvalue(i));
        }
        out.sort(Comparator.comparingDouble((Complex_F64 z) -> -z.real).thenComparingDouble(z -> -z.imaginary));
        return out;
    }
}
