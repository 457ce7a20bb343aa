package rdstab.solver.energy;

import java.util.Locale;
import java.util.Map;
import rdstab.solver.formula.Formula;
import rdstab.solver.model.BoundarySpec;
import rdstab.solver.model.Case;
import rdstab.solver.model.FieldSpec;

/**
 * The Poincaré constant μ₁ = k ζ₁²/L² of the continuous problem −k Δφ = μ φ, from the first root ζ₁ of
 * the shape's characteristic equation, for comparison with the discrete μ₁ the energy analysis computes.
 *
 * <p>Available when every field has a constant diffusivity k and no drift, and each end is fixed
 * (Biot number ∞), insulated or given a flux (Biot 0 for the perturbation) or convective (Bi = hL/k):
 * <ul>
 *   <li>slab (a, b), L = b − a: eigenfunction sin(ζx/L + φ₀) with tan φ₀ = ζ/Bi₀, and the right end
 *   gives ζ + φ₀ + φ₁ = π, tan φ₁ = ζ/Bi₁; the left side is increasing in ζ, so the first root
 *   lies in [0, π] (π for two fixed ends, π/2 for fixed–insulated, 0 for two insulated ends; ζ tan ζ = Bi
 *   for insulated–convective).</li>
 *   <li>solid cylinder of radius L: ζ J₁(ζ)/J₀(ζ) = Bi (J₀(ζ) = 0, ζ = 2.4048256 when fixed).</li>
 *   <li>solid sphere of radius L: 1 − ζ cot ζ = Bi (ζ = π when fixed).</li>
 * </ul>
 * Several fields: the smallest k_f ζ_f²/L² (the energy bound uses the weakest field). Hollow cylinders
 * and spheres, variable diffusivity or drift: none ("computed" only).
 * Roots by bisection to 1e-15 relative; J₀, J₁ by their power series (ζ ≤ 2.41, 40 terms, error below 1e-16).
 */
public final class PoincareConstant {

    private PoincareConstant() {
    }

    /** μ₁ and how it was found; value NaN with source "computed" when the case allows no closed form. */
    public record Value(double mu, String source) {
    }

    /** The analytic μ₁ of a case at its current parameters. */
    public static Value of(Case c) {
        if (c.shape().dimension() != 1) {
            return none();
        }
        Map<String, Double> p = c.parameters();
        double a = c.fromValue();
        double b = c.toValue();
        if (c.shape().radial() && a != 0.0) {
            return none();
        }
        double length = b - a;
        double best = Double.POSITIVE_INFINITY;
        String how = "";
        for (FieldSpec f : c.fields()) {
            Formula k = f.diffusivity().substitute(p);
            if (f.drift() != null || !k.isConstant() || !(k.constantValue() > 0)) {
                return none();
            }
            double kv = k.constantValue();
            double zeta;
            double bOuter = biot(c.boundaries().get(c.shape().radial() ? "outer" : "right").get(f.name()), p, length, kv);
            if (Double.isNaN(bOuter)) {
                return none();
            }
            switch (c.shape()) {
                case SLAB -> {
                    double bLeft = biot(c.boundaries().get("left").get(f.name()), p, length, kv);
                    if (Double.isNaN(bLeft)) {
                        return none();
                    }
                    zeta = slabRoot(bLeft, bOuter);
                }
                case CYLINDER -> zeta = cylinderRoot(bOuter);
                default -> zeta = sphereRoot(bOuter);
            }
            double mu = kv * zeta * zeta / (length * length);
            if (mu < best) {
                best = mu;
                how = String.format(Locale.ROOT, "%s, field %s: k ζ₁²/L² with ζ₁ = %.8f", c.shape().word(), f.name(), zeta);
            }
        }
        return new Value(best, how);
    }

    private static Value none() {
        return new Value(Double.NaN, "computed");
    }

    /** Biot number of a condition (∞ fixed, 0 insulated/flux, hL/k convective); NaN for inlet/outlet. */
    private static double biot(BoundarySpec s, Map<String, Double> p, double length, double k) {
        return switch (s.kind()) {
            case FIXED -> Double.POSITIVE_INFINITY;
            case INSULATED, FLUX -> 0.0;
            case CONVECTIVE -> s.numbers().get("h").value(p) * length / k;
            default -> Double.NaN;
        };
    }

    /** First root of ζ + atan(ζ/Bi₀) + atan(ζ/Bi₁) = π on [0, π] (atan(ζ/∞) = 0, atan(ζ/0) = π/2). */
    public static double slabRoot(double bi0, double bi1) {
        if (bi0 == 0 && bi1 == 0) {
            return 0.0;
        }
        return bisect(z -> z + phase(z, bi0) + phase(z, bi1) - Math.PI, 0.0, Math.PI);
    }

    private static double phase(double z, double bi) {
        return Double.isInfinite(bi) ? 0.0 : Math.atan2(z, bi);
    }

    /** First root of ζ J₁(ζ) = Bi J₀(ζ) (J₀(ζ) = 0 for Bi = ∞), on (0, j₀₁]. */
    public static double cylinderRoot(double bi) {
        if (bi == 0) {
            return 0.0;
        }
        if (Double.isInfinite(bi)) {
            return bisect(PoincareConstant::besselJ0, 2.0, 3.0);
        }
        return bisect(z -> z * besselJ1(z) - bi * besselJ0(z), 0.0, 2.40482555769577);
    }

    /** First root of 1 − ζ cot ζ = Bi on (0, π] (π for Bi = ∞). */
    public static double sphereRoot(double bi) {
        if (bi == 0) {
            return 0.0;
        }
        if (Double.isInfinite(bi)) {
            return Math.PI;
        }
        return bisect(z -> z < 1e-8 ? -bi : 1 - z * Math.cos(z) / Math.sin(z) - bi, 0.0, Math.PI * (1 - 1e-16));
    }

    /** J₀ by its power series Σ (−1)^m (x/2)^{2m}/(m!)². */
    static double besselJ0(double x) {
        double q = -x * x / 4;
        double term = 1;
        double sum = 1;
        for (int m = 1; m < 40; m++) {
            term *= q / ((double) m * m);
            sum += term;
        }
        return sum;
    }

    /** J₁ by its power series Σ (−1)^m (x/2)^{2m+1}/(m!(m+1)!). */
    static double besselJ1(double x) {
        double q = -x * x / 4;
        double term = x / 2;
        double sum = term;
        for (int m = 1; m < 40; m++) {
            term *= q / ((double) m * (m + 1));
            sum += term;
        }
        return sum;
    }

    /** Bisection for an increasing-through-zero function with g(lo) &lt; 0 &lt; g(hi). */
    private static double bisect(java.util.function.DoubleUnaryOperator g, double lo, double hi) {
        double glo = g.applyAsDouble(lo);
        for (int it = 0; it < 200 && hi - lo > 1e-15 * Math.max(1, hi); it++) {
            double mid = 0.5 * (lo + hi);
            double gm = g.applyAsDouble(mid);
            if ((gm < 0) == (glo < 0)) {
                lo = mid;
                glo = gm;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }
}
