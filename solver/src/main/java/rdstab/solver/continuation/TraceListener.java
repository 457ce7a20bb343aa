package rdstab.solver.continuation;

/** Progress of a trace (library code never prints; a command may). */
public interface TraceListener {

    /** A row was added to the branch (a step point or a located special point). */
    void row(BranchRow row);

    /** A step was rejected and will be retried shorter. */
    default void rejected(double step, String why) {
    }

    /** Listener that ignores everything. */
    TraceListener NONE = row -> { };
}
