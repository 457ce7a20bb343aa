package rdstab.solver.energy;

import java.util.Random;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.sparse.csc.CommonOps_DSCC;
import rdstab.solver.linear.Factorizations;
import rdstab.solver.linear.SparseFactorization;
import rdstab.solver.linear.SparseOps;

/**
 * The largest energy amplification G = max_t ‖e^{tA}‖ of the linearized system M v' = J v (A = M⁻¹J),
 * in the energy norm ‖v‖² = vᵀ N v with N = WM, and the time at which it peaks.
 *
 * <p>Method. For one t, G(t)² is the largest eigenvalue of Φ(t)*Φ(t), Φ* the N-adjoint of the
 * propagator, found by power iteration v ← Φ*Φ v; its Rayleigh quotients ‖Φv‖²/‖v‖² rise monotonically
 * toward G(t)², so every value reported is a lower estimate (of the stepped propagator's norm).
 * Φ(t) is s = {@value #STEPS} Crank–Nicolson steps of size h = t/s, (M − hJ/2) v_{n+1} = (M + hJ/2) v_n,
 * one sparse LU per t; Φ* = N⁻¹(Φᵀ)N, where a step of Φᵀ is z = (M − hJᵀ/2)⁻¹ y, y ← (M + hJᵀ/2) z
 * (this is exactly the N-adjoint of the discrete propagator, so the power iteration is consistent).
 * Crank–Nicolson is second order and, in any inner-product norm, contractive wherever the exact flow is,
 * so it adds no spurious growth of stiff decaying parts. The power iteration stops when the Rayleigh
 * quotient changes by less than 1e-5 relative (G to about 5e-6), or after 30 rounds; each t warm-starts from the previous
 * vector.
 *
 * <p>Times: {@value #GRID} values spaced geometrically from 0.02·min(1/|α|, 1/ω) to 8/|α| (α the spectral
 * abscissa &lt; 0, ω the numerical abscissa &gt; 0), then golden-section refinement in log t around the
 * best grid value. The search stops early when the budget of linear solves (one per time step, forward
 * or adjoint) is spent; the result says so.
 */
public final class TransientGrowth {

    /** Crank–Nicolson steps per propagator. */
    static final int STEPS = 32;
    /** Number of grid times. */
    static final int GRID = 16;
    private static final int MAX_POWER = 30;
    private static final double POWER_TOL = 1e-5;

    /**
     * @param peak        largest amplification found (≥ 1)
     * @param time        the t where it was found
     * @param solves      linear solves spent
     * @param budgetSpent true when the search stopped because the budget ran out
     * @param atWindowEnd true when the peak lies at the last time searched (it may come later)
     */
    public record Result(double peak, double time, long solves, boolean budgetSpent, boolean atWindowEnd) {
    }

    private final DMatrixSparseCSC j;
    private final DMatrixSparseCSC jt;
    private final DMatrixSparseCSC m;
    private final double[] nDiag;
    private final long budget;
    private long solves;
    private double[] v;

    private TransientGrowth(DMatrixSparseCSC j, DMatrixSparseCSC m, double[] weightPerUnknown, long budget) {
        if (!SparseOps.isDiagonal(m)) {
            throw new IllegalArgumentException("the amplification search needs a diagonal (lumped) M");
        }
        this.j = j;
        this.jt = CommonOps_DSCC.transpose(j, null, null);
        this.m = m;
        double[] md = SparseOps.diagonal(m);
        this.nDiag = new double[md.length];
        for (int i = 0; i < md.length; i++) {
            nDiag[i] = md[i] * weightPerUnknown[i];
        }
        this.budget = budget;
        Random rnd = new Random(20240611L);
        this.v = new double[md.length];
        for (int i = 0; i < v.length; i++) {
            v[i] = rnd.nextDouble() - 0.5;
        }
        normalise(v);
    }

