package rdstab.solver.linear;

import java.util.Arrays;
import java.util.function.Supplier;

/**
 * The left-looking supernodal loop shared by {@link SupernodalCholesky} and {@link SupernodalLU}: panel t
 * receives the updates of every earlier panel d with a row in t's columns, then is factorized densely.
 * Descendants are found through linked lists keyed by the next row each one still has to deliver
 * (Ng–Peyton): after panel d has updated the panels owning rows up to some point, it is linked into the
 * list of the owner of its next row. Subclasses supply the update and the dense panel factorization.
 *
 * <p>{@link #run} factorizes the two groups of a {@link TreeSplit} in two threads, each with its own lists
 * and scratch, then merges the lists still pending for the top panels and finishes those in the caller.
 */
abstract class PanelNumeric {

    final CholeskySymbolic s;
    final int[] map;
    private final int[] head;
    private final int[] next;
    private final int[] ptr;

    PanelNumeric(CholeskySymbolic s) {
        this.s = s;
        this.map = new int[s.n];
        this.head = new int[s.supernodes];
        this.next = new int[s.supernodes];
        this.ptr = new int[s.supernodes];
        Arrays.fill(head, -1);
    }

    /**
     * Subtracts the contributions of panel d's rows p1 … p2−1 (its rows that are columns of t) to the panel
     * of t at base (height m). The caller advances d past them and relinks it.
     */
    abstract void update(int d, int t, int p1, int p2, int base, int m);

    /** Dense factorization of the m×w panel at base (first column f); false when refused. */
    abstract boolean factorPanel(int base, int m, int w, int f);

    /** Numeric phase over the whole structure, split over two threads when the structure is large. */
    static boolean run(CholeskySymbolic s, Supplier<? extends PanelNumeric> make) {
        TreeSplit split = s.split();
        PanelNumeric main = make.get();
        if (split.trivial()) {
            return main.runRanges(split.group0);
        }
        PanelNumeric other = make.get();
        boolean[] ok = ParallelPair.both(() -> main.runRanges(split.group0), () -> other.runRanges(split.group1));
        if (!ok[0] || !ok[1]) {
            return false;
        }
        main.absorb(other, split);
        for (int t : split.top) {
            if (!main.process(t)) {
                return false;
            }
        }
        return true;
    }

    private boolean runRanges(int[][] ranges) {
        for (int[] r : ranges) {
            for (int t = r[0]; t < r[1]; t++) {
                if (!process(t)) {
                    return false;
                }
            }
        }
        return true;
    }

    /** Takes over the progress and the pending lists of the panels that {@code other} factorized. */
    private void absorb(PanelNumeric other, TreeSplit split) {
        for (int[] r : split.group1) {
            System.arraycopy(other.ptr, r[0], ptr, r[0], r[1] - r[0]);
        }
        for (int a : split.top) {
            int d = other.head[a];
            while (d != -1) {
                int nd = other.next[d];
                next[d] = head[a];
                head[a] = d;
                d = nd;
            }
        }
    }

    private boolean process(int t) {
        int f = s.first[t];
        int w = s.first[t + 1] - f;
        int r0 = s.rowStart[t];
        int m = s.rowStart[t + 1] - r0;
        int base = (int) s.valueStart[t];
        for (int r = 0; r < m; r++) {
            map[s.rows[r0 + r]] = r;
        }
        int d = head[t];
        while (d != -1) {
            int nextD = next[d];
            int dr0 = s.rowStart[d];
            int md = s.rowStart[d + 1] - dr0;
            int p1 = ptr[d];
            int p2 = p1;
            while (p2 < md && s.rows[dr0 + p2] < f + w) {
                p2++;
            }
            update(d, t, p1, p2, base, m);
            ptr[d] = p2;
            if (p2 < md) {
                link(d, s.rows[dr0 + p2]);
            }
            d = nextD;
        }
        if (!factorPanel(base, m, w, f)) {
            return false;
        }
        if (m > w) {
            ptr[t] = w;
            link(t, s.rows[r0 + w]);
        }
        return true;
    }

    private void link(int d, int row) {
        int owner = s.superOf[row];
        next[d] = head[owner];
        head[owner] = d;
    }
}
