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
 * <p>With the weighted energy E = ½ vᵀWMv (W = diag(w_f) per unknown of field f), dE/dt = vᵀ ½(WJ + JᵀW) v,
 * so the sharp energy growth rate is the numerical abscissa ω = λ_max(½(WJ+JᵀW), WM) (largest
 * eigenvalue of the symmetric generalized problem), found by shift-invert Lanczos. Split J = T + R with
 * R the source (reaction) part and T the rest (diffusion, drift, boundary exchange). By Weyl's
 * inequality ω ≤ λ_max(sym(WT), WM) + λ_max(sym(WR), WM) = −μ₁ + ρ_max: the a-priori bound, whose
 * ingredients are the Poincaré-type constant μ₁ of the transport operator and the largest reaction
 * rate ρ_max over the body. With diagonal M and node-local sources, ρ_max is the largest over nodes of
 * λ_max of the block ½(w_a R_ab + w_b R_ba)/√(w_a m_a w_b m_b) — exactly "max f′(ū)" for one field.
 *
 * <p>Weights: the spectral abscissa does not depend on them, the numerical abscissa and the bound do.
 * For several fields without given weights, {@link WeightSearch} picks the weights that minimise ρ_max
 * (when T does not couple the fields, μ₁ does not depend on the weights, so this minimises the bound).
 */
public final class EnergyAnalysis {

    private EnergyAnalysis() {
    }

    /** Unit weights (the plain M-energy). */
    public static EnergyRates compute(Discretization d, DMatrixSparseCSC j, DMatrixSparseCSC transport, DMatrixSparseCSC m) {
        double[] ones = new double[d.fieldCount()];
        Arrays.fill(ones, 1.0);
        return compute(d, j, transport, m, ones);
    }

    /**
     * @param d          the discretization (gives layout and weights)
     * @param j          Jacobian at the base state
     * @param transport  Jacobian of the same discretization with the sources removed (T)
     * @param m          weight matrix
     * @param weights    energy weight per field (each &gt; 0), or null to choose them (unit weights for one field)
     */
    public static EnergyRates compute(Discretization d, DMatrixSparseCSC j, DMatrixSparseCSC transport,
                                      DMatrixSparseCSC m, double[] weights) {
        int nf = d.fieldCount();
        DMatrixSparseCSC r = CommonOps_DSCC.add(1.0, j, -1.0, transport, null, null, null);
        boolean symmetric = isSymmetric(j);
        int[] fieldOf = fieldOfUnknown(d);
        boolean nodeLocal = d.massIsDiagonal();
        double[] unit = new double[nf];
        Arrays.fill(unit, 1.0);
        String choice;
        double[] w;
        if (weights != null) {
            if (weights.length != nf) {
                throw new IllegalArgumentException("energy weights: one per field (" + nf + "), got " + weights.length);
            }
            w = weights.clone();
            choice = "given";
        } else if (nf == 1 || !nodeLocal) {
            w = unit;
            choice = "unit";
        } else {
            w = WeightSearch.minimiseReactionRate(d, r, m, fieldOf);
            choice = "chosen to minimise the bound";
        }
        double[] wu = perUnknown(w, fieldOf);
        DMatrixSparseCSC wm = scaleRows(m, wu);
        double omega = lambdaMax(symmetricPart(scaleRows(j, wu)), wm);
        double tMax = lambdaMax(symmetricPart(scaleRows(transport, wu)), wm);
        double rho = nodeLocal ? nodeLocalMax(d, r, m, w) : lambdaMax(symmetricPart(scaleRows(r, wu)), wm);
        double unitBound = tMax + rho;
        if (!Arrays.equals(w, unit)) {
            double tUnit = couplesFields(transport, fieldOf) ? lambdaMax(symmetricPart(transport), m) : tMax;
            double rUnit = nodeLocal ? nodeLocalMax(d, r, m, unit) : lambdaMax(symmetricPart(r), m);
            unitBound = tUnit + rUnit;
        }
        return new EnergyRates(tMax + rho, omega, -tMax, rho, w, symmetric, choice, unitBound, Double.NaN, "computed",
                Double.NaN, Double.NaN, "not computed");
    }

