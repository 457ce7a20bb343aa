package rdstab.solver.model;

import java.util.Map;

/**
 * A boundary condition of one field on one boundary part, as written in the case file.
 *
 * @param kind    which condition
 * @param numbers the condition's numbers by key ("value", "h", "ambient", "flux")
 * @param place   where it was written
 */
public record BoundarySpec(Kind kind, Map<String, Quantity> numbers, String place) {

    /** The condition kinds, with their case-file words and the numbers each takes. */
    public enum Kind {
        /** u = value. */
        FIXED("fixed", "value"),
        /** −k ∂u/∂n = flux (outward). */
        FLUX("flux", "flux"),
        /** Zero flux: insulated wall or symmetry plane. */
        INSULATED("insulated"),
        /** −k ∂u/∂n = h (u − ambient). */
        CONVECTIVE("convective", "h", "ambient"),
        /** Danckwerts inlet of a flow reactor: the entering total flux equals drift × value. */
        INLET("inlet", "value"),
        /** Outlet of a flow reactor: zero diffusive flux, ∂u/∂n = 0 (the drift carries the field out). */
        OUTLET("outlet");

        private final String word;
        private final String[] keys;

        Kind(String word, String... keys) {
            this.word = word;
            this.keys = keys;
        }

        /** Case-file word. */
        public String word() {
            return word;
        }

        /** Required number keys. */
        public String[] keys() {
            return keys.clone();
        }

        /** Kind named by its case-file word, or null. */
        public static Kind byWord(String w) {
            for (Kind k : values()) {
                if (k.word.equals(w)) {
                    return k;
                }
            }
            return null;
        }
    }
}