    /**
     * Searches the peak amplification.
     *
     * @param j                 Jacobian (not modified)
     * @param m                 diagonal weight matrix
     * @param weightPerUnknown  energy weight of each unknown (1 for the plain M-energy)
     * @param spectralAbscissa  α &lt; 0 (the search is meaningless for an unstable spectrum)
     * @param numericalAbscissa ω &gt; 0 (otherwise the peak is 1 at t = 0)
     * @param budget            largest number of linear solves
     */
    public static Result search(DMatrixSparseCSC j, DMatrixSparseCSC m, double[] weightPerUnknown, double spectralAbscissa,
                                double numericalAbscissa, long budget) {
        if (!(spectralAbscissa < 0) || !(numericalAbscissa > 0)) {
            throw new IllegalArgumentException("needs α < 0 < ω, got α = " + spectralAbscissa + ", ω = " + numericalAbscissa);
        }
        TransientGrowth g = new TransientGrowth(j, m, weightPerUnknown, budget);
        double lo = 0.02 * Math.min(1 / -spectralAbscissa, 1 / numericalAbscissa);
        double hi = 8 / -spectralAbscissa;
        double ratio = Math.pow(hi / lo, 1.0 / (GRID - 1));
        double bestT = 0;
        double best = 1;
        int bestIdx = -1;
        for (int i = 0; i < GRID && g.affordable(); i++) {
            double t = lo * Math.pow(ratio, i);
            double a = g.amplification(t);
            if (a > best) {
                best = a;
                bestT = t;
                bestIdx = i;
            }
        }
        boolean atEnd = bestIdx == GRID - 1;
        if (bestIdx >= 0 && !atEnd) {
            double a = Math.log(bestT / ratio);
            double b = Math.log(bestT * ratio);
            double gr = (Math.sqrt(5) - 1) / 2;
            for (int it = 0; it < 12 && g.affordable(); it++) {
                double x1 = b - gr * (b - a);
                double x2 = a + gr * (b - a);
                double f1 = g.amplification(Math.exp(x1));
                double f2 = g.affordable() ? g.amplification(Math.exp(x2)) : 0;
                if (Math.max(f1, f2) > best) {
                    best = Math.max(f1, f2);
                    bestT = Math.exp(f1 >= f2 ? x1 : x2);
                }
                if (f1 >= f2) {
                    b = x2;
                } else {
                    a = x1;
                }
            }
        }
        return new Result(best, bestT, g.solves, !g.affordable(), atEnd);
    }

    private boolean affordable() {
        return solves + 4L * STEPS <= budget;
    }

    /** Lower estimate of ‖Φ(t)‖ by power iteration on Φ*Φ (warm-started). */
    double amplification(double t) {
        double h = t / STEPS;
        SparseFactorization fwd = Factorizations.factor(combine(j, -h / 2), false, Factorizations.defaultOrdering());
        SparseFactorization adj = Factorizations.factor(combine(jt, -h / 2), false, Factorizations.defaultOrdering());
        DMatrixSparseCSC fwdRhs = combine(j, h / 2);
        DMatrixSparseCSC adjRhs = combine(jt, h / 2);
        double last = 0;
        for (int it = 0; it < MAX_POWER && affordable(); it++) {
            double[] u = v.clone();
            propagate(fwd, fwdRhs, u, false);
            double q = normSquared(u);           // ‖v‖ = 1
            // v ← N⁻¹ Φᵀ N u
            for (int i = 0; i < u.length; i++) {
                u[i] *= nDiag[i];
            }
            propagate(adj, adjRhs, u, true);
            for (int i = 0; i < u.length; i++) {
                u[i] /= nDiag[i];
            }
            normalise(u);
            v = u;
            if (Math.abs(q - last) <= POWER_TOL * q) {
                last = q;
                break;
            }
            last = Math.max(last, q);
        }
        return Math.sqrt(last);
    }

    /**
     * s Crank–Nicolson steps in place. Forward (Φ = (M − hJ/2)⁻¹(M + hJ/2)): multiply, then solve.
     * Transposed (Φᵀ = (M + hJᵀ/2)(M − hJᵀ/2)⁻¹): solve, then multiply.
     */
    private void propagate(SparseFactorization lhs, DMatrixSparseCSC rhs, double[] z, boolean transposed) {
        double[] tmp = new double[z.length];
        for (int s = 0; s < STEPS; s++) {
            if (transposed) {
                lhs.solve(z, tmp);
                SparseOps.multiply(rhs, tmp, z);
            } else {
                SparseOps.multiply(rhs, z, tmp);
                lhs.solve(tmp, z);
            }
            solves++;
        }
    }

    /** M + c K. */
    private DMatrixSparseCSC combine(DMatrixSparseCSC k, double c) {
        return CommonOps_DSCC.add(1.0, m, c, k, null, null, null);
    }

    private double normSquared(double[] x) {
        double s = 0;
        for (int i = 0; i < x.length; i++) {
            s += nDiag[i] * x[i] * x[i];
        }
        return s;
    }

    private void normalise(double[] x) {
        double n = Math.sqrt(normSquared(x));
        for (int i = 0; i < x.length; i++) {
            x[i] /= n;
        }
    }
}
