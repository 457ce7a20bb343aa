package rdstab.solver.continuation;

/** What happens at a special point of a branch, in plain words. */
public enum SpecialPointKind {
    /** Turning point: dp/ds changes sign; a real eigenvalue passes through zero there. */
    FOLD("fold"),
    /** A real eigenvalue passes through zero without a turn of the branch (a branch point). */
    STATIONARY_CROSSING("stationary crossing"),
    /** A complex pair crosses the imaginary axis: oscillations set in (or die out) with frequency |Im λ|. */
    HOPF("Hopf");

    private final String word;

    SpecialPointKind(String word) {
        this.word = word;
    }

    /** The label used in reports and files. */
    public String word() {
        return word;
    }
}
