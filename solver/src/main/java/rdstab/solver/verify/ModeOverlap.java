package rdstab.solver.verify;

import rdstab.mesh.assembly.Discretization;
import rdstab.solver.eigen.EigenPair;

/**
 * Normalised overlap of two modes computed on different grids, used to follow one eigenvalue across
 * grid levels by its shape rather than by its position in the sorted list.
 *
 * <p>Both modes are written as nodal perturbations (fixed-value nodes 0), the coarser one interpolated
 * ({@link NodalInterpolation}) onto the nodes of the reference grid, and compared in the reference grid's
 * lumped energy inner product ⟨a, b⟩_M = Σ_f Σ_i w_i a_{f,i} conj(b_{f,i}) (w_i the node weights):
 * <pre>
 *   overlap(a, b) = |⟨a, b⟩_M| / (‖a‖_M ‖b‖_M)  ∈ [0, 1]
 * </pre>
 * 1 means the same shape (up to a complex factor), 0 orthogonal. Complex modes use their complex vectors.
 */
public final class ModeOverlap {

    private ModeOverlap() {
    }

    /** A mode as complex nodal values on the reference grid: re[field][node], im[field][node]. */
    public record Nodal(double[][] re, double[][] im) {
    }

    /** The mode of {@code pair} (computed on {@code own}) as nodal values on the nodes of {@code reference}. */
    public static Nodal onto(Discretization own, EigenPair pair, Discretization reference) {
        double[][] re = own.nodalPerturbation(pair.vectorRe());
        double[][] im = own.nodalPerturbation(pair.vectorIm());
        if (own == reference) {
            return new Nodal(re, im);
        }
        return new Nodal(NodalInterpolation.transfer(own, re, reference), NodalInterpolation.transfer(own, im, reference));
    }

    /** overlap(a, b) in the lumped inner product with node weights w. */
    public static double overlap(Nodal a, Nodal b, double[] w) {
        double sr = 0;
        double si = 0;
        double na = 0;
        double nb = 0;
        for (int f = 0; f < a.re().length; f++) {
            for (int i = 0; i < w.length; i++) {
                double ar = a.re()[f][i];
                double ai = a.im()[f][i];
                double br = b.re()[f][i];
                double bi = b.im()[f][i];
                // a · conj(b)
                sr += w[i] * (ar * br + ai * bi);
                si += w[i] * (ai * br - ar * bi);
                na += w[i] * (ar * ar + ai * ai);
                nb += w[i] * (br * br + bi * bi);
            }
        }
        double den = Math.sqrt(na * nb);
        return den > 0 ? Math.hypot(sr, si) / den : 0.0;
    }
}
