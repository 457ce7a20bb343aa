package rdstab.solver.eigen;

import org.ejml.data.DMatrixSparseCSC;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.linear.Factorizations;
import rdstab.solver.linear.SparseOps;

/**
 * A diagonal similarity J ↦ D⁻¹ J D that makes a non-symmetric operator as symmetric as a diagonal scaling
 * can, computed before its eigenvalues (with a diagonal M, D⁻¹ M D = M, so the pencil keeps its eigenvalues).
 *
 * <p><b>Why.</b> Central-difference convection–diffusion with mesh Péclet number P is similar to a symmetric
 * operator through a diagonal growing like e^{P x/2}: its eigenvalues are exactly real, but in the original
 * coordinates their condition numbers grow like e^{P/2}, and a backward-stable eigen-solver returns them
 * with errors of κ·ε‖J‖ (at P ≈ 100 the first digit is wrong and spurious complex pairs appear). In the
 * scaled coordinates the same eigenvalues are well conditioned. Row/column-norm balancing (as done before
 * dense eigen-solvers) does not help: the rows and columns of such an operator already have equal norms.
 *
 * <p><b>Construction.</b> (D⁻¹ J D)_ij = J_ij d_j/d_i and (D⁻¹ J D)_ji have equal magnitudes when
 * s_j − s_i = ½ ln|J_ji/J_ij| with s = ln d: the pair becomes symmetric (same signs) or skew (opposite signs, as a
 * reactant–temperature coupling is), and its share of the Frobenius norm is then least. One condition per pair of
 * stored non-zero entries. They are consistent for one field with drift (a chain or a grid) and for couplings
 * that close every cycle: then s follows by integrating along spanning trees of the pair graph, in O(nnz).
 * Otherwise (two fields with different Péclet numbers) s solves them in the least-squares sense: the graph
 * Laplacian system L s = b (one unit weight per pair, a tiny multiple of the identity added so that every
 * connected part has a unique solution), by sparse Cholesky. An entry whose mirror is zero imposes nothing.
 * s is clipped to ±{@link #MAX_LOG} so that D stays far from overflow; the scaling is used only when it spans
 * more than a factor {@link #MIN_SPAN} and lowers ‖J‖_F (the eigenvalues stay, so Henrici's departure from
 * normality, ‖J‖_F² − Σ|λ|², falls with it): a scaling that blew up a coupling was once accepted and gave a
 * shift of 2.5e12 and a wrong eigenvalue (tubular reactor with Pe_m = 60, Pe_h = 6; now a test).
 */
public final class DiagonalScaling {

    /** Scalings spanning at most this factor (max d / min d) are not applied. */
    static final double MIN_SPAN = 10.0;
    /** Largest |ln d| used (e^300 ≈ 1e130: products with D and D⁻¹ stay in range). */
    static final double MAX_LOG = 300.0;
    /** Pairs whose ½|ln(J_ji/J_ij)| is below this are treated as symmetric (no scaling needed for them). */
    static final double SYMMETRIC_PAIR = 1e-12;

    private static final DiagonalScaling IDENTITY = new DiagonalScaling(null);

    private final double[] d;

    private DiagonalScaling(double[] d) {
        this.d = d;
    }

    /** No scaling. */
    public static DiagonalScaling identity() {
        return IDENTITY;
    }

    /** True when this is no scaling at all. */
    public boolean isIdentity() {
        return d == null;
    }

    /** max d / min d (1 for the identity). */
    public double span() {
        if (d == null) {
            return 1.0;
        }
        double lo = Double.POSITIVE_INFINITY;
        double hi = 0.0;
        for (double v : d) {
            lo = Math.min(lo, v);
            hi = Math.max(hi, v);
        }
        return hi / lo;
    }

    /**
     * The symmetrizing scaling of J for the pencil (J, M), or the identity when M is not diagonal, J is
     * symmetric already, the scaling would span no more than {@link #MIN_SPAN}, or it would not lower ‖J‖_F.
     */
    public static DiagonalScaling symmetrizing(DMatrixSparseCSC j, DMatrixSparseCSC m) {
        return symmetrize(j, m).scaling();
    }

    /** A scaling with the matrix it produced (J itself for the identity), so that D⁻¹JD is formed once. */
    record Symmetrized(DiagonalScaling scaling, DMatrixSparseCSC scaled) {
    }

