package rdstab.solver.setup;

import java.util.Locale;
import rdstab.solver.error.InputException;

/**
 * A rough, deliberately generous estimate of the memory one check needs, made before anything is
 * assembled, so that a mesh too fine for the JVM is refused with a clear message instead of an
 * out-of-memory failure half-way.
 *
 * <h2>Model</h2>
 * The sparse LU factors dominate. With a banded (reverse Cuthill–McKee) ordering every row of the
 * factors fills its envelope, about the width w of the widest level of a breadth-first sweep of
 * the node graph (the shorter side + 1 of a rectangle grid): entries ≈ 2 · n · w · f for L and U
 * together (n unknowns, f fields, w in nodes). A nested-dissection ordering would need about
 * 8 · n · log₂ n entries on a 2D mesh ({@link #nestedDissectionEntries}, the classical O(n log n)
 * fill of George's method with a generous constant) — the estimate used here is the banded one,
 * which is what the factorizations currently use. Bytes: 12 per factor entry (value and row
 * index), 12 per Jacobian entry for about 6 sparse copies (J, M, the transport Jacobian and their
 * symmetric parts), 8 per unknown for about 80 work vectors (Newton, Arnoldi basis, modes).
 */
public record MemoryEstimate(long unknowns, long width, long factorEntries, long bytes, long available) {

    /** Bytes per stored sparse entry (double value + int index). */
    static final long ENTRY_BYTES = 12;
    /** Work vectors of length n kept at once (Newton, Krylov basis, modes). */
    static final long VECTORS = 80;
    /** Sparse copies of the Jacobian alive at once. */
    static final long COPIES = 6;

    /**
     * @param unknowns         n
     * @param fields           f
     * @param widthNodes       widest breadth-first level of the node graph
     * @param jacobianEntries  nonzeros of J (estimated)
     */
    public static MemoryEstimate banded(long unknowns, int fields, long widthNodes, long jacobianEntries) {
        long factor = 2L * unknowns * Math.max(1, widthNodes) * fields;
        long bytes = ENTRY_BYTES * factor + ENTRY_BYTES * COPIES * jacobianEntries + 8L * VECTORS * unknowns;
        Runtime rt = Runtime.getRuntime();
        long available = rt.maxMemory() - (rt.totalMemory() - rt.freeMemory());
        return new MemoryEstimate(unknowns, widthNodes, factor, bytes, available);
    }

    /** Factor entries of a nested-dissection ordering on a 2D mesh: about 8 n log₂ n. */
    public static long nestedDissectionEntries(long n) {
        return (long) (8.0 * n * Math.max(1.0, Math.log(n) / Math.log(2)));
    }

    /** True when the estimate fits in 90 % of the memory the JVM may still take. */
    public boolean fits() {
        return bytes <= 0.9 * available;
    }

    /**
     * Throws an {@link InputException} (exit 2) when the estimate does not fit, naming the options to change.
     *
     * @param source     the case file
     * @param meshOption how the user makes the mesh coarser (e.g. "--cells N or mesh: cells")
     */
    public void require(String source, String meshOption) {
        if (fits()) {
            return;
        }
        throw new InputException(source, "mesh", String.format(Locale.ROOT, "%d unknowns need an estimated %.1f GB "
                + "(sparse factorization about %.2g entries), but Java may use %.1f GB more; make the mesh coarser (%s) or "
                + "give Java more memory (e.g. RDSTAB_JAVA_OPTS=-Xmx%dg; this machine's limit applies)", unknowns,
                bytes / 1e9, (double) factorEntries, available / 1e9, meshOption, Math.max(2, (long) Math.ceil(bytes / 0.9 / (1L << 30)))));
    }
}
