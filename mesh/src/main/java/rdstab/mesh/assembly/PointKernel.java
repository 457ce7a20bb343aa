package rdstab.mesh.assembly;

/**
 * The pointwise physics of a system of {@code n} fields, evaluated at one mesh point.
 *
 * <p>The equations are, for field f = 0..n-1,
 * <pre>
 *   ∂u_f/∂t = ∇·( k_f(x, u) ∇u_f ) − c_f(x)·∇u_f + s_f(x, u)
 * </pre>
 * with diffusivity k_f &gt; 0, an optional drift velocity c_f and a source s_f. The mesh module knows
 * nothing of how these are written (formulas, code); it only calls this interface. Implementations
 * must be safe to call from one thread at a time per instance ({@link #copy()} gives one per thread).
 */
public interface PointKernel {

    /** Number of fields n. */
    int fieldCount();

    /**
     * Source terms and their exact derivatives at one point.
     *
     * @param x     coordinates of the point (length = space dimension), not modified
     * @param u     field values at the point (length n), not modified
     * @param s     output: s[f] = s_f(x, u)
     * @param dsdu  output: dsdu[f][g] = ∂s_f/∂u_g
     */
    void source(double[] x, double[] u, double[] s, double[][] dsdu);

    /**
     * Diffusivities and their exact derivatives at one point.
     *
     * @param x     coordinates of the point, not modified
     * @param u     field values at the point, not modified
     * @param k     output: k[f] = k_f(x, u), must be &gt; 0
     * @param dkdu  output: dkdu[f][g] = ∂k_f/∂u_g (all zero when k does not depend on the fields)
     */
    void diffusivity(double[] x, double[] u, double[] k, double[][] dkdu);

    /**
     * Drift velocity of field f at a point (component {@code dir} of the vector), zero by default.
     * Drift may depend on position only, never on the fields.
     */
    default double drift(int field, double[] x, int dir) {
        return 0.0;
    }

    /** True when some field has a non-zero drift anywhere (the operator is then not self-adjoint). */
    default boolean hasDrift() {
        return false;
    }

    /** True when some diffusivity depends on the fields. */
    default boolean diffusivityDependsOnFields() {
        return false;
    }

    /** An independent instance for use on another thread (may return {@code this} if stateless). */
    default PointKernel copy() {
        return this;
    }
}