    /** {@link #symmetrizing} with D⁻¹JD, which its Frobenius-norm test has formed anyway. */
    static Symmetrized symmetrize(DMatrixSparseCSC j, DMatrixSparseCSC m) {
        Symmetrized none = new Symmetrized(IDENTITY, j);
        if (!SparseOps.isDiagonal(m)) {
            return none;
        }
        Pairs pairs = Pairs.of(j);
        if (pairs.count == 0 || !pairs.asymmetric) {
            return none;
        }
        double[] s = pairs.integrateAlongTrees(j.numCols);
        if (pairs.inconsistency(s) > CONSISTENT * Math.max(1.0, pairs.largestTarget())) {
            s = pairs.leastSquares(j.numCols);
            if (s == null) {
                return none; // a scaling is an improvement, never a requirement
            }
        }
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (double v : s) {
            lo = Math.min(lo, v);
            hi = Math.max(hi, v);
        }
        if (!(hi - lo > Math.log(MIN_SPAN))) {
            return none;
        }
        double mid = 0.5 * (hi + lo);
        double[] d = new double[s.length];
        for (int i = 0; i < d.length; i++) {
            d[i] = Math.exp(Math.max(-MAX_LOG, Math.min(MAX_LOG, s[i] - mid)));
        }
        DiagonalScaling scaling = new DiagonalScaling(d);
        // accept only a scaling that lowers ‖J‖_F: the eigenvalues stay, so Henrici's departure from normality
        // (‖J‖_F² − Σ|λ|²) falls with it. Guards against couplings the conditions could not reach (an entry whose
        // mirror is zero), which a scaling can blow up.
        DMatrixSparseCSC scaled = scaling.scale(j);
        return offDiagonalFrobenius(scaled) < (1 - 1e-3) * offDiagonalFrobenius(j) ? new Symmetrized(scaling, scaled) : none;
    }

    /** ‖J − diag(J)‖_F, the part of the Frobenius norm a diagonal similarity can change. */
    static double offDiagonalFrobenius(DMatrixSparseCSC j) {
        double scale = 0;
        for (int c = 0; c < j.numCols; c++) {
            for (int p = j.col_idx[c]; p < j.col_idx[c + 1]; p++) {
                if (j.nz_rows[p] != c) {
                    scale = Math.max(scale, Math.abs(j.nz_values[p]));
                }
            }
        }
        if (!(scale > 0) || !Double.isFinite(scale)) {
            return scale;
        }
        double sum = 0;
        for (int c = 0; c < j.numCols; c++) {
            for (int p = j.col_idx[c]; p < j.col_idx[c + 1]; p++) {
                if (j.nz_rows[p] != c) {
                    double v = j.nz_values[p] / scale;
                    sum += v * v;
                }
            }
        }
        return scale * Math.sqrt(sum);
    }

    /** Largest misfit |s_k − s_i − t| (relative to max(1, max |t|)) below which the conditions count as consistent. */
    static final double CONSISTENT = 1e-10;

    /** The pairs (i, k) of stored non-zero entries J_ki, J_ik with their targets t = ½ ln|J_ki / J_ik| = s_k − s_i. */
    private static final class Pairs {
        int count;
        boolean asymmetric;
        int[] from;
        int[] to;
        double[] target;

        static Pairs of(DMatrixSparseCSC j) {
            int n = j.numCols;
            Pairs p = new Pairs();
            p.from = new int[16];
            p.to = new int[16];
            p.target = new double[16];
            DMatrixSparseCSC a = j;
            if (!j.indicesSorted) {
                a = j.copy();
                a.sortIndices(null);
            }
            for (int i = 0; i < n; i++) {
                for (int q = a.col_idx[i]; q < a.col_idx[i + 1]; q++) {
                    int k = a.nz_rows[q];
                    if (k <= i) {
                        continue; // each pair once
                    }
                    // J_ik is row i of column k: a binary search in its sorted rows
                    int at = java.util.Arrays.binarySearch(a.nz_rows, a.col_idx[k], a.col_idx[k + 1], i);
                    if (at < 0) {
                        continue; // one entry of the pair missing: no condition
                    }
                    double jki = Math.abs(a.nz_values[q]);
                    double jik = Math.abs(a.nz_values[at]);
                    if (jki == jik) {
                        p.add(i, k, 0.0);
                    } else if (jki > 0 && jik > 0) {
                        // equal magnitudes: symmetric for a same-sign pair, skew for an opposite-sign one (a coupling
                        // such as reactant–temperature): either way the pair's share of ‖·‖_F is least
                        p.add(i, k, 0.5 * Math.log(jki / jik));
                    }
                }
            }
            return p;
        }

        private void add(int i, int k, double t) {
            if (count == from.length) {
                from = java.util.Arrays.copyOf(from, 2 * count);
                to = java.util.Arrays.copyOf(to, 2 * count);
                target = java.util.Arrays.copyOf(target, 2 * count);
            }
            from[count] = i;
            to[count] = k;
            target[count] = t;
            count++;
            if (Math.abs(t) > SYMMETRIC_PAIR) {
                asymmetric = true;
            }
        }

