package rdstab.solver.pattern;

import java.util.ArrayList;
import java.util.List;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import rdstab.mesh.assembly.FiniteVolume1D;
import rdstab.mesh.assembly.PointKernel;
import rdstab.mesh.boundary.BoundaryCondition;
import rdstab.mesh.grid.Geometry1D;
import rdstab.mesh.grid.Grid1D;

/**
 * The dispersion relation of a spatially uniform base state ū: a disturbance e^{λt} φ_k(x) v with
 * −φ_k″ = k² φ_k grows at the eigenvalues λ(k) of R − k² diag(D), R = ∂s/∂u(ū) the reaction Jacobian and
 * D the diffusivities at ū (separation of variables; e.g. Murray, Mathematical Biology, for the
 * Turing analysis).
 *
 * <p>Applies to a slab without drift whose fields all have zero-flux ends (φ_k = cos kx, k = nπ/L,
 * n = 0, 1, ...) or all have fixed ends (φ_k = sin kx, n = 1, 2, ...), with a uniform base state
 * (max_x |ū_f(x) − ū_f(x₀)| ≤ {@value #UNIFORM_TOL}·(1 + max|ū_f|)) and x-independent R and D (the same
 * to 1e-10 relative at every node). The admitted wavenumbers are listed up to n = cells/2 (beyond,
 * the grid cannot represent the mode). The instability kind follows from the admitted mode of largest
 * Re λ: k = 0 with a complex pair — uniform oscillation (Hopf type); k &gt; 0 with a real λ — stationary
 * pattern (Turing type); k = 0 real — uniform, non-oscillating; k &gt; 0 complex — oscillating pattern.
 */
public final class DispersionRelation {

    /** Relative tolerance for "uniform". */
    public static final double UNIFORM_TOL = 1e-8;

    /**
     * @param n         mode number
     * @param k         wavenumber nπ/L
     * @param re        Re λ(k) of the rightmost eigenvalue of R − k² D
     * @param im        |Im λ(k)|
     */
    public record Mode(int n, double k, double re, double im) {
    }

    /**
     * @param applies     true when the base state is uniform and the domain admits the analysis
     * @param reason      why not (empty when it applies)
     * @param admitted    the admitted modes, by n
     * @param leading     index into admitted of the largest Re λ
     * @param kind        the kind of the leading admitted mode (see the class comment)
     * @param kFastest    wavenumber of fastest growth on an unbounded domain (k ≥ 0)
     * @param rateFastest Re λ there
     */
    public record Result(boolean applies, String reason, List<Mode> admitted, int leading, String kind,
                         double kFastest, double rateFastest) {
        public Result {
            admitted = List.copyOf(admitted);
        }

        static Result not(String why) {
            return new Result(false, why, List.of(), -1, "", Double.NaN, Double.NaN);
        }

        /** The leading admitted mode (null when the analysis does not apply). */
        public Mode leadingMode() {
            return leading < 0 ? null : admitted.get(leading);
        }
    }

    private DispersionRelation() {
    }

    /** The dispersion analysis of a 1D discretization at the base state u. */
    public static Result of(FiniteVolume1D d, double[] u) {
        Grid1D g = d.grid();
        PointKernel kernel = d.kernel().copy();
        int nf = d.fieldCount();
        if (g.geometry() != Geometry1D.SLAB) {
            return Result.not("not a slab");
        }
        if (kernel.hasDrift()) {
            return Result.not("drift present");
        }
        Boolean zeroFlux = endKind(d, nf);
        if (zeroFlux == null) {
            return Result.not("the ends are not all zero-flux or all fixed");
        }
        double[][] nodal = d.nodalValues(u);
        for (int f = 0; f < nf; f++) {
            double max = 0;
            double dev = 0;
            for (int i = 0; i < g.nodeCount(); i++) {
                max = Math.max(max, Math.abs(nodal[f][i]));
                dev = Math.max(dev, Math.abs(nodal[f][i] - nodal[f][0]));
            }
            if (dev > UNIFORM_TOL * (1 + max)) {
                return Result.not("the base state is not uniform");
            }
        }
        double[][] r = new double[nf][nf];
        double[] diff = new double[nf];
        if (!uniformCoefficients(g, kernel, nodal, r, diff)) {
            return Result.not("the coefficients vary with x");
        }
        double length = g.x(g.nodeCount() - 1) - g.x(0);
        List<Mode> modes = new ArrayList<>();
        int first = zeroFlux ? 0 : 1;
        int last = Math.max(first, (g.nodeCount() - 1) / 2);
        int lead = 0;
        for (int n = first; n <= last; n++) {
            double k = n * Math.PI / length;
            double[] lam = rightmost(r, diff, k);
            modes.add(new Mode(n, k, lam[0], Math.abs(lam[1])));
            if (lam[0] > modes.get(lead).re()) {
                lead = modes.size() - 1;
            }
        }
        Mode m = modes.get(lead);
        boolean oscillating = m.im() > 1e-12 * Math.max(1, Math.abs(m.re()));
        String kind = m.k() == 0 ? (oscillating ? "uniform oscillation (Hopf type)" : "uniform, non-oscillating")
                : (oscillating ? "oscillating pattern (wave type)" : "stationary pattern (Turing type)");
        double[] fastest = fastest(r, diff, modes.get(modes.size() - 1).k());
        return new Result(true, "", modes, lead, kind, fastest[0], fastest[1]);
    }

