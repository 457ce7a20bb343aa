package rdstab.bench;

import java.nio.file.Path;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.data.DMatrixSparseTriplet;
import org.ejml.ops.DConvertMatrixStruct;
import rdstab.cli.output.MatrixMarket;

/**
 * Benchmark model problems written as Matrix Market files (a plain main, not a test; run by
 * bench/run-scipy-comparison.sh). Invented benchmark operators, not physical cases.
 *
 * <pre>
 *   laplace N DIR     J = Δ_h + c I on the unit square, Dirichlet, N×N interior nodes, h = 1/(N+1), c = 10:
 *                     eigenvalues c − (4/h²)(sin²(iπh/2) + sin²(jπh/2)), all negative (M = identity)
 *   twofield N DIR    two coupled fields, node-major: u' = Δ_h u − u + v, v' = 0.2 Δ_h v + 0.5 u − 2 v;
 *                     non-symmetric with a real negative spectrum (each grid mode gives a 2×2 block with
 *                     positive discriminant), M = identity
 *   convection N DIR  (1 + 0.3, −4.01, 1 − 0.3) along x, (1, −4.01, 1) along y (central differences, unit spacing):
 *                     non-symmetric and strongly non-normal (similar to a symmetric operator through diag(√(13/7)^i)),
 *                     real eigenvalues −4.01 + 2√0.91·cos(pπ/(N+1)) + 2cos(qπ/(N+1)), M = identity
 * </pre>
 */
public final class ModelProblems {

    private ModelProblems() {
    }

    /** Entry point: {@code laplace|twofield|convection N DIR}. */
    public static void main(String[] args) {
        int nn = Integer.parseInt(args[1]);
        Path dir = Path.of(args[2]);
        DMatrixSparseCSC j = switch (args[0]) {
            case "laplace" -> laplace(nn, 10.0);
            case "twofield" -> twoField(nn);
            case "convection" -> convection(nn, 0.3);
            default -> throw new IllegalArgumentException("laplace, twofield or convection, found " + args[0]);
        };
        MatrixMarket.write(dir.resolve("J.mtx"), j, false, "benchmark operator " + args[0] + " N=" + nn, true);
    }

    /** Central-difference convection–diffusion with drift d along x, unit spacing, −0.01 on the diagonal. */
    public static DMatrixSparseCSC convection(int nn, double d) {
        int n = nn * nn;
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, 5 * n);
        for (int iy = 0; iy < nn; iy++) {
            for (int ix = 0; ix < nn; ix++) {
                int r = iy * nn + ix;
                t.addItem(r, r, -4.01);
                if (ix > 0) {
                    t.addItem(r, r - 1, 1 + d);
                }
                if (ix + 1 < nn) {
                    t.addItem(r, r + 1, 1 - d);
                }
                if (iy > 0) {
                    t.addItem(r, r - nn, 1.0);
                }
                if (iy + 1 < nn) {
                    t.addItem(r, r + nn, 1.0);
                }
            }
        }
        return DConvertMatrixStruct.convert(t, (DMatrixSparseCSC) null);
    }

    /** Δ_h + c I, five-point, Dirichlet. */
    public static DMatrixSparseCSC laplace(int nn, double c) {
        int n = nn * nn;
        double h = 1.0 / (nn + 1);
        double s = 1.0 / (h * h);
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, 5 * n);
        for (int iy = 0; iy < nn; iy++) {
            for (int ix = 0; ix < nn; ix++) {
                int r = iy * nn + ix;
                t.addItem(r, r, -4 * s + c);
                if (ix > 0) {
                    t.addItem(r, r - 1, s);
                }
                if (ix + 1 < nn) {
                    t.addItem(r, r + 1, s);
                }
                if (iy > 0) {
                    t.addItem(r, r - nn, s);
                }
                if (iy + 1 < nn) {
                    t.addItem(r, r + nn, s);
                }
            }
        }
        return DConvertMatrixStruct.convert(t, (DMatrixSparseCSC) null);
    }

    /** The two-field operator of the class comment. */
    public static DMatrixSparseCSC twoField(int nn) {
        int n = 2 * nn * nn;
        double h = 1.0 / (nn + 1);
        double s = 1.0 / (h * h);
        double[] diff = {1.0, 0.2};
        double[][] react = {{-1.0, 1.0}, {0.5, -2.0}};
        DMatrixSparseTriplet t = new DMatrixSparseTriplet(n, n, 12 * nn * nn);
        for (int iy = 0; iy < nn; iy++) {
            for (int ix = 0; ix < nn; ix++) {
                int node = iy * nn + ix;
                for (int f = 0; f < 2; f++) {
                    int r = 2 * node + f;
                    double ds = diff[f] * s;
                    t.addItem(r, r, -4 * ds + react[f][f]);
                    t.addItem(r, 2 * node + 1 - f, react[f][1 - f]);
                    if (ix > 0) {
                        t.addItem(r, r - 2, ds);
                    }
                    if (ix + 1 < nn) {
                        t.addItem(r, r + 2, ds);
                    }
                    if (iy > 0) {
                        t.addItem(r, r - 2 * nn, ds);
                    }
                    if (iy + 1 < nn) {
                        t.addItem(r, r + 2 * nn, ds);
                    }
                }
            }
        }
        return DConvertMatrixStruct.convert(t, (DMatrixSparseCSC) null);
    }
}
