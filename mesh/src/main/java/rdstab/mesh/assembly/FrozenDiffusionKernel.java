package rdstab.mesh.assembly;

import java.util.Arrays;

/**
 * Kernel of the pure-diffusion variant (see {@link FiniteVolume1D#pureDiffusion(double[])}):
 * diffusivities tabulated per node and frozen, zero source, no drift. It may only be evaluated at
 * the node coordinates it was built from.
 */
final class FrozenDiffusionKernel implements PointKernel {

    private final double[] nodes;
    private final double[][] k;

    FrozenDiffusionKernel(double[] nodes, double[][] k) {
        this.nodes = nodes;
        this.k = k;
    }

    @Override
    public int fieldCount() {
        return k[0].length;
    }

    @Override
    public void source(double[] x, double[] u, double[] s, double[][] dsdu) {
        Arrays.fill(s, 0.0);
        for (double[] row : dsdu) {
            Arrays.fill(row, 0.0);
        }
    }

    @Override
    public void diffusivity(double[] x, double[] u, double[] kOut, double[][] dkdu) {
        int i = Arrays.binarySearch(nodes, x[0]);
        if (i < 0) {
            throw new IllegalStateException("frozen diffusivity is tabulated at the grid nodes only, asked at x = " + x[0]);
        }
        System.arraycopy(k[i], 0, kOut, 0, kOut.length);
        for (double[] row : dkdu) {
            Arrays.fill(row, 0.0);
        }
    }
}
