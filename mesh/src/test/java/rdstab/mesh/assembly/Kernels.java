package rdstab.mesh.assembly;

import java.util.Arrays;

/** Simple kernels for tests (physics-specific kernels live in test sources only). */
final class Kernels {

    private Kernels() {
    }

    /** One field: constant diffusivity k, linear source s = a·u. */
    static PointKernel linear(double k, double a) {
        return new PointKernel() {
            @Override public int fieldCount() { return 1; }

            @Override public void source(double[] x, double[] u, double[] s, double[][] dsdu) {
                s[0] = a * u[0];
                dsdu[0][0] = a;
            }

            @Override public void diffusivity(double[] x, double[] u, double[] kk, double[][] dkdu) {
                kk[0] = k;
                dkdu[0][0] = 0;
            }
        };
    }

    /** Frank-Kamenetskii: k = 1, s = δ e^u (thermal explosion, dimensionless). */
    static PointKernel frankKamenetskii(double delta) {
        return new PointKernel() {
            @Override public int fieldCount() { return 1; }

            @Override public void source(double[] x, double[] u, double[] s, double[][] dsdu) {
                s[0] = delta * Math.exp(u[0]);
                dsdu[0][0] = s[0];
            }

            @Override public void diffusivity(double[] x, double[] u, double[] kk, double[][] dkdu) {
                kk[0] = 1;
                dkdu[0][0] = 0;
            }
        };
    }

    /**
     * Two coupled fields with field-dependent diffusivity and an optional drift on field 0:
     * k0 = 1 + 0.3 u0² + 0.2 u1, k1 = 0.5 + 0.1 u0 u1 + 0.2 x,
     * s0 = u0 u1 − sin u0 + x, s1 = exp(0.5 u0) − u1², c0 = drift·(0.7 − x), c1 = 0.
     * Positive k for u in [0, 1] and x ≥ 0.
     */
    static PointKernel coupled(double drift) {
        return new PointKernel() {
            @Override public int fieldCount() { return 2; }

            @Override public void source(double[] x, double[] u, double[] s, double[][] d) {
                s[0] = u[0] * u[1] - Math.sin(u[0]) + x[0];
                s[1] = Math.exp(0.5 * u[0]) - u[1] * u[1];
                d[0][0] = u[1] - Math.cos(u[0]);
                d[0][1] = u[0];
                d[1][0] = 0.5 * Math.exp(0.5 * u[0]);
                d[1][1] = -2 * u[1];
            }

            @Override public void diffusivity(double[] x, double[] u, double[] k, double[][] d) {
                k[0] = 1 + 0.3 * u[0] * u[0] + 0.2 * u[1];
                k[1] = 0.5 + 0.1 * u[0] * u[1] + 0.2 * x[0];
                d[0][0] = 0.6 * u[0];
                d[0][1] = 0.2;
                d[1][0] = 0.1 * u[1];
                d[1][1] = 0.1 * u[0];
            }

            @Override public double drift(int field, double[] x, int dir) {
                return field == 0 ? drift * (0.7 - x[0]) : 0.0;
            }

            @Override public boolean hasDrift() { return drift != 0.0; }

            @Override public boolean diffusivityDependsOnFields() { return true; }

            @Override public String toString() { return "coupled(drift=" + drift + ")"; }
        };
    }

    /** One field with k = kConst and a source that returns {@code bad} at x &gt; xBad (for error tests). */
    static PointKernel badAfter(double xBad, double bad, boolean inDiffusivity) {
        return new PointKernel() {
            @Override public int fieldCount() { return 1; }

            @Override public void source(double[] x, double[] u, double[] s, double[][] d) {
                s[0] = !inDiffusivity && x[0] > xBad ? bad : 0.0;
                Arrays.fill(d[0], 0.0);
            }

            @Override public void diffusivity(double[] x, double[] u, double[] k, double[][] d) {
                k[0] = inDiffusivity && x[0] > xBad ? bad : 1.0;
                Arrays.fill(d[0], 0.0);
            }
        };
    }

    /** One field: constant diffusivity k, linear source s = a·u + b, constant drift c. */
    static PointKernel linearDrift(double k, double a, double b, double c) {
        return new PointKernel() {
            @Override public int fieldCount() { return 1; }

            @Override public void source(double[] x, double[] u, double[] s, double[][] dsdu) {
                s[0] = a * u[0] + b;
                dsdu[0][0] = a;
            }

            @Override public void diffusivity(double[] x, double[] u, double[] kk, double[][] dkdu) {
                kk[0] = k;
                dkdu[0][0] = 0;
            }

            @Override public double drift(int field, double[] x, int dir) { return c; }

            @Override public boolean hasDrift() { return c != 0.0; }
        };
    }
}
