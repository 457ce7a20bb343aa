package rdstab.solver.linear;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.PriorityQueue;

/**
 * A split of the supernodal elimination tree into two groups of disjoint subtrees plus the "top" panels
 * above them, so that two threads can factorize and solve the two groups at once.
 *
 * <p>In postorder a subtree is a contiguous run of panels, and the panels of one subtree never update
 * (factorization) or write to (backward solve) those of a disjoint one; they meet only in their common
 * ancestors, the top panels, which are done afterwards (factorization, forward solve) or before (backward
 * solve) by one thread. After a nested-dissection ordering the first split is the two halves below the last
 * separator. The split is chosen greedily: the heaviest subtree (weight = stored panel entries, the memory
 * traffic of a solve) is cut at its root until the two groups, filled largest first, differ by at most
 * {@link #IMBALANCE}, or {@link #MAX_CUTS} roots have moved to the top.
 *
 * <p><b>Same bits on every machine.</b> The split depends only on the symbolic structure, and the
 * arithmetic depends only on the split (the second group's contributions to the top rows are summed apart,
 * then added), never on how many threads run it: with one core both groups run one after the other in
 * the caller and give the identical result ({@link ParallelPair}).
 */
final class TreeSplit {

    /** Structures with fewer stored entries are not split (thread hand-off would cost more than it saves). */
    static final long MIN_VALUES = 200_000;
    /** Accepted relative difference of the two groups' weights. */
    static final double IMBALANCE = 0.05;
    /** Most panels moved to the top while balancing. */
    static final int MAX_CUTS = 64;

    /** Panel ranges {from, to} of each group. */
    final int[][] group0;
    final int[][] group1;
    /** Top panels, ascending. */
    final int[] top;
    /** Columns of the top panels, ascending. */
    final int[] topColumns;

    private TreeSplit(int[][] group0, int[][] group1, int[] top, int[] topColumns) {
        this.group0 = group0;
        this.group1 = group1;
        this.top = top;
        this.topColumns = topColumns;
    }

    /** True when there is no second group: everything is in group 0 and runs in the caller. */
    boolean trivial() {
        return group1.length == 0;
    }

    /** The split of a symbolic structure (see the class comment). */
    static TreeSplit of(CholeskySymbolic s) {
        int ns = s.supernodes;
        int[][] whole = {{0, ns}};
        if (s.values() < MIN_VALUES || ns < 4) {
            return new TreeSplit(whole, new int[0][], new int[0], new int[0]);
        }
        int[] parent = new int[ns];
        int[] size = new int[ns];
        long[] weight = new long[ns];
        int[] childCount = new int[ns];
        for (int t = 0; t < ns; t++) {
            int w = s.first[t + 1] - s.first[t];
            int m = s.rowStart[t + 1] - s.rowStart[t];
            parent[t] = m > w ? s.superOf[s.rows[s.rowStart[t] + w]] : -1;
            size[t] += 1;
            weight[t] += (long) m * w;
            if (parent[t] >= 0) {
                size[parent[t]] += size[t];
                weight[parent[t]] += weight[t];
                childCount[parent[t]]++;
            }
        }
        int[][] children = new int[ns][];
        for (int t = 0; t < ns; t++) {
            children[t] = new int[childCount[t]];
            childCount[t] = 0;
        }
        for (int t = 0; t < ns; t++) {
            if (parent[t] >= 0) {
                children[parent[t]][childCount[parent[t]]++] = t;
            }
        }
        PriorityQueue<Integer> candidates = new PriorityQueue<>((a, b) -> weight[b] != weight[a]
                ? Long.compare(weight[b], weight[a]) : Integer.compare(a, b));
        for (int t = 0; t < ns; t++) {
            if (parent[t] < 0) {
                candidates.add(t);
            }
        }
        List<Integer> top = new ArrayList<>();
        List<List<Integer>> bins = lpt(candidates, weight);
        for (int cut = 0; cut < MAX_CUTS && !balanced(bins, weight); cut++) {
            int heaviest = candidates.peek();
            if (children[heaviest].length == 0) {
                break;
            }
            candidates.poll();
            top.add(heaviest);
            for (int c : children[heaviest]) {
                candidates.add(c);
            }
            bins = lpt(candidates, weight);
        }
        if (bins.get(1).isEmpty()) {
            return new TreeSplit(whole, new int[0][], new int[0], new int[0]);
        }
        int[] topPanels = top.stream().mapToInt(Integer::intValue).sorted().toArray();
        int columns = 0;
        for (int t : topPanels) {
            columns += s.first[t + 1] - s.first[t];
        }
        int[] topColumns = new int[columns];
        int c = 0;
        for (int t : topPanels) {
            for (int j = s.first[t]; j < s.first[t + 1]; j++) {
                topColumns[c++] = j;
            }
        }
        return new TreeSplit(ranges(bins.get(0), size), ranges(bins.get(1), size), topPanels, topColumns);
    }

    /** Largest-first assignment of the candidate subtrees to two groups. */
    private static List<List<Integer>> lpt(PriorityQueue<Integer> candidates, long[] weight) {
        Integer[] sorted = candidates.toArray(new Integer[0]);
        Arrays.sort(sorted, (a, b) -> weight[b] != weight[a] ? Long.compare(weight[b], weight[a])
                : Integer.compare(a, b));
        List<List<Integer>> bins = List.of(new ArrayList<>(), new ArrayList<>());
        long w0 = 0;
        long w1 = 0;
        for (int t : sorted) {
            if (w0 <= w1) {
                bins.get(0).add(t);
                w0 += weight[t];
            } else {
                bins.get(1).add(t);
                w1 += weight[t];
            }
        }
        return bins;
    }

    private static boolean balanced(List<List<Integer>> bins, long[] weight) {
        long w0 = bins.get(0).stream().mapToLong(t -> weight[t]).sum();
        long w1 = bins.get(1).stream().mapToLong(t -> weight[t]).sum();
        return w1 > 0 && Math.abs(w0 - w1) <= IMBALANCE * Math.max(w0, w1);
    }

    private static int[][] ranges(List<Integer> roots, int[] size) {
        int[][] r = new int[roots.size()][];
        List<Integer> sorted = new ArrayList<>(roots);
        sorted.sort(null);
        for (int i = 0; i < r.length; i++) {
            int t = sorted.get(i);
            r[i] = new int[] {t - size[t] + 1, t + 1};
        }
        return r;
    }
}
