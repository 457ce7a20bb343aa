package rdstab.solver.linear;

import rdstab.solver.error.ConvergenceException;

/**
 * Triangular solves with the supernodal panels of a {@link CholeskySymbolic} structure, shared by
 * {@link SupernodalCholesky} (L y = b, Lᵀ z = y) and {@link SupernodalLU} (unit-lower L y = b, U z = y
 * with U stored as Uᵀ panels).
 *
 * <p>Panel t holds columns f..f+w−1 of a lower-triangular factor as a dense m×w column-major block whose
 * first w rows are the columns themselves (the diagonal block) and whose last m − w rows are the
 * scattered rows r_w … r_{m−1} below it. The solves run down each panel column in one loop (diagonal
 * block and rows below together): most panels are a few columns of a few dozen rows, where the loop count,
 * not the arithmetic, sets the time. Variants that split each column into its diagonal and scattered parts,
 * or combined four columns per sweep of a gathered scratch vector, measured 40–70 % slower at 512²
 * (docs/design-notes.md).
 *
 * <p>The kernels work on a contiguous run of panels: in postorder a subtree of the elimination tree is such
 * a run, so the two groups of disjoint subtrees of a {@link TreeSplit} are solved by two threads. Forward,
 * the second group accumulates its contributions to the top rows in a separate vector that is added
 * afterwards (the only rows both groups write), then the top panels are solved; backward, the top panels
 * come first and the groups then write disjoint rows. Two right-hand sides can share one pass over the
 * panels (the panel values are the memory traffic of a solve).
 */
final class PanelSolve {

    private final CholeskySymbolic s;
    private final double[] lower;
    private final double[] upper;
    private final boolean unitLower;
    private final TreeSplit split;
    private final double[] y;
    private double[] z;
    private double[] y1;
    private double[] z1;

    /**
     * Solver for L U x = b (or L Lᵀ x = b) with the panels of the two triangles.
     *
     * @param lower     panels of L (its diagonal is used unless unitLower)
     * @param upper     panels of Uᵀ, whose diagonal is U's (the same array as lower for a Cholesky factor)
     * @param unitLower true when L has a unit diagonal (LU)
     */
    PanelSolve(CholeskySymbolic s, double[] lower, double[] upper, boolean unitLower) {
        this.s = s;
        this.lower = lower;
        this.upper = upper;
        this.unitLower = unitLower;
        this.split = s.split();
        this.y = new double[s.n];
    }

    /** x = A⁻¹ b. Not thread-safe (scratch arrays). */
    void solve(double[] b, double[] x) {
        permute(s.perm, b, y);
        forward(y, null);
        backward(y, null);
        unpermute(s.perm, y, x);
    }

    /** x_i = A⁻¹ b_i for i &lt; count, two per pass over the panels. */
    void solve(double[][] b, double[][] x, int count) {
        int i = 0;
        for (; i + 1 < count; i += 2) {
            if (z == null) {
                z = new double[s.n];
            }
            permute(s.perm, b[i], y);
            permute(s.perm, b[i + 1], z);
            forward(y, z);
            backward(y, z);
            unpermute(s.perm, y, x[i]);
            unpermute(s.perm, z, x[i + 1]);
        }
        if (i < count) {
            solve(b[i], x[i]);
        }
    }

    /** Forward substitution of one or (z not null) two vectors, the two tree groups in parallel. */
    private void forward(double[] u, double[] w) {
        if (split.trivial()) {
            forwardRange(u, w, 0, s.supernodes);
            return;
        }
        if (y1 == null) {
            y1 = new double[s.n];
        }
        if (w != null && z1 == null) {
            z1 = new double[s.n];
        }
        double[] u1 = y1;
        double[] w1 = w == null ? null : z1;
        ParallelPair.both(() -> {
            for (int[] r : split.group0) {
                forwardRange(u, w, r[0], r[1]);
            }
            return true;
        }, () -> {
            for (int[] r : split.group1) {
                copyColumns(u, u1, r);
                copyColumns(w, w1, r);
            }
            for (int c : split.topColumns) {
                u1[c] = 0.0;
                if (w1 != null) {
                    w1[c] = 0.0;
                }
            }
            for (int[] r : split.group1) {
                forwardRange(u1, w1, r[0], r[1]);
            }
            return true;
        });
        for (int[] r : split.group1) {
            copyColumns(u1, u, r);
            copyColumns(w1, w, r);
        }
        for (int c : split.topColumns) {
            u[c] += u1[c];
            if (w != null) {
                w[c] += w1[c];
            }
        }
        for (int t : split.top) {
            forwardRange(u, w, t, t + 1);
        }
    }

    /** Backward substitution: the top panels first, then the two groups in parallel (they write disjoint rows). */
    private void backward(double[] u, double[] w) {
        if (split.trivial()) {
            backwardRange(u, w, 0, s.supernodes);
            return;
        }
        for (int i = split.top.length - 1; i >= 0; i--) {
            backwardRange(u, w, split.top[i], split.top[i] + 1);
        }
        ParallelPair.both(() -> {
            for (int[] r : split.group0) {
                backwardRange(u, w, r[0], r[1]);
            }
            return true;
        }, () -> {
            for (int[] r : split.group1) {
                backwardRange(u, w, r[0], r[1]);
            }
            return true;
        });
    }

    private void forwardRange(double[] u, double[] w, int from, int to) {
        if (w == null) {
            forward(s, lower, u, unitLower, from, to);
        } else {
            forward2(s, lower, u, w, unitLower, from, to);
        }
    }

