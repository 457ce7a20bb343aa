package rdstab.solver.continuation;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.ops.DConvertMatrixStruct;
import org.junit.jupiter.api.Test;
import rdstab.mesh.assembly.Discretization;

/** The pieces of the extended system against independent computations. */
class ExtendedSystemTest {

    /**
     * ∂F/∂δ of the finite-volume residual of u'' + δ e^u is exactly w_i e^{u_i} (the source is linear in δ;
     * F_i = fluxes + w_i δ e^{u_i}). For a linear dependence the central difference has no truncation error, only
     * round-off: about ε S_i / h with S_i = Σ_j |J_ij| |u_j| + w_i δ e^{u_i} the size of the terms summed into F_i and
     * h the difference step; the test allows 8 ε S_i / h (common practice, no source).
     */
    @Test
    void parameterDerivativeMatchesTheExactOneForALinearParameter() {
        ParameterFamily fam = new ParameterFamily(TraceCases.frankKamenetskii("slab", 30, 0.7), "delta", 0.7);
        Random rnd = new Random(20240611L);
        for (int trial = 0; trial < 10; trial++) {
            double[] u = new double[fam.unknowns()];
            for (int i = 0; i < u.length; i++) {
                u[i] = 3 * rnd.nextDouble();
            }
            double p = 0.2 + rnd.nextDouble();
            double[] fp = fam.parameterDerivative(u, p);
            Discretization d = fam.discretization(p);
            double[] w = d.nodeWeights();
            double[] size = termSizes(d.jacobian(u), u);
            double h = Math.cbrt(Math.ulp(1.0)) * Math.max(p, 1.0);
            for (int node = 0; node < d.nodes(); node++) {
                int k = d.unknownIndex(0, node);
                if (k >= 0) {
                    double exact = w[node] * Math.exp(u[k]);
                    double tol = 8 * Math.ulp(1.0) * (size[k] + p * exact) / h;
                    assertEquals(exact, fp[k], tol, "node " + node);
                }
            }
        }
    }

    static double[] termSizes(DMatrixSparseCSC j, double[] u) {
        double[] s = new double[u.length];
        for (int c = 0; c < j.numCols; c++) {
            for (int k = j.col_idx[c]; k < j.col_idx[c + 1]; k++) {
                s[j.nz_rows[k]] += Math.abs(j.nz_values[k] * u[c]);
            }
        }
        return s;
    }

    /** The assembled bordered LU against EJML's dense LU solve of the same matrix (random, seeded). */
    @Test
    void borderedSolveAgreesWithADenseSolve() {
        Random rnd = new Random(7L);
        int n = 25;
        DMatrixRMaj dense = new DMatrixRMaj(n + 1, n + 1);
        DMatrixRMaj jd = new DMatrixRMaj(n, n);
        for (int i = 0; i < n; i++) {
            jd.set(i, i, -2 - rnd.nextDouble());
            if (i > 0) {
                jd.set(i, i - 1, 1 + 0.1 * rnd.nextGaussian());
                jd.set(i - 1, i, 1 + 0.1 * rnd.nextGaussian());
            }
        }
        double[] a = new double[n];
        double[] c = new double[n];
        for (int i = 0; i < n; i++) {
            a[i] = rnd.nextGaussian();
            c[i] = rnd.nextGaussian();
        }
        double d = rnd.nextGaussian();
        CommonOps_DDRM.insert(jd, dense, 0, 0);
        for (int i = 0; i < n; i++) {
            dense.set(i, n, a[i]);
            dense.set(n, i, c[i]);
        }
        dense.set(n, n, d);
        DMatrixSparseCSC j = DConvertMatrixStruct.convert(jd, (DMatrixSparseCSC) null, 0.0);
        double[] b = new double[n];
        for (int i = 0; i < n; i++) {
            b[i] = rnd.nextGaussian();
        }
        double bp = rnd.nextGaussian();
        double[] x = BorderedSystem.factor(j, a, c, d).solve(b, bp);
        DMatrixRMaj rhs = new DMatrixRMaj(n + 1, 1);
        for (int i = 0; i < n; i++) {
            rhs.set(i, 0, b[i]);
        }
        rhs.set(n, 0, bp);
        DMatrixRMaj ref = new DMatrixRMaj(n + 1, 1);
        CommonOps_DDRM.solve(dense, rhs, ref);
        for (int i = 0; i <= n; i++) {
            assertEquals(ref.get(i, 0), x[i], 1e-11 * Math.max(1, Math.abs(ref.get(i, 0))), "component " + i);
        }
    }
}
