package rdstab.solver.verify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The GCI formulas (Roache 1994; ASME V&amp;V 20; REFERENCE-CHECKS.md) on sequences whose limit and order are known by
 * construction: f(h) = f0 + C h^p exactly (common practice, no source: an exact power law must give back p, f0, and
 * a GCI that covers the true error of the fine value).
 */
class RichardsonEstimateTest {

    @Test
    void exactPowerLawsGiveBackOrderAndLimitForEqualAndUnequalRatios() {
        Random rnd = new Random(20240611L);
        for (int trial = 0; trial < 200; trial++) {
            double f0 = rnd.nextGaussian();
            double c = rnd.nextGaussian();
            double p = 1.0 + 2.0 * rnd.nextDouble();
            double h1 = 0.01 + 0.05 * rnd.nextDouble();
            double r21 = 1.3 + rnd.nextDouble();
            double r32 = trial % 2 == 0 ? r21 : 1.3 + rnd.nextDouble();
            double h2 = h1 * r21;
            double h3 = h2 * r32;
            RichardsonEstimate e = RichardsonEstimate.of(f0 + c * Math.pow(h1, p), f0 + c * Math.pow(h2, p),
                    f0 + c * Math.pow(h3, p), r21, r32, 2.0);
            assertEquals(RichardsonEstimate.Status.OBSERVED, e.status());
            assertEquals(p, e.observed(), 1e-8, "observed order, trial " + trial);
            assertEquals(f0, e.extrapolated(), 1e-9 * Math.max(1, Math.abs(c)), "extrapolated, trial " + trial);
            double trueErrorFine = Math.abs(c * Math.pow(h1, p));
            assertEquals(RichardsonEstimate.FS_THREE_GRIDS * trueErrorFine, e.gciFine(), 1e-9 * trueErrorFine + 1e-15);
            double trueErrorMedium = Math.abs(c * Math.pow(h2, p));
            assertEquals(RichardsonEstimate.FS_THREE_GRIDS * trueErrorMedium, e.gciMedium(), 1e-9 * trueErrorMedium + 1e-15);
        }
    }

    @Test
    void oscillatingValuesFallBackToTheFormalOrderWithTheLargerSafetyFactor() {
        RichardsonEstimate e = RichardsonEstimate.of(1.00, 1.01, 0.99, 2, 2, 2);
        assertEquals(RichardsonEstimate.Status.OSCILLATORY, e.status());
        assertEquals(2.0, e.order(), 0.0);
        assertEquals(RichardsonEstimate.FS_UNCONFIRMED * 0.01 / 3, e.gciFine(), 1e-15);
        assertTrue(e.note().contains("oscillate"), e.note());
    }

    @Test
    void orderOutsideTheBandFallsBackAndSaysSo() {
        // first order data f = h: p = 1 is inside [1, 4]; f = h^0.3: p = 0.3 is outside
        RichardsonEstimate inside = RichardsonEstimate.of(0.01, 0.02, 0.04, 2, 2, 2);
        assertEquals(RichardsonEstimate.Status.OBSERVED, inside.status());
        assertEquals(1.0, inside.observed(), 1e-12);
        RichardsonEstimate outside = RichardsonEstimate.of(Math.pow(0.01, 0.3), Math.pow(0.02, 0.3), Math.pow(0.04, 0.3), 2, 2, 2);
        assertEquals(RichardsonEstimate.Status.OUT_OF_BAND, outside.status());
        assertEquals(0.3, outside.observed(), 1e-12);
        assertEquals(2.0, outside.order(), 0.0);
        assertTrue(outside.note().contains("outside"), outside.note());
    }

    @Test
    void gridIndependentValuesAreReportedAsSuch() {
        RichardsonEstimate e = RichardsonEstimate.of(0.0, 0.0, 0.0, 2, 2, 2);
        assertEquals(RichardsonEstimate.Status.ROUND_OFF, e.status());
        assertEquals(0.0, e.extrapolated(), 0.0);
        assertTrue(e.gciFine() < 1e-300);
        assertThrows(IllegalArgumentException.class, () -> RichardsonEstimate.of(1, 2, 3, 1.0, 2, 2));
    }
}
