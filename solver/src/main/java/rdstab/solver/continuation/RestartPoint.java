package rdstab.solver.continuation;

/**
 * Where to resume a trace: a row of an earlier trace of the same case and parameter.
 *
 * @param row        the row number (the restarted trace numbers its rows on from it)
 * @param step       accepted steps up to that row
 * @param arclength  arclength at that row
 * @param point      state and unit tangent at that row
 * @param nextStep   the arclength step to try first
 * @param label      the row's special-point label ("" for a step point): a restart from a special point does not
 *                   report that same point again in its first step
 */
public record RestartPoint(int row, int step, double arclength, BranchPoint point, double nextStep, String label) {
}
