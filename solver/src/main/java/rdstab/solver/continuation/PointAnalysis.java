package rdstab.solver.continuation;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.ejml.data.DMatrixSparseCSC;
import rdstab.mesh.assembly.Discretization;
import rdstab.solver.eigen.EigenChecks;
import rdstab.solver.eigen.EigenOptions;
import rdstab.solver.eigen.EigenPair;
import rdstab.solver.eigen.EigenSolvers;
import rdstab.solver.eigen.Spectrum;
import rdstab.solver.energy.EnergyAnalysis;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.error.ConvergenceException.Reason;
import rdstab.solver.model.AnalysisSpec;

/**
 * What the tracer records at a branch point: the rightmost eigenvalues of J x = λ M x (the case's mode count,
 * {@link EigenSolvers#solve} with the case's shift, automatic by default), the M-norm and the field maxima,
 * and the stability word.
 *
 * <p>Only eigenpairs with residual at or below the case's residual limit are kept; when the rightmost one
 * fails that test the point is reported as a numerical failure (EIGEN_NOT_CONVERGED), as a check would.
 *
 * @param eigenvalues rightmost first, each with its residual
 * @param norm        sqrt(Σ w_i u_i² / Σ w_i) over all fields and nodes
 * @param max         largest nodal value per field
 * @param band        max(marginal band, error bound of the rightmost eigenvalue)
 */
record PointAnalysis(List<Eigenvalue> eigenvalues, double norm, Map<String, Double> max, double band) {

    static PointAnalysis of(ParameterFamily family, double[] u, double p) {
        Discretization d = family.discretization(p);
        AnalysisSpec a = family.baseCase().analysis();
        DMatrixSparseCSC j = d.jacobian(u);
        DMatrixSparseCSC m = d.mass();
        int k = Math.min(a.modes(), d.unknowns());
        EigenOptions opts = new EigenOptions(k, a.shift(), EnergyAnalysis.isSymmetric(j), a.eigenTolerance(), 3000, 0);
        Spectrum s = EigenSolvers.solve(j, m, opts);
        List<Eigenvalue> list = new ArrayList<>();
        EigenPair lead = null;
        for (EigenPair e : s.pairs()) {
            if (e.residual() <= a.residualLimit()) {
                list.add(new Eigenvalue(e.re(), e.im(), e.residual()));
                lead = lead == null ? e : lead;
            } else if (list.isEmpty()) {
                throw new ConvergenceException(Reason.EIGEN_NOT_CONVERGED, String.format(Locale.ROOT,
                        "at %s = %.8g the rightmost eigenpair (%.6g%+.6gi) has residual %.2e above the limit %.1e",
                        family.name(), p, e.re(), e.im(), e.residual(), a.residualLimit()), -1, e.residual());
            }
        }
        double band = Math.max(a.marginalBand(), EigenChecks.errorBound(lead, j, m));
        double[][] nodal = d.nodalValues(u);
        double[] w = d.nodeWeights();
        double sum = 0;
        double vol = 0;
        Map<String, Double> max = new LinkedHashMap<>();
        for (int f = 0; f < nodal.length; f++) {
            double mx = Double.NEGATIVE_INFINITY;
            for (int i = 0; i < nodal[f].length; i++) {
                mx = Math.max(mx, nodal[f][i]);
                sum += w[i] * nodal[f][i] * nodal[f][i];
                vol += w[i];
            }
            max.put(family.baseCase().fields().get(f).name(), mx);
        }
        return new PointAnalysis(list, Math.sqrt(sum / vol), max, band);
    }

    /** Re λ of the rightmost eigenvalue. */
    double growthRate() {
        return eigenvalues.get(0).re();
    }

    /** |Im λ| of the rightmost eigenvalue. */
    double frequency() {
        return Math.abs(eigenvalues.get(0).im());
    }

    /** "stable", "unstable" or "marginal". */
    String stability() {
        double g = growthRate();
        return g > band ? "unstable" : g < -band ? "stable" : "marginal";
    }

    /** Number of real eigenvalues (Im = 0) with Re λ &gt; 0 among those computed. */
    int realUnstable() {
        int c = 0;
        for (Eigenvalue e : eigenvalues) {
            if (isReal(e) && e.re() > 0) {
                c++;
            }
        }
        return c;
    }

    /** Number of non-real eigenvalues (both members of each pair) with Re λ &gt; 0 among those computed. */
    int complexUnstable() {
        int c = 0;
        for (Eigenvalue e : eigenvalues) {
            if (!isReal(e) && e.re() > 0) {
                c++;
            }
        }
        return c;
    }

    /** The real eigenvalue nearest 0, or null. */
    Eigenvalue realNearestZero() {
        Eigenvalue best = null;
        for (Eigenvalue e : eigenvalues) {
            if (isReal(e) && (best == null || Math.abs(e.re()) < Math.abs(best.re()))) {
                best = e;
            }
        }
        return best;
    }

    /** The member with Im λ &gt; 0 of the complex pair whose real part is nearest 0, or null. */
    Eigenvalue pairNearestAxis() {
        Eigenvalue best = null;
        for (Eigenvalue e : eigenvalues) {
            if (!isReal(e) && e.im() > 0 && (best == null || Math.abs(e.re()) < Math.abs(best.re()))) {
                best = e;
            }
        }
        return best;
    }

    static boolean isReal(Eigenvalue e) {
        return Math.abs(e.im()) <= 1e-12 * Math.max(1.0, Math.abs(e.re()));
    }
}
