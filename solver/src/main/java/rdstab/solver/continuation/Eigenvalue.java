package rdstab.solver.continuation;

/**
 * One eigenvalue λ of J x = λ M x at a branch point, with the residual of its eigenpair
 * ‖Jx − λMx‖₂ / (‖J‖₁ ‖x‖₂) (the eigenvector itself is not kept along a branch).
 *
 * @param re       Re λ (growth rate)
 * @param im       Im λ (angular frequency)
 * @param residual the eigenpair's residual
 */
public record Eigenvalue(double re, double im, double residual) {
}
