package rdstab.mesh.assembly;

import java.util.Arrays;

/**
 * The field layout shared by the discretizations (1D finite volumes, 2D grids and triangles): n fields at every node, unknowns numbered
 * node-major (all fields of node 0, then of node 1, …) skipping the (node, field) pairs whose value
 * is fixed. Flat arrays (index[node·n + field]) keep the memory at O(nodes) for 10^6 nodes.
 */
public abstract class NodalLayout implements Discretization {

    /** Number of fields. */
    protected final int nf;
    /** Number of nodes. */
    protected final int nn;
    /** index[node·nf + field]: unknown number, or −1 when fixed. */
    protected final int[] index;
    /** fixed[node·nf + field]: the fixed value (NaN when the pair is an unknown). */
    protected final double[] fixedValue;
    private final int unknowns;

    /**
     * @param nodes  number of nodes
     * @param fields number of fields (≥ 1)
     * @param fixed  fixed[node·fields + field] = the fixed value, or NaN for an unknown (copied)
     */
    protected NodalLayout(int nodes, int fields, double[] fixed) {
        if (fields < 1) {
            throw new IllegalArgumentException("kernel must have >= 1 field, got " + fields);
        }
        this.nf = fields;
        this.nn = nodes;
        this.fixedValue = fixed.clone();
        this.index = new int[nodes * fields];
        int count = 0;
        for (int k = 0; k < index.length; k++) {
            index[k] = Double.isNaN(fixedValue[k]) ? count++ : -1;
        }
        this.unknowns = count;
    }

    @Override
    public int unknowns() {
        return unknowns;
    }

    @Override
    public int nodes() {
        return nn;
    }

    @Override
    public int fieldCount() {
        return nf;
    }

    @Override
    public int unknownIndex(int field, int node) {
        return index[node * nf + field];
    }

    /** The flat unknown map index[node·nf + field] (not a copy: do not modify). */
    protected int[] indexMap() {
        return index;
    }

    /** Flat nodal values val[node·nf + field], fixed values included. */
    protected double[] flatValues(double[] u) {
        checkLength(u, "u");
        double[] v = new double[nn * nf];
        for (int k = 0; k < v.length; k++) {
            v[k] = index[k] >= 0 ? u[index[k]] : fixedValue[k];
        }
        return v;
    }

    @Override
    public double[][] nodalValues(double[] u) {
        checkLength(u, "u");
        double[][] out = new double[nf][nn];
        for (int i = 0; i < nn; i++) {
            for (int f = 0; f < nf; f++) {
                int k = i * nf + f;
                out[f][i] = index[k] >= 0 ? u[index[k]] : fixedValue[k];
            }
        }
        return out;
    }

    @Override
    public double[][] nodalPerturbation(double[] v) {
        checkLength(v, "v");
        double[][] out = new double[nf][nn];
        for (int i = 0; i < nn; i++) {
            for (int f = 0; f < nf; f++) {
                int k = i * nf + f;
                out[f][i] = index[k] >= 0 ? v[index[k]] : 0.0;
            }
        }
        return out;
    }

    @Override
    public double[] unknownsFromNodal(double[][] nodal) {
        if (nodal == null || nodal.length != nf) {
            throw new IllegalArgumentException("nodal values must have " + nf + " fields, got "
                    + (nodal == null ? "null" : nodal.length));
        }
        double[] u = new double[unknowns];
        for (int f = 0; f < nf; f++) {
            if (nodal[f] == null || nodal[f].length != nn) {
                throw new IllegalArgumentException("nodal values of field " + f + " must have " + nn
                        + " entries, got " + (nodal[f] == null ? "null" : nodal[f].length));
            }
            for (int i = 0; i < nn; i++) {
                if (index[i * nf + f] >= 0) {
                    u[index[i * nf + f]] = nodal[f][i];
                }
            }
        }
        return u;
    }

    /** out[row of (node, field f)] += v; nothing when that value is fixed (it has no equation). */
    protected final void addF(double[] out, int node, int f, double v) {
        int r = index[node * nf + f];
        if (r >= 0) {
            out[r] += v;
        }
    }

    /** Throws when v is not an unknown vector. */
    protected void checkLength(double[] v, String name) {
        if (v == null || v.length != unknowns) {
            throw new IllegalArgumentException(name + " must have " + unknowns + " entries, got "
                    + (v == null ? "null" : v.length));
        }
    }

    /**
     * Checks kernel output at a node: every value finite (else {@link ArithmeticException}) and,
     * when {@code positive}, every value &gt; 0 (else {@link IllegalArgumentException}).
     */
    protected void checkKernel(String what, double[] v, double[][] dv, boolean positive, int node, double[] x, double[] u) {
        for (int f = 0; f < v.length; f++) {
            boolean bad = !Double.isFinite(v[f]);
            for (int g = 0; g < v.length && !bad; g++) {
                bad = !Double.isFinite(dv[f][g]);
            }
            if (bad) {
                throw new ArithmeticException("kernel returned non-finite " + what + "_" + f + " = " + v[f]
                        + " (derivative row " + Arrays.toString(dv[f]) + ") at node " + node + " (x, y = "
                        + Arrays.toString(x) + "), field values " + Arrays.toString(u));
            }
            if (positive && !(v[f] > 0)) {
                throw new IllegalArgumentException(what + "_" + f + " must be > 0, got " + v[f] + " at node " + node
                        + " (x, y = " + Arrays.toString(x) + "), field values " + Arrays.toString(u));
            }
        }
    }
}
