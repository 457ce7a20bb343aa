package rdstab.mesh.assembly;

import org.ejml.data.DMatrixSparseCSC;

/**
 * A mesh with its field layout and the three assembled operators of the semi-discrete system
 * <pre>
 *   M du/dt = F(u)
 * </pre>
 * where u holds the unknown nodal values (nodes with a fixed value are not unknowns), F is the
 * residual, J = ∂F/∂u its exact sparse Jacobian and M the symmetric positive-definite weight
 * (mass) matrix that defines the energy inner product ⟨v, w⟩ = vᵀ M w. The stability
 * eigenproblem is J x = λ M x; Re λ &gt; 0 means growth.
 *
 * <p>Unknowns are numbered node-major: all fields of node 0, then of node 1, ... (skipping fixed
 * values), which keeps 1D Jacobians banded.
 */
public interface Discretization {

    /** Number of unknowns (rows of J and M). */
    int unknowns();

    /** Number of mesh nodes (including nodes whose values are fixed). */
    int nodes();

    /** Number of fields. */
    int fieldCount();

    /** Space dimension of the node coordinates (1 or 2). */
    int dimension();

    /** Coordinate {@code dir} of node {@code node}. */
    double coordinate(int node, int dir);

    /** Unknown index of field {@code field} at node {@code node}, or −1 when its value is fixed. */
    int unknownIndex(int field, int node);

    /**
     * Residual F(u).
     *
     * @param u unknown vector (length {@link #unknowns()}), not modified
     * @param f output, length {@link #unknowns()}, overwritten
     */
    void residual(double[] u, double[] f);

    /** Exact Jacobian ∂F/∂u at u, a new matrix (the pattern is the same for every u). */
    DMatrixSparseCSC jacobian(double[] u);

    /** Weight (mass) matrix M: symmetric positive definite; diagonal for lumped schemes. */
    DMatrixSparseCSC mass();

    /** True when M is diagonal. */
    boolean massIsDiagonal();

    /**
     * Nodal values of every field, fixed values included: out[field][node].
     *
     * @param u unknown vector, not modified
     */
    double[][] nodalValues(double[] u);

    /**
     * Nodal values of a perturbation (a mode): like {@link #nodalValues} but fixed-value nodes get 0.
     */
    double[][] nodalPerturbation(double[] v);

    /** Unknown vector built from nodal values (fixed-value entries of {@code nodal} are ignored). */
    double[] unknownsFromNodal(double[][] nodal);

    /** Volume (weight) associated with each node, for integrals: ∫ g ≈ Σ w_i g_i. */
    double[] nodeWeights();

    /**
     * The mesh cells as lists of node indices, for writers of mesh files (VTK) and plots: 2 nodes per cell
     * (line segments) in 1D, 3 (triangles, counter-clockwise) or 4 (quadrilaterals, counter-clockwise) in 2D.
     * The default gives consecutive segments, right for 1D grids numbered along the coordinate.
     */
    default int[][] cells() {
        int[][] c = new int[Math.max(nodes() - 1, 0)][];
        for (int i = 0; i + 1 < nodes(); i++) {
            c[i] = new int[] {i, i + 1};
        }
        return c;
    }
}
