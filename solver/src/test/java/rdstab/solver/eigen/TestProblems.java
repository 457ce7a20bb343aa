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
     * Convection–diffusion on an N×N grid with central differences and unit spacing: (D_x + D_y + c)
     * with D_x the tridiagonal Toeplitz (1 + drift, −2, 1 − drift) along x (sub, diag, sup) and D_y the
     * symmetric (1, −2, 1) along y. Non-symmetric for drift ≠ 0, yet with a real spectrum for |drift| &lt; 1
     * ({@link #convectionDiffusion2dEigenvalue}).
     */
    static DMatrixSparseCSC convectionDiffusion2d(int nn, double drift, double c) {
        int n = nn * nn;
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, 5 * n);
        for (int iy = 0; iy < nn; iy++) {
            for (int ix = 0; ix < nn; ix++) {
                int r = iy * nn + ix;
                t.addItem(r, r, -4 + c);
                if (ix > 0) {
                    t.addItem(r, r - 1, 1 + drift);
                }
                if (ix + 1 < nn) {
                    t.addItem(r, r + 1, 1 - drift);
                }
                if (iy > 0) {
                    t.addItem(r, r - nn, 1);
                }
                if (iy + 1 < nn) {
                    t.addItem(r, r + nn, 1);
                }
            }
        }
        return csc(t);
    }

    /**
     * Eigenvalue (p, q) of {@link #convectionDiffusion2d}: a tridiagonal Toeplitz matrix (b, a, c) of
     * order N has the eigenvalues a + 2√(bc)·cos(jπ/(N + 1)), j = 1..N (G. D. Smith, <i>Numerical
     * Solution of Partial Differential Equations</i>, from memory), and a Kronecker sum adds them:
     * λ = c − 4 + 2√(1 − drift²)·cos(pπ/(N + 1)) + 2cos(qπ/(N + 1)).
     */
    static double convectionDiffusion2dEigenvalue(int p, int q, int nn, double drift, double c) {
        return c - 4 + 2 * Math.sqrt(1 - drift * drift) * Math.cos(p * Math.PI / (nn + 1))
                + 2 * Math.cos(q * Math.PI / (nn + 1));
    }

    /** The k largest of {@link #convectionDiffusion2dEigenvalue} over all (p, q), largest first. */
    static double[] convectionDiffusion2dRightmost(int k, int nn, double drift, double c) {
        double[] all = new double[nn * nn];
        for (int p = 1; p <= nn; p++) {
            for (int q = 1; q <= nn; q++) {
                all[(p - 1) * nn + q - 1] = convectionDiffusion2dEigenvalue(p, q, nn, drift, c);
            }
        }
        java.util.Arrays.sort(all);
        double[] out = new double[k];
        for (int i = 0; i < k; i++) {
            out[i] = all[all.length - 1 - i];
        }
        return out;
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