    /** The field of every unknown. */
    public static int[] fieldOfUnknown(Discretization d) {
        int[] out = new int[d.unknowns()];
        for (int node = 0; node < d.nodes(); node++) {
            for (int f = 0; f < d.fieldCount(); f++) {
                int k = d.unknownIndex(f, node);
                if (k >= 0) {
                    out[k] = f;
                }
            }
        }
        return out;
    }

    /** The weight of every unknown. */
    public static double[] perUnknown(double[] w, int[] fieldOf) {
        double[] out = new double[fieldOf.length];
        for (int i = 0; i < out.length; i++) {
            out[i] = w[fieldOf[i]];
        }
        return out;
    }

    /** diag(s) A, a new matrix. */
    public static DMatrixSparseCSC scaleRows(DMatrixSparseCSC a, double[] s) {
        DMatrixSparseCSC b = a.copy();
        for (int p = 0; p < b.nz_length; p++) {
            b.nz_values[p] *= s[b.nz_rows[p]];
        }
        return b;
    }

    /** True when some stored entry of A links unknowns of different fields. */
    static boolean couplesFields(DMatrixSparseCSC a, int[] fieldOf) {
        for (int col = 0; col < a.numCols; col++) {
            for (int p = a.col_idx[col]; p < a.col_idx[col + 1]; p++) {
                if (a.nz_values[p] != 0.0 && fieldOf[a.nz_rows[p]] != fieldOf[col]) {
                    return true;
                }
            }
        }
        return false;
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

    /**
     * max over nodes of λ_max of the node block ½(w_a R_ab + w_b R_ba)/√(w_a m_a w_b m_b) for node-local R and
     * diagonal M: the reaction rate ρ_max in the weighted energy.
     */
    static double nodeLocalMax(Discretization d, DMatrixSparseCSC r, DMatrixSparseCSC m, double[] w) {
        int nf = d.fieldCount();
        double best = Double.NEGATIVE_INFINITY;
        int[] idx = new int[nf];
        int[] fld = new int[nf];
        DMatrixRMaj block = new DMatrixRMaj(nf, nf);
        for (int node = 0; node < d.nodes(); node++) {
            int count = 0;
            for (int f = 0; f < nf; f++) {
                int k = d.unknownIndex(f, node);
                if (k >= 0) {
                    fld[count] = f;
                    idx[count++] = k;
                }
            }
            if (count == 0) {
                continue;
            }
            block.reshape(count, count);
            for (int a = 0; a < count; a++) {
                for (int b = 0; b < count; b++) {
                    double wa = w[fld[a]];
                    double wb = w[fld[b]];
                    double v = 0.5 * (wa * r.get(idx[a], idx[b]) + wb * r.get(idx[b], idx[a]));
                    block.set(a, b, v / Math.sqrt(wa * m.get(idx[a], idx[a]) * wb * m.get(idx[b], idx[b])));
                }
            }
            best = Math.max(best, largestSymmetricEigenvalue(block, node));
        }
        return best == Double.NEGATIVE_INFINITY ? 0.0 : best;
    }

    /** λ_max of a small symmetric matrix (closed form up to 2×2, EJML beyond). */
    static double largestSymmetricEigenvalue(DMatrixRMaj s, int node) {
        int n = s.numRows;
        if (n == 1) {
            return s.get(0, 0);
        }
        if (n == 2) {
            double mean = 0.5 * (s.get(0, 0) + s.get(1, 1));
            double half = 0.5 * (s.get(0, 0) - s.get(1, 1));
            return mean + Math.hypot(half, s.get(0, 1));
        }
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(n, false, true);
        if (!eig.decompose(s.copy())) {
            throw new ArithmeticException("symmetric eigen-decomposition of the reaction block failed at node " + node);
        }
        double best = Double.NEGATIVE_INFINITY;
        for (int e = 0; e < n; e++) {
            best = Math.max(best, eig.getEigenvalue(e).real);
        }
        return best;
    }
}
