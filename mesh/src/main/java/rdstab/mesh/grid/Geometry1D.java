package rdstab.mesh.grid;

/**
 * The three one-dimensional geometries with a radial metric r^j.
 *
 * <p>The divergence of a flux q in these coordinates is (1/r^j) d(r^j q)/dr with
 * j = 0 (slab, plane wall), j = 1 (infinitely long cylinder), j = 2 (sphere). Integrals over a
 * body are ∫ g r^j dr; the factors 2π (cylinder per unit length) and 4π (sphere) are dropped
 * everywhere, consistently, so that volumes and face areas keep their ratios.
 */
public enum Geometry1D {
    /** Plane wall: metric r⁰ = 1. */
    SLAB(0),
    /** Cylinder: metric r¹. */
    CYLINDER(1),
    /** Sphere: metric r². */
    SPHERE(2);

    private final int power;

    Geometry1D(int power) {
        this.power = power;
    }

    /** The exponent j of the metric r^j. */
    public int metricPower() {
        return power;
    }

    /** Face-area factor r^j at radius r (1 for the slab, also at r = 0). */
    public double metric(double r) {
        switch (power) {
            case 0: return 1.0;
            case 1: return r;
            default: return r * r;
        }
    }

    /**
     * Exact volume factor of the shell [rL, rR]: ∫_{rL}^{rR} r^j dr = (rR^{j+1} − rL^{j+1})/(j+1).
     * Written as a product of differences so that thin shells lose no digits.
     */
    public double volume(double rL, double rR) {
        double d = rR - rL;
        switch (power) {
            case 0: return d;
            case 1: return d * (rR + rL) / 2.0;
            default: return d * (rR * rR + rR * rL + rL * rL) / 3.0;
        }
    }
}
