package rdstab.solver.sweep;

import java.util.ArrayList;
import java.util.List;
import rdstab.solver.error.InputException;

/**
 * The points of a one- or two-parameter sweep and their chains.
 *
 * <p><b>Numbering.</b> Point p has indices (i, j) along the first and second axis with
 * p = i + n₁ j: the first parameter varies fastest. A 1D sweep has j = 0.
 *
 * <p><b>Chains.</b> The base state at a point is warm-started from the base state of the previous
 * point of its chain. A chain is a run of at most {@code chainLength} consecutive points along the
 * first axis at fixed j: chain k of line j covers i = kL … min(kL + L, n₁) − 1. Its first point
 * starts from the case's own initial guess. Chains depend only on the specification — not on the
 * number of threads, the shard or on resuming — so every run of the same specification computes
 * the same numbers bit for bit. Chains are numbered in point order; chain numbers decide shards.
 *
 * @param axes        one or two varied parameters
 * @param chainLength points per chain (≥ 1): longer chains warm-start more points, shorter chains
 *                    give more independent work for threads and shards
 */
public record SweepGrid(List<Axis> axes, int chainLength) {

    /** Largest number of points of one sweep. */
    public static final long MAX_POINTS = 10_000_000L;

    public SweepGrid {
        axes = List.copyOf(axes);
        if (axes.isEmpty() || axes.size() > 2) {
            throw new InputException("command line", "--vary", "give one or two --vary options, found " + axes.size());
        }
        if (axes.size() == 2 && axes.get(0).name().equals(axes.get(1).name())) {
            throw new InputException("command line", "--vary", "the two --vary options name the same parameter '"
                    + axes.get(0).name() + "'");
        }
        if (chainLength < 1) {
            throw new InputException("command line", "--chain-length", "expected a whole number >= 1, found " + chainLength);
        }
        long n = 1;
        for (Axis a : axes) {
            n *= a.count();
        }
        if (n > MAX_POINTS) {
            throw new InputException("command line", "--vary", "the sweep has " + n + " points; at most " + MAX_POINTS);
        }
    }

    /** Number of points. */
    public int points() {
        int n = 1;
        for (Axis a : axes) {
            n *= a.count();
        }
        return n;
    }

    /** Number of lines along the first axis (the count of the second axis, 1 in 1D). */
    public int lines() {
        return axes.size() == 2 ? axes.get(1).count() : 1;
    }

    /** Chains per line. */
    public int chainsPerLine() {
        return (axes.get(0).count() + chainLength - 1) / chainLength;
    }

    /** Number of chains. */
    public int chains() {
        return chainsPerLine() * lines();
    }

    /** The point numbers of chain k, in order. */
    public int[] chain(int k) {
        int n1 = axes.get(0).count();
        int line = k / chainsPerLine();
        int start = (k % chainsPerLine()) * chainLength;
        int end = Math.min(start + chainLength, n1);
        int[] pts = new int[end - start];
        for (int i = 0; i < pts.length; i++) {
            pts[i] = line * n1 + start + i;
        }
        return pts;
    }

    /** The chain numbers that belong to a shard, in increasing order. */
    public List<Integer> chainsOf(Shard shard) {
        List<Integer> out = new ArrayList<>();
        for (int k = 0; k < chains(); k++) {
            if (shard.owns(k)) {
                out.add(k);
            }
        }
        return out;
    }

    /** The point numbers of a shard, in increasing order. */
    public int[] pointsOf(Shard shard) {
        List<Integer> ks = chainsOf(shard);
        List<int[]> parts = new ArrayList<>();
        int total = 0;
        for (int k : ks) {
            int[] c = chain(k);
            parts.add(c);
            total += c.length;
        }
        int[] out = new int[total];
        int pos = 0;
        for (int[] c : parts) {
            System.arraycopy(c, 0, out, pos, c.length);
            pos += c.length;
        }
        return out;
    }

    /** Parameter values at point p, one per axis. */
    public double[] values(int p) {
        int n1 = axes.get(0).count();
        double[] v = new double[axes.size()];
        v[0] = axes.get(0).value(p % n1);
        if (axes.size() == 2) {
            v[1] = axes.get(1).value(p / n1);
        }
        return v;
    }

    /** Parameter names, one per axis. */
    public List<String> names() {
        List<String> n = new ArrayList<>();
        for (Axis a : axes) {
            n.add(a.name());
        }
        return n;
    }
}