        double largestTarget() {
            double t = 0;
            for (int e = 0; e < count; e++) {
                t = Math.max(t, Math.abs(target[e]));
            }
            return t;
        }

        /**
         * s along breadth-first spanning trees of the pair graph (s = 0 at each tree's root): exact when the
         * conditions are consistent (one field with drift, or couplings that close every cycle), O(pairs).
         */
        double[] integrateAlongTrees(int n) {
            int[] start = new int[n + 1];
            for (int e = 0; e < count; e++) {
                start[from[e] + 1]++;
                start[to[e] + 1]++;
            }
            for (int i = 0; i < n; i++) {
                start[i + 1] += start[i];
            }
            int[] next = start.clone();
            int[] other = new int[2 * count];
            double[] step = new double[2 * count];
            for (int e = 0; e < count; e++) {
                other[next[from[e]]] = to[e];
                step[next[from[e]]++] = target[e];
                other[next[to[e]]] = from[e];
                step[next[to[e]]++] = -target[e];
            }
            double[] s = new double[n];
            boolean[] seen = new boolean[n];
            int[] queue = new int[n];
            for (int root = 0; root < n; root++) {
                if (seen[root]) {
                    continue;
                }
                seen[root] = true;
                int head = 0;
                int tail = 0;
                queue[tail++] = root;
                while (head < tail) {
                    int u = queue[head++];
                    for (int q = start[u]; q < start[u + 1]; q++) {
                        int v = other[q];
                        if (!seen[v]) {
                            seen[v] = true;
                            s[v] = s[u] + step[q];
                            queue[tail++] = v;
                        }
                    }
                }
            }
            return s;
        }

        /** Largest |s_k − s_i − t| over the pairs. */
        double inconsistency(double[] s) {
            double worst = 0;
            for (int e = 0; e < count; e++) {
                worst = Math.max(worst, Math.abs(s[to[e]] - s[from[e]] - target[e]));
            }
            return worst;
        }

        /** The least-squares s: (L + tiny·I) s = b with L the pair graph's Laplacian, by sparse Cholesky; null on failure. */
        double[] leastSquares(int n) {
            double[] b = new double[n];
            double[] degree = new double[n];
            org.ejml.data.DMatrixSparseTriplet lap = new org.ejml.data.DMatrixSparseTriplet(n, n, 2 * count + n);
            for (int e = 0; e < count; e++) {
                b[to[e]] += target[e];
                b[from[e]] -= target[e];
                degree[from[e]] += 1;
                degree[to[e]] += 1;
                lap.addItem(from[e], to[e], -1.0);
                lap.addItem(to[e], from[e], -1.0);
            }
            double maxDegree = 0;
            for (double g : degree) {
                maxDegree = Math.max(maxDegree, g);
            }
            double tiny = 1e-10 * Math.max(1.0, maxDegree);
            for (int i = 0; i < n; i++) {
                lap.addItem(i, i, degree[i] + tiny);
            }
            DMatrixSparseCSC l = org.ejml.ops.DConvertMatrixStruct.convert(lap, (DMatrixSparseCSC) null);
            double[] s = new double[n];
            try {
                Factorizations.factor(l, true, Factorizations.defaultOrdering()).solve(b, s);
            } catch (ConvergenceException e) {
                return null;
            }
            return s;
        }
    }

    /** D⁻¹ J D (a new matrix; J is not modified). */
    public DMatrixSparseCSC scale(DMatrixSparseCSC j) {
        if (d == null) {
            return j;
        }
        DMatrixSparseCSC out = j.copy();
        for (int c = 0; c < out.numCols; c++) {
            for (int p = out.col_idx[c]; p < out.col_idx[c + 1]; p++) {
                out.nz_values[p] *= d[c] / d[out.nz_rows[p]];
            }
        }
        return out;
    }

    /** D x̃: a right eigenvector of D⁻¹JD taken back to the original coordinates (a new array). */
    public double[] toOriginal(double[] scaled) {
        if (d == null) {
            return scaled.clone();
        }
        double[] x = new double[scaled.length];
        for (int i = 0; i < x.length; i++) {
            x[i] = d[i] * scaled[i];
        }
        return x;
    }

    /** D⁻¹ x: a vector of the original coordinates in the scaled ones, or a left eigenvector taken back. */
    public double[] toScaled(double[] x) {
        if (d == null) {
            return x.clone();
        }
        double[] y = new double[x.length];
        for (int i = 0; i < y.length; i++) {
            y[i] = x[i] / d[i];
        }
        return y;
    }
}
