package rdstab.solver.assess;

import java.util.List;

/**
 * What the numbers mean for the engineer.
 *
 * @param verdict         stable / unstable / marginal
 * @param growthRate      max Re λ (1/time in the case's units)
 * @param band            the error band used to decide "marginal" (max of the case's marginal band and the
 *                        eigenvalue's own error estimate)
 * @param eFoldingTime    1/|growth rate| (time for a disturbance to grow or decay by e), +∞ when zero
 * @param frequency       Im λ of the leading mode (0 for a real mode)
 * @param peakField       field in which the leading mode is largest
 * @param peakX           coordinates of the node where the leading mode is largest
 * @param energyVerdict   the energy method's sentence
 * @param warnings        findings that qualify the verdict
 * @param cautions        safety cautions
 */
public record Assessment(Verdict verdict, double growthRate, double band, double eFoldingTime, double frequency,
                         String peakField, double[] peakX, String energyVerdict, List<String> warnings,
                         List<String> cautions) {

    /**
     * The same assessment re-judged with a grid-error band added to its own: band' = band + gridBand (the two
     * errors add in the worst case), and the verdict re-decided on band' (unstable when growth &gt; band', stable when
     * growth &lt; −band', else marginal). The growth rate itself is not changed. A marginal result gains a warning
     * that says why.
     *
     * @param gridBand the grid error of the growth rate (for example a GCI), ≥ 0
     * @param source   how the grid band was obtained, for the warning (e.g. "GCI of 3 grids")
     */
    public Assessment withGridBand(double gridBand, String source) {
        if (!(gridBand >= 0)) {
            throw new IllegalArgumentException("grid band must be >= 0, got " + gridBand);
        }
        double b = band + gridBand;
        Verdict v = growthRate > b ? Verdict.UNSTABLE : growthRate < -b ? Verdict.STABLE : Verdict.MARGINAL;
        List<String> w = new java.util.ArrayList<>(warnings);
        if (v == Verdict.MARGINAL && verdict != Verdict.MARGINAL) {
            w.add(String.format(java.util.Locale.ROOT, "the growth rate %.6g lies within its grid error band ±%.2e (%s): "
                    + "the grid cannot decide the verdict; refine the grid", growthRate, b, source));
        }
        return new Assessment(v, growthRate, b, eFoldingTime, frequency, peakField, peakX, energyVerdict, List.copyOf(w),
                cautions);
    }
}
