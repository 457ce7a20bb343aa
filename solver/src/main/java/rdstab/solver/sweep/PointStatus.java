package rdstab.solver.sweep;

/** What happened at one sweep point. A failed point is a row of the output, never the end of the sweep. */
public enum PointStatus {
    /** Base state, eigenvalues and energy rates found. */
    OK("ok"),
    /** Newton's method found no steady state (for example beyond a fold). */
    NO_STEADY_STATE("no steady state"),
    /** A steady state was found but the eigen-solver did not deliver a trustworthy rightmost eigenpair. */
    NOT_CONVERGED("not converged"),
    /** The case is not valid at these parameter values (e.g. a negative length or diffusivity). */
    BAD_POINT("bad point");

    private final String word;

    PointStatus(String word) {
        this.word = word;
    }

    /** The word written in the output files. */
    public String word() {
        return word;
    }

    /** The status with this word. */
    public static PointStatus of(String word) {
        for (PointStatus s : values()) {
            if (s.word.equals(word)) {
                return s;
            }
        }
        throw new IllegalArgumentException("unknown point status '" + word + "'");
    }
}
