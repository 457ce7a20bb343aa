package rdstab.mesh.assembly;

import org.ejml.data.DMatrixRMaj;
import org.ejml.data.DMatrixSparseCSC;
import org.ejml.interfaces.linsol.LinearSolverSparse;
import org.ejml.sparse.FillReducing;
import org.ejml.sparse.csc.CommonOps_DSCC;
import org.ejml.sparse.csc.factory.LinearSolverFactory_DSCC;

/**
 * Test oracle for the rightmost eigenpair of a symmetric pencil J x = λ M x with −J and M SPD:
 * inverse iteration x ← (−J)⁻¹ M x with EJML's sparse Cholesky (textbook method; converges at the
 * rate λ₁/λ₂ per step), Rayleigh quotient λ = xᵀJx / xᵀMx. Returns {λ, residual} with
 * residual = ‖Jx − λMx‖ / (‖J‖_max ‖x‖).
 */
final class InverseIteration {

    private InverseIteration() {
    }

    static double[] rightmost(DMatrixSparseCSC j, DMatrixSparseCSC m, int steps) {
        int n = j.numRows;
        DMatrixSparseCSC a = j.copy();
        CommonOps_DSCC.scale(-1, a, a);
        LinearSolverSparse<DMatrixSparseCSC, DMatrixRMaj> chol = LinearSolverFactory_DSCC.cholesky(FillReducing.NONE);
        if (!chol.setA(a)) {
            throw new IllegalStateException("-J is not positive definite");
        }
        DMatrixRMaj x = new DMatrixRMaj(n, 1);
        x.fill(1.0);
        DMatrixRMaj mx = new DMatrixRMaj(n, 1);
        DMatrixRMaj jx = new DMatrixRMaj(n, 1);
        double lambda = 0;
        for (int s = 0; s < steps; s++) {
            CommonOps_DSCC.mult(m, x, mx);
            chol.solve(mx, x);
            double norm = Math.sqrt(dot(x, x));
            for (int i = 0; i < n; i++) {
                x.data[i] /= norm;
            }
        }
        CommonOps_DSCC.mult(j, x, jx);
        CommonOps_DSCC.mult(m, x, mx);
        lambda = dot(x, jx) / dot(x, mx);
        double r = 0;
        for (int i = 0; i < n; i++) {
            r += Math.pow(jx.data[i] - lambda * mx.data[i], 2);
        }
        return new double[] {lambda, Math.sqrt(r) / (CommonOps_DSCC.elementMaxAbs(j) * Math.sqrt(dot(x, x)))};
    }

    private static double dot(DMatrixRMaj a, DMatrixRMaj b) {
        double s = 0;
        for (int i = 0; i < a.numRows; i++) {
            s += a.data[i] * b.data[i];
        }
        return s;
    }
}
