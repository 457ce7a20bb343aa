package rdstab.solver.energy;

import java.util.Arrays;
import org.ejml.data.DMatrixRMaj;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.ejml.sparse.csc.CommonOps_DSCC;
import rdstab.mesh.assembly.Discretization;
import rdstab.solver.eigen.EigenOptions;
import rdstab.solver.eigen.EigenSolvers;

/**
 * The energy method for the linearized system M v' = J v about a base state.
 *
 * <p>With the energy E = ½ vᵀMv, dE/dt = vᵀ ½(J + Jᵀ) v, so the sharp energy growth rate is the
 * numerical abscissa ω = λ_max(½(J+Jᵀ), M) (largest eigenvalue of the symmetric generalized problem),
 * found by shift-invert Lanczos. Split J = T + R with R the source (reaction) part and T the rest
 * (diffusion, drift, boundary exchange). By Weyl's inequality
 * ω ≤ λ_max(T_sym, M) + λ_max(R_sym, M) = −μ₁ + ρ_max: the a-priori bound, whose ingredients are
 * the Poincaré-type constant μ₁ of the transport operator and the largest reaction rate ρ_max over
 * the body. With diagonal M and node-local sources, ρ_max is the largest over nodes of
 * λ_max(sym(∂s/∂u)) — exactly "max f′(ū)" for one field.
 */
public final class EnergyAnalysis {

    private EnergyAnalysis() {
    }

    /**
     * @param d          the discretization (gives layout and weights)
     * @param j          Jacobian at the base state
     * @param transport  Jacobian of the same discretization with the sources removed (T)
     * @param m          weight matrix
     */
    public static EnergyRates compute(Discretization d, DMatrixSparseCSC j, DMatrixSparseCSC transport, DMatrixSparseCSC m) {
        DMatrixSparseCSC r = CommonOps_DSCC.add(1.0, j, -1.0, transport, null, null, null);
        boolean symmetric = isSymmetric(j);
        double omega = lambdaMax(symmetricPart(j), m);
        double tMax = lambdaMax(symmetricPart(transport), m);
        double rho = d.massIsDiagonal() ? nodeLocalMax(d, r, m) : lambdaMax(symmetricPart(r), m);
        double[] weights = new double[d.fieldCount()];
        Arrays.fill(weights, 1.0);
        return new EnergyRates(tMax + rho, omega, -tMax, rho, weights, symmetric);
    }

    /** ½(A + Aᵀ). */
    public static DMatrixSparseCSC symmetricPart(DMatrixSparseCSC a) {
        DMatrixSparseCSC t = CommonOps_DSCC.transpose(a, null, null);
        return CommonOps_DSCC.add(0.5, a, 0.5, t, null, null, null);
    }

    /** True when A equals Aᵀ to round-off (relative 1e-14 of the largest entry). */
    public static boolean isSymmetric(DMatrixSparseCSC a) {
        DMatrixSparseCSC t = CommonOps_DSCC.transpose(a, null, null);
        DMatrixSparseCSC diff = CommonOps_DSCC.add(1.0, a, -1.0, t, null, null, null);
        double scale = CommonOps_DSCC.elementMaxAbs(a);
        return CommonOps_DSCC.elementMaxAbs(diff) <= 1e-14 * Math.max(scale, Double.MIN_NORMAL);
    }

    /** Largest eigenvalue of the symmetric generalized problem S x = λ M x. */
    public static double lambdaMax(DMatrixSparseCSC s, DMatrixSparseCSC m) {
        if (CommonOps_DSCC.elementMaxAbs(s) == 0.0) {
            return 0.0;
        }
        return EigenSolvers.create(EigenOptions.rightmost(1, true), s.numRows)
                .rightmost(s, m, EigenOptions.rightmost(1, true)).get(0).re();
    }

    /** max over nodes of λ_max(sym(R_node) / w_node) for node-local R and diagonal M. */
    private static double nodeLocalMax(Discretization d, DMatrixSparseCSC r, DMatrixSparseCSC m) {
        int nf = d.fieldCount();
        double best = Double.NEGATIVE_INFINITY;
        int[] idx = new int[nf];
        DMatrixRMaj block = new DMatrixRMaj(nf, nf);
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(nf, false, true);
        for (int node = 0; node < d.nodes(); node++) {
            int count = 0;
            for (int f = 0; f < nf; f++) {
                int k = d.unknownIndex(f, node);
                if (k >= 0) {
                    idx[count++] = k;
                }
            }
            if (count == 0) {
                continue;
            }
            block.reshape(count, count);
            for (int a = 0; a < count; a++) {
                for (int b = 0; b < count; b++) {
                    double v = 0.5 * (r.get(idx[a], idx[b]) + r.get(idx[b], idx[a]));
                    double wa = Math.sqrt(m.get(idx[a], idx[a]));
                    double wb = Math.sqrt(m.get(idx[b], idx[b]));
                    block.set(a, b, v / (wa * wb));
                }
            }
            if (count == 1) {
                best = Math.max(best, block.get(0, 0));
                continue;
            }
            eig = DecompositionFactory_DDRM.eig(count, false, true);
            if (!eig.decompose(block)) {
                throw new ArithmeticException("symmetric 2x2.. eigen-decomposition failed at node " + node);
            }
            for (int e = 0; e < count; e++) {
                best = Math.max(best, eig.getEigenvalue(e).real);
            }
        }
        return best == Double.NEGATIVE_INFINITY ? 0.0 : best;
    }
}
