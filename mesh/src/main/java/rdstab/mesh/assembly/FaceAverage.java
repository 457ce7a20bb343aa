package rdstab.mesh.assembly;

/**
 * How the diffusivity on the face between nodes i and i+1 is formed from the nodal values.
 * <ul>
 *   <li>{@link #ARITHMETIC}: k_{i+1/2} = (k_i + k_{i+1})/2 (default; second order for smooth k).</li>
 *   <li>{@link #HARMONIC}: k_{i+1/2} = 2 k_i k_{i+1}/(k_i + k_{i+1}) (the series-resistance value,
 *   better when k jumps between materials).</li>
 * </ul>
 */
public enum FaceAverage {
    ARITHMETIC,
    HARMONIC;

    /** The face value from the two nodal values. */
    double value(double kl, double kr) {
        return this == ARITHMETIC ? 0.5 * (kl + kr) : 2 * kl * kr / (kl + kr);
    }

    /** ∂(face value)/∂kl. */
    double dLeft(double kl, double kr) {
        if (this == ARITHMETIC) {
            return 0.5;
        }
        double s = kl + kr;
        return 2 * kr * kr / (s * s);
    }

    /** ∂(face value)/∂kr. */
    double dRight(double kl, double kr) {
        return dLeft(kr, kl);
    }
}
