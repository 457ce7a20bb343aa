package rdstab.solver.energy;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * First roots ζ₁ against the table in REFERENCE-CHECKS.md (the one-term-approximation roots of
 * Incropera et al., Fundamentals of Heat and Mass Transfer, computed there to 8 digits): plane wall
 * ζ tan ζ = Bi, long cylinder ζ J₁(ζ)/J₀(ζ) = Bi, sphere 1 − ζ cot ζ = Bi; fixed ends: π, π/2 and
 * j₀₁ = 2.4048256 (Abramowitz &amp; Stegun table 9.5).
 */
class PoincareConstantTest {

    static final double[] BI = {0.1, 1, 10};
    static final double[] WALL = {0.31105285, 0.86033359, 1.42887001};
    static final double[] CYLINDER = {0.44168178, 1.25578371, 2.17949660};
    static final double[] SPHERE = {0.54228089, 1.57079633, 2.83630039};

    @Test
    void rootsMatchTheTable() {
        for (int i = 0; i < BI.length; i++) {
            // plane wall of half-thickness L: insulated centre (Bi 0) and convective surface
            assertEquals(WALL[i], PoincareConstant.slabRoot(0.0, BI[i]), 1e-8, "wall Bi " + BI[i]);
            assertEquals(CYLINDER[i], PoincareConstant.cylinderRoot(BI[i]), 1e-8, "cylinder Bi " + BI[i]);
            assertEquals(SPHERE[i], PoincareConstant.sphereRoot(BI[i]), 1e-8, "sphere Bi " + BI[i]);
        }
    }

    @Test
    void fixedAndInsulatedLimits() {
        double inf = Double.POSITIVE_INFINITY;
        assertEquals(Math.PI, PoincareConstant.slabRoot(inf, inf), 1e-14);
        assertEquals(Math.PI / 2, PoincareConstant.slabRoot(0, inf), 1e-14);
        assertEquals(Math.PI / 2, PoincareConstant.slabRoot(inf, 0), 1e-14);
        assertEquals(0.0, PoincareConstant.slabRoot(0, 0), 0.0);
        assertEquals(2.4048256, PoincareConstant.cylinderRoot(inf), 1e-7);
        assertEquals(Math.PI, PoincareConstant.sphereRoot(inf), 0.0);
        // two equal convective ends on a slab of thickness 2l: the symmetric wall of half-thickness l,
        // ζ_full = 2 ζ_wall(Bi_half) with Bi_full = 2 Bi_half (same physics, analytic)
        assertEquals(2 * WALL[1], PoincareConstant.slabRoot(2.0, 2.0), 1e-8);
    }
}
