package rdstab.solver.eigen;

/**
 * One eigenpair of J x = λ M x with its own evidence.
 *
 * @param re        Re λ (growth rate; &gt; 0 grows)
 * @param im        Im λ (angular frequency of an oscillatory mode)
 * @param vectorRe  real part of the eigenvector x (length n), normalised to unit M-norm of the complex vector
 * @param vectorIm  imaginary part of x (all zero for a real eigenvalue)
 * @param residual  ‖J x − λ M x‖₂ / (‖J‖₁ ‖x‖₂), computed after the solve, independent of the solver's own estimate
 */
public record EigenPair(double re, double im, double[] vectorRe, double[] vectorIm, double residual) {

    /** True when λ is real (|Im λ| below a tiny relative threshold). */
    public boolean isReal() {
        return Math.abs(im) <= 1e-12 * Math.max(1.0, Math.abs(re));
    }
}
