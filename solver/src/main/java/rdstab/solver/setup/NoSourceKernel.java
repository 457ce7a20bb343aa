package rdstab.solver.setup;

import java.util.Arrays;
import rdstab.mesh.assembly.PointKernel;

/** A kernel with the diffusivities and drifts of another and every source set to zero. */
final class NoSourceKernel implements PointKernel {

    private final PointKernel inner;

    NoSourceKernel(PointKernel inner) {
        this.inner = inner;
    }

    @Override
    public int fieldCount() {
        return inner.fieldCount();
    }

    @Override
    public void source(double[] x, double[] u, double[] s, double[][] dsdu) {
        Arrays.fill(s, 0.0);
        for (double[] row : dsdu) {
            Arrays.fill(row, 0.0);
        }
    }

    @Override
    public void diffusivity(double[] x, double[] u, double[] k, double[][] dkdu) {
        inner.diffusivity(x, u, k, dkdu);
    }

    @Override
    public double drift(int field, double[] x, int dir) {
        return inner.drift(field, x, dir);
    }

    @Override
    public boolean hasDrift() {
        return inner.hasDrift();
    }

    @Override
    public boolean diffusivityDependsOnFields() {
        return inner.diffusivityDependsOnFields();
    }

    @Override
    public PointKernel copy() {
        return new NoSourceKernel(inner.copy());
    }
}
