package rdstab.solver.assess;

/** The stability verdict of a base state. */
public enum Verdict {
    /** Every eigenvalue has Re λ below −band: small disturbances die out. */
    STABLE("stable"),
    /** Some eigenvalue has Re λ above +band: a small disturbance grows. */
    UNSTABLE("unstable"),
    /** The rightmost Re λ lies within its error band of zero: the analysis cannot decide. */
    MARGINAL("marginal");

    private final String word;

    Verdict(String word) {
        this.word = word;
    }

    /** The word used in reports and JSON. */
    public String word() {
        return word;
    }
}
