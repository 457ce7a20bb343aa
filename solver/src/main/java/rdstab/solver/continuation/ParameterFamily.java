package rdstab.solver.continuation;

import java.util.LinkedHashMap;
import java.util.Map;
import org.ejml.data.DMatrixSparseCSC;
import rdstab.mesh.assembly.Discretization;
import rdstab.solver.error.InputException;
import rdstab.solver.model.Case;
import rdstab.solver.newton.DampedNewton;
import rdstab.solver.setup.Problem;
import rdstab.solver.setup.ProblemBuilder;

/**
 * A case as a one-parameter family F(u; p) = 0: the problem is rebuilt per parameter value through
 * {@code ProblemBuilder.build(case.withParameter(name, p))}, the general path, because the parameter
 * may enter the geometry, the boundary numbers or the formulas. The last few problems are cached by
 * the exact parameter value, so the corrector's repeated evaluations at one p build once.
 *
 * <p>The unknown count must not change with p (the mesh has a fixed number of cells and the same
 * boundary kinds everywhere); a change is reported as bad input.
 *
 * <p><b>∂F/∂p</b> is a central difference of the residual in the parameter,
 * F_p ≈ (F(u; p + h) − F(u; p − h)) / (2h) with h = ε^{1/3} · max(|p|, 1), ε the machine epsilon
 * (h ≈ 6·10⁻⁶ max(|p|, 1)): truncation error O(h²) and round-off O(ε/h) balance there, so F_p carries
 * about 10 correct digits. F_p enters only the Jacobian of the extended system and the tangent, never
 * the residual that decides convergence, so its error slows the corrector at worst; it does not move
 * the converged branch points.
 *
 * <p><b>Inner product.</b> Arclength is measured in the scaled product
 * ⟨(u, p), (v, q)⟩ = Σ w_i u_i v_i / Σ w_i + p q with w_i the row sums of M at the start value of p
 * (the lumped node volumes): the first term is the mean square over the body, so the arclength does
 * not depend on the number of cells.
 */
public final class ParameterFamily {

    private static final double FD_STEP = Math.cbrt(Math.ulp(1.0));
    private static final int CACHE = 6;

    private final Case base;
    private final String name;
    private final int unknowns;
    private final double[] weights;
    private final double volume;
    private final Map<Double, Problem> cache = new LinkedHashMap<>(16, 0.75f, true) {
        private static final long serialVersionUID = 1L;

        @Override
        protected boolean removeEldestEntry(Map.Entry<Double, Problem> eldest) {
            return size() > CACHE;
        }
    };

    /**
     * @param base the case (its other parameters stay as they are)
     * @param name the parameter that varies; must be a parameter of the case
     * @param p0   the value whose node volumes define the inner product
     */
    public ParameterFamily(Case base, String name, double p0) {
        this.base = base;
        this.name = name;
        base.parameter(name);
        Problem p = problem(p0);
        this.unknowns = p.full().unknowns();
        this.weights = DampedNewton.rowSums(p.full().mass());
        double v = 0;
        for (double w : weights) {
            v += w;
        }
        this.volume = v;
    }

    /** The varied parameter's name. */
    public String name() {
        return name;
    }

    /** The case the family was made from. */
    public Case baseCase() {
        return base;
    }

    /** Number of unknowns n (the same for every p). */
    public int unknowns() {
        return unknowns;
    }

    /** Problem at parameter value p (cached). */
    public Problem problem(double p) {
        Problem pr = cache.get(p);
        if (pr == null) {
            pr = ProblemBuilder.build(base.withParameter(name, p));
            if (unknowns > 0 && pr.full().unknowns() != unknowns) {
                throw new InputException("command line", "--along " + name, "the number of unknowns changes with '" + name
                        + "' (" + unknowns + " at the start, " + pr.full().unknowns() + " at " + name + " = " + p
                        + "); a trace needs a fixed mesh size");
            }
            cache.put(p, pr);
        }
        return pr;
    }

    /** The discretization at p. */
    public Discretization discretization(double p) {
        return problem(p).full();
    }

    /** F(u; p) into f. */
    public void residual(double[] u, double p, double[] f) {
        discretization(p).residual(u, f);
    }

    /** Exact J = ∂F/∂u at (u, p). */
    public DMatrixSparseCSC jacobian(double[] u, double p) {
        return discretization(p).jacobian(u);
    }

    /** F_p by the central difference stated in the class comment. */
    public double[] parameterDerivative(double[] u, double p) {
        double h = FD_STEP * Math.max(Math.abs(p), 1.0);
        double up = p + h;
        double dn = p - h;
        double[] fp = new double[unknowns];
        double[] fm = new double[unknowns];
        residual(u, up, fp);
        residual(u, dn, fm);
        double inv = 1.0 / (up - dn);
        for (int i = 0; i < unknowns; i++) {
            fp[i] = (fp[i] - fm[i]) * inv;
        }
        return fp;
    }

    /** Lumped node weights w_i of the inner product (row sums of M at the start value). */
    public double[] weights() {
        return weights.clone();
    }

    /** ⟨(a, ap), (b, bp)⟩ of the class comment. */
    public double dot(double[] a, double ap, double[] b, double bp) {
        double s = 0;
        for (int i = 0; i < unknowns; i++) {
            s += weights[i] * a[i] * b[i];
        }
        return s / volume + ap * bp;
    }

    /** The weight vector w_i / Σw of the state part of the inner product (the border row of the tangent). */
    double[] scaledWeights() {
        double[] s = new double[unknowns];
        for (int i = 0; i < unknowns; i++) {
            s[i] = weights[i] / volume;
        }
        return s;
    }

    /** The scaled residual max_i |F_i| / w_i of {@link DampedNewton}, with the weights at p. */
    public double scaledResidual(double[] f, double p) {
        return DampedNewton.scaledNorm(f, DampedNewton.rowSums(discretization(p).mass()));
    }
}