    /** TRUE when every end of every field is zero-flux, FALSE when all are fixed, null otherwise. */
    private static Boolean endKind(FiniteVolume1D d, int nf) {
        boolean allFlux = true;
        boolean allFixed = true;
        for (int f = 0; f < nf; f++) {
            for (BoundaryCondition bc : new BoundaryCondition[] {d.leftCondition(f), d.rightCondition(f)}) {
                allFlux &= bc instanceof BoundaryCondition.FixedFlux ff && ff.outflux() == 0.0;
                allFixed &= bc instanceof BoundaryCondition.FixedValue;
            }
        }
        return allFlux ? Boolean.TRUE : allFixed ? Boolean.FALSE : null;
    }

    private static boolean uniformCoefficients(Grid1D g, PointKernel kernel, double[][] nodal, double[][] r, double[] diff) {
        int nf = diff.length;
        double[] x = new double[1];
        double[] ui = new double[nf];
        double[] s = new double[nf];
        double[][] ds = new double[nf][nf];
        double[] kk = new double[nf];
        double[][] dk = new double[nf][nf];
        for (int i = 0; i < g.nodeCount(); i++) {
            x[0] = g.x(i);
            for (int f = 0; f < nf; f++) {
                ui[f] = nodal[f][i];
            }
            kernel.source(x, ui, s, ds);
            kernel.diffusivity(x, ui, kk, dk);
            for (int f = 0; f < nf; f++) {
                if (i == 0) {
                    diff[f] = kk[f];
                    System.arraycopy(ds[f], 0, r[f], 0, nf);
                } else {
                    if (!close(diff[f], kk[f])) {
                        return false;
                    }
                    for (int q = 0; q < nf; q++) {
                        if (!close(r[f][q], ds[f][q])) {
                            return false;
                        }
                    }
                }
            }
        }
        return true;
    }

    private static boolean close(double a, double b) {
        return Math.abs(a - b) <= 1e-10 * Math.max(1, Math.max(Math.abs(a), Math.abs(b)));
    }

    /** {Re, Im} of the eigenvalue of R − k² diag(D) with the largest real part (positive Im for a pair). */
    public static double[] rightmost(double[][] r, double[] diff, double k) {
        int n = diff.length;
        DMatrixRMaj a = new DMatrixRMaj(n, n);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                a.set(i, j, r[i][j] - (i == j ? k * k * diff[i] : 0));
            }
        }
        if (n == 1) {
            return new double[] {a.get(0, 0), 0};
        }
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(n, false);
        if (!eig.decompose(a)) {
            throw new ArithmeticException("eigenvalues of the " + n + "x" + n + " dispersion matrix failed at k = " + k);
        }
        double[] best = {Double.NEGATIVE_INFINITY, 0};
        for (int e = 0; e < n; e++) {
            Complex_F64 c = eig.getEigenvalue(e);
            if (c.real > best[0] || (c.real == best[0] && c.imaginary > best[1])) {
                best[0] = c.real;
                best[1] = c.imaginary;
            }
        }
        return best;
    }

    /**
     * max over k ≥ 0 of Re λ(k) on an unbounded domain: a scan of 2001 values of k² on [0, kMax²], then
     * golden-section refinement (60 steps) in the best bracket. Returns {k, Re λ}.
     */
    public static double[] fastest(double[][] r, double[] diff, double kMax) {
        int scan = 2000;
        double top = kMax * kMax;
        int best = 0;
        double bestV = Double.NEGATIVE_INFINITY;
        for (int i = 0; i <= scan; i++) {
            double v = rightmost(r, diff, Math.sqrt(top * i / scan))[0];
            if (v > bestV) {
                bestV = v;
                best = i;
            }
        }
        double a = top * Math.max(best - 1, 0) / scan;
        double b = top * Math.min(best + 1, scan) / scan;
        double gr = (Math.sqrt(5) - 1) / 2;
        for (int it = 0; it < 60; it++) {
            double x1 = b - gr * (b - a);
            double x2 = a + gr * (b - a);
            if (rightmost(r, diff, Math.sqrt(x1))[0] >= rightmost(r, diff, Math.sqrt(x2))[0]) {
                b = x2;
            } else {
                a = x1;
            }
        }
        double k2 = 0.5 * (a + b);
        double v = rightmost(r, diff, Math.sqrt(k2))[0];
        return v >= bestV ? new double[] {Math.sqrt(k2), v} : new double[] {Math.sqrt(top * best / scan), bestV};
    }
}
