package rdstab.mesh.grid;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/** Grid construction, validation and control volumes. */
class Grid1DTest {

    /** Σ w_i equals the exact body volume (b^{j+1} − a^{j+1})/(j+1) (calculus), on a non-uniform grid. */
    @ParameterizedTest
    @EnumSource(Geometry1D.class)
    void weightsSumToExactVolume(Geometry1D g) {
        Grid1D grid = Grid1D.tanh(g, 0.3, 1.7, 13, 1.2, Grid1D.Cluster.LEFT);
        double sum = 0;
        for (double w : grid.weights()) {
            sum += w;
        }
        int j = g.metricPower();
        double exact = (Math.pow(1.7, j + 1) - Math.pow(0.3, j + 1)) / (j + 1);
        assertEquals(exact, sum, 1e-14);
    }

    /** Face area factor is m^j at the cell midpoint, end factors a^j and b^j. */
    @Test
    void faceMetricIsMidpointPower() {
        Grid1D grid = Grid1D.of(Geometry1D.SPHERE, 0.0, 0.5, 2.0);
        assertEquals(0.25 * 0.25, grid.faceMetric(0), 0);
        assertEquals(1.25 * 1.25, grid.faceMetric(1), 0);
        assertEquals(0.0, grid.leftMetric(), 0);
        assertEquals(4.0, grid.rightMetric(), 0);
        assertEquals(Math.pow(0.25, 3) / 3, grid.weight(0), 1e-16);
        assertTrue(grid.hasCentre());
    }

    @Test
    void stretchedGridsHitEndsAndFollowTheirLaw() {
        Grid1D geo = Grid1D.geometric(Geometry1D.SLAB, 1, 3, 10, 1.3);
        assertEquals(1.0, geo.x(0), 0);
        assertEquals(3.0, geo.x(10), 0);
        for (int i = 1; i < 9; i++) {
            double ratio = (geo.x(i + 1) - geo.x(i)) / (geo.x(i) - geo.x(i - 1));
            assertEquals(1.3, ratio, 1e-12);
        }
        Grid1D right = Grid1D.tanh(Geometry1D.SLAB, 0, 1, 10, 2, Grid1D.Cluster.RIGHT);
        assertTrue(right.x(10) - right.x(9) < right.x(1) - right.x(0), "RIGHT clusters at b");
        Grid1D both = Grid1D.tanh(Geometry1D.SLAB, 0, 1, 10, 2, Grid1D.Cluster.BOTH);
        assertEquals(both.x(1) - both.x(0), both.x(10) - both.x(9), 1e-14);
        assertEquals(0.5, both.x(5), 1e-15);
    }

    @Test
    void validationMessagesGiveActualValues() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Grid1D.uniform(Geometry1D.SLAB, 0, 1, 1));
        assertEquals("cells must be >= 2, got 1", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Grid1D.of(Geometry1D.SLAB, 0, 0.5, 0.5, 1));
        assertTrue(e.getMessage().contains("strictly increasing") && e.getMessage().contains("x_2 = 0.5"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Grid1D.of(Geometry1D.SLAB, 0, Double.NaN, 1));
        assertTrue(e.getMessage().contains("finite"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Grid1D.uniform(Geometry1D.CYLINDER, -0.5, 1, 4));
        assertTrue(e.getMessage().contains("a >= 0") && e.getMessage().contains("-0.5"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Grid1D.geometric(Geometry1D.SLAB, 0, 1, 4, -1));
        assertThrows(IllegalArgumentException.class, () -> Grid1D.tanh(Geometry1D.SLAB, 0, 1, 4, 0, Grid1D.Cluster.BOTH));
        assertThrows(IllegalArgumentException.class, () -> Grid1D.uniform(Geometry1D.SLAB, 1, 1, 4));
    }

    @Test
    void centreOnlyForCurvedGeometriesAtZero() {
        assertTrue(Grid1D.uniform(Geometry1D.CYLINDER, 0, 1, 4).hasCentre());
        assertFalse(Grid1D.uniform(Geometry1D.CYLINDER, 0.1, 1, 4).hasCentre());
        assertFalse(Grid1D.uniform(Geometry1D.SLAB, 0, 1, 4).hasCentre());
    }
}
