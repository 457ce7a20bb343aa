package rdstab.solver.sweep;

import rdstab.solver.error.InputException;

/**
 * A share of a sweep for one of several processes: shard {@code index} of {@code count} takes the
 * chains whose number k satisfies k mod count = index (round robin, so every shard gets points from
 * the whole range and the hard points near a limit are spread over the shards).
 *
 * @param index 0 ≤ index &lt; count
 * @param count number of shards (≥ 1)
 */
public record Shard(int index, int count) {

    /** The whole sweep in one process. */
    public static final Shard ALL = new Shard(0, 1);

    public Shard {
        if (count < 1 || index < 0 || index >= count) {
            throw new InputException("command line", "--shard", "expected I/N with 0 <= I < N, found " + index + "/" + count);
        }
    }

    /**
     * Parses {@code I/N}.
     *
     * @throws InputException one plain line for anything else (e.g. 4/4, -1/2, a/b)
     */
    public static Shard parse(String text) {
        String[] p = text.trim().split("/", -1);
        if (p.length != 2) {
            throw new InputException("command line", "--shard " + text, "expected I/N with 0 <= I < N, e.g. 0/4");
        }
        try {
            return new Shard(Integer.parseInt(p[0].trim()), Integer.parseInt(p[1].trim()));
        } catch (NumberFormatException e) {
            throw new InputException("command line", "--shard " + text, "expected I/N with whole numbers 0 <= I < N, e.g. 0/4");
        }
    }

    /** True when chain k belongs to this shard. */
    public boolean owns(int chain) {
        return chain % count == index;
    }

    /** "I/N". */
    public String text() {
        return index + "/" + count;
    }
}
