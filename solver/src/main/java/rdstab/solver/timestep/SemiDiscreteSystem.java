package rdstab.solver.timestep;

import org.ejml.data.DMatrixSparseCSC;
import rdstab.mesh.assembly.Discretization;

/**
 * A system of ordinary differential equations M dy/dt = G(y) with a constant symmetric positive-definite
 * mass matrix M and an exact sparse Jacobian ∂G/∂y — what a {@link Discretization} gives in space.
 */
public interface SemiDiscreteSystem {

    /** Number of unknowns. */
    int size();

    /**
     * Right-hand side G(y).
     *
     * @param y state, not modified
     * @param g output, overwritten
     * @throws ArithmeticException or {@link rdstab.solver.error.ConvergenceException} (NOT_FINITE) when G is not
     *         finite at y; the integrator treats that as a failed step
     */
    void rhs(double[] y, double[] g);

    /** Exact Jacobian ∂G/∂y at y, a new matrix. */
    DMatrixSparseCSC jacobian(double[] y);

    /** The constant mass matrix M. */
    DMatrixSparseCSC mass();

    /**
     * The disturbance form of a discretization about a base state ū: y = u − ū and
     * G(y) = F(ū + y) − F(ū), so that y = 0 is an exact rest point even though F(ū) is zero only to Newton's
     * tolerance (the difference from the true right-hand side is that residual, at most its tolerance).
     * Integrating the disturbance rather than u lets the error control be relative to the disturbance itself.
     */
    static SemiDiscreteSystem disturbanceOf(Discretization d, double[] base) {
        int n = d.unknowns();
        double[] f0 = new double[n];
        d.residual(base, f0);
        DMatrixSparseCSC m = d.mass();
        return new SemiDiscreteSystem() {
            private final double[] u = new double[n];

            @Override
            public int size() {
                return n;
            }

            @Override
            public void rhs(double[] y, double[] g) {
                for (int i = 0; i < n; i++) {
                    u[i] = base[i] + y[i];
                }
                d.residual(u, g);
                for (int i = 0; i < n; i++) {
                    g[i] -= f0[i];
                }
            }

            @Override
            public DMatrixSparseCSC jacobian(double[] y) {
                for (int i = 0; i < n; i++) {
                    u[i] = base[i] + y[i];
                }
                return d.jacobian(u);
            }

            @Override
            public DMatrixSparseCSC mass() {
                return m;
            }
        };
    }
}