    private void backwardRange(double[] u, double[] w, int from, int to) {
        if (w == null) {
            backward(s, upper, u, from, to);
        } else {
            backward2(s, upper, u, w, from, to);
        }
    }

    /** to[c] = from[c] for the columns of the panel range r (nothing when from is null). */
    private void copyColumns(double[] from, double[] to, int[] r) {
        if (from != null) {
            int c0 = s.first[r[0]];
            System.arraycopy(from, c0, to, c0, s.first[r[1]] - c0);
        }
    }

    /**
     * Forward substitution over panels [fromPanel, toPanel): y ← L⁻¹ y on those columns, subtracting their
     * contributions from the rows below (which may lie outside the range).
     *
     * @param unitDiagonal true for the unit-lower L of an LU (diagonal entries of the panels not used)
     */
    static void forward(CholeskySymbolic s, double[] v, double[] y, boolean unitDiagonal, int fromPanel,
                        int toPanel) {
        int[] rows = s.rows;
        for (int t = fromPanel; t < toPanel; t++) {
            int f = s.first[t];
            int w = s.first[t + 1] - f;
            int r0 = s.rowStart[t];
            int m = s.rowStart[t + 1] - r0;
            int base = (int) s.valueStart[t];
            for (int k = 0; k < w; k++) {
                int ck = base + k * m;
                double yk = unitDiagonal ? y[f + k] : y[f + k] / v[ck + k];
                y[f + k] = yk;
                for (int i = k + 1; i < m; i++) {
                    y[rows[r0 + i]] -= v[ck + i] * yk;
                }
            }
        }
    }

    /**
     * Backward substitution over panels [fromPanel, toPanel), last panel first: y ← L⁻ᵀ y on those columns,
     * reading (not writing) the already solved rows below them.
     */
    static void backward(CholeskySymbolic s, double[] v, double[] y, int fromPanel, int toPanel) {
        int[] rows = s.rows;
        for (int t = toPanel - 1; t >= fromPanel; t--) {
            int f = s.first[t];
            int w = s.first[t + 1] - f;
            int r0 = s.rowStart[t];
            int m = s.rowStart[t + 1] - r0;
            int base = (int) s.valueStart[t];
            for (int k = w - 1; k >= 0; k--) {
                int ck = base + k * m;
                double sum = y[f + k];
                for (int i = k + 1; i < m; i++) {
                    sum -= v[ck + i] * y[rows[r0 + i]];
                }
                y[f + k] = sum / v[ck + k];
            }
        }
    }

    /** {@link #forward} for two vectors at once: each panel value is loaded once for both. */
    static void forward2(CholeskySymbolic s, double[] v, double[] y, double[] z, boolean unitDiagonal, int fromPanel,
                         int toPanel) {
        int[] rows = s.rows;
        for (int t = fromPanel; t < toPanel; t++) {
            int f = s.first[t];
            int w = s.first[t + 1] - f;
            int r0 = s.rowStart[t];
            int m = s.rowStart[t + 1] - r0;
            int base = (int) s.valueStart[t];
            for (int k = 0; k < w; k++) {
                int ck = base + k * m;
                double d = unitDiagonal ? 1.0 : v[ck + k];
                double yk = y[f + k] / d;
                double zk = z[f + k] / d;
                y[f + k] = yk;
                z[f + k] = zk;
                for (int i = k + 1; i < m; i++) {
                    int row = rows[r0 + i];
                    double l = v[ck + i];
                    y[row] -= l * yk;
                    z[row] -= l * zk;
                }
            }
        }
    }

    /** {@link #backward} for two vectors at once. */
    static void backward2(CholeskySymbolic s, double[] v, double[] y, double[] z, int fromPanel, int toPanel) {
        int[] rows = s.rows;
        for (int t = toPanel - 1; t >= fromPanel; t--) {
            int f = s.first[t];
            int w = s.first[t + 1] - f;
            int r0 = s.rowStart[t];
            int m = s.rowStart[t + 1] - r0;
            int base = (int) s.valueStart[t];
            for (int k = w - 1; k >= 0; k--) {
                int ck = base + k * m;
                double sy = y[f + k];
                double sz = z[f + k];
                for (int i = k + 1; i < m; i++) {
                    int row = rows[r0 + i];
                    double l = v[ck + i];
                    sy -= l * y[row];
                    sz -= l * z[row];
                }
                double d = v[ck + k];
                y[f + k] = sy / d;
                z[f + k] = sz / d;
            }
        }
    }

    /** y = P b: the right-hand side in the factor's (permuted) order. */
    static void permute(int[] perm, double[] b, double[] y) {
        for (int k = 0; k < y.length; k++) {
            y[k] = b[perm[k]];
        }
    }

    /**
     * x = Pᵀ y, checking that every value is finite.
     *
     * @throws ConvergenceException SINGULAR_SHIFT on a value that is not finite
     */
    static void unpermute(int[] perm, double[] y, double[] x) {
        for (int k = 0; k < y.length; k++) {
            double vk = y[k];
            if (!Double.isFinite(vk)) {
                throw new ConvergenceException(ConvergenceException.Reason.SINGULAR_SHIFT,
                        "The linear solve produced a non-finite value: the factored matrix is singular or badly scaled.",
                        -1, Double.NaN);
            }
            x[perm[k]] = vk;
        }
    }
}
