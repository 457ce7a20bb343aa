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
}
