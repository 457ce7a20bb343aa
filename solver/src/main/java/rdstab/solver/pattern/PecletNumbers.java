package rdstab.solver.pattern;

import java.util.ArrayList;
import java.util.List;
import rdstab.mesh.assembly.DriftScheme;
import rdstab.mesh.assembly.FiniteVolume1D;
import rdstab.mesh.assembly.PointKernel;
import rdstab.mesh.grid.Grid1D;

/**
 * Péclet numbers of the fields with drift, at the base state.
 *
 * <p>Pe = max|c|·L / min k over the nodes (L the length of the domain): drift against diffusion over
 * the body. The cell Péclet number max_i |c_i| h_i / k_i (h_i the larger spacing next to node i) decides
 * whether the centred drift difference is monotone: above 2 the centred scheme gives oscillating,
 * unphysical profiles and spurious modes (common practice: the three-point centred stencil has a
 * negative neighbour weight when |c|h/k &gt; 2), and the upwind scheme should be used (or the grid refined).
 */
public final class PecletNumbers {

    /** The cell Péclet number above which the centred scheme is not monotone. */
    public static final double CENTRED_LIMIT = 2.0;

    /**
     * @param field       field name
     * @param peclet      Pe = max|c| L / min k
     * @param cellPeclet  max over nodes of |c| h / k
     * @param maxSpeed    max |c|
     */
    public record Field(String field, double peclet, double cellPeclet, double maxSpeed) {
    }

    /**
     * @param fields  one entry per field with drift (empty without drift)
     * @param scheme  the drift scheme in use
     * @param warning a sentence when the centred scheme runs above cell Péclet 2, else null
     */
    public record Result(List<Field> fields, DriftScheme scheme, String warning) {
        public Result {
            fields = List.copyOf(fields);
        }
    }

    private PecletNumbers() {
    }

    /** Péclet numbers of a 1D discretization at the base state u (no drift: an empty result). */
    public static Result of(FiniteVolume1D d, List<String> names, double[] u) {
        PointKernel k = d.kernel().copy();
        Grid1D g = d.grid();
        int nf = d.fieldCount();
        List<Field> out = new ArrayList<>();
        if (!k.hasDrift()) {
            return new Result(out, d.driftScheme(), null);
        }
        double[][] nodal = d.nodalValues(u);
        double length = g.x(g.nodeCount() - 1) - g.x(0);
        double[] x = new double[1];
        double[] ui = new double[nf];
        double[] kk = new double[nf];
        double[][] dk = new double[nf][nf];
        double[] maxC = new double[nf];
        double[] minK = new double[nf];
        double[] cell = new double[nf];
        java.util.Arrays.fill(minK, Double.POSITIVE_INFINITY);
        for (int i = 0; i < g.nodeCount(); i++) {
            x[0] = g.x(i);
            for (int f = 0; f < nf; f++) {
                ui[f] = nodal[f][i];
            }
            k.diffusivity(x, ui, kk, dk);
            double h = Math.max(i > 0 ? g.x(i) - g.x(i - 1) : 0, i + 1 < g.nodeCount() ? g.x(i + 1) - g.x(i) : 0);
            for (int f = 0; f < nf; f++) {
                double c = Math.abs(k.drift(f, x, 0));
                maxC[f] = Math.max(maxC[f], c);
                minK[f] = Math.min(minK[f], kk[f]);
                cell[f] = Math.max(cell[f], c * h / kk[f]);
            }
        }
        String warning = null;
        for (int f = 0; f < nf; f++) {
            if (maxC[f] == 0) {
                continue;
            }
            out.add(new Field(names.get(f), maxC[f] * length / minK[f], cell[f], maxC[f]));
            if (d.driftScheme() == DriftScheme.CENTRED && cell[f] > CENTRED_LIMIT && warning == null) {
                warning = String.format(java.util.Locale.ROOT, "the cell Péclet number of field '%s' is %.3g, above 2: the "
                        + "centred drift scheme may give oscillating profiles and spurious modes; refine the mesh to at "
                        + "least %d cells or set 'analysis: drift-scheme: upwind'", names.get(f), cell[f],
                        (int) Math.ceil((g.nodeCount() - 1) * cell[f] / CENTRED_LIMIT));
            }
        }
        return new Result(out, d.driftScheme(), warning);
    }
}
