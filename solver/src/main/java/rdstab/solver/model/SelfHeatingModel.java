package rdstab.solver.model;

import java.util.Map;
import javax.measure.Unit;

/**
 * A self-heating body given in physical units: density ρ, heat capacity c, conductivity k, size L
 * (half-thickness of a slab, radius of a cylinder or sphere), Arrhenius kinetics (activation energy E,
 * pre-exponential factor A, heat of reaction Q per unit mass), surface heat-transfer coefficient h
 * (absent: fixed surface temperature) and ambient temperature T_a. All values are held as parameters
 * (in SI) of the case; this record names them and converts the dimensionless answers back.
 *
 * <p>Scalings (the Frank-Kamenetskii form): θ = (T − T_a)·E/(R T_a²), x scaled by L, time by the
 * conduction time t_c = ρ c L²/k. Groups: δ = (E/(R T_a²))·ρ Q A exp(−E/(R T_a))·L²/k,
 * ε = R T_a/E, Bi = h L/k. Source: exp(θ) ("exponential", the large-activation-energy limit) or
 * exp(θ/(1 + εθ)) ("arrhenius").
 *
 * @param arrhenius      true for the exp(θ/(1+εθ)) form
 * @param convective     true when a surface heat-transfer coefficient is given
 * @param temperatureUnit the unit the user gave the ambient temperature in (for answers)
 */
public record SelfHeatingModel(boolean arrhenius, boolean convective, Unit<?> temperatureUnit) {

    /** Universal gas constant, J/(mol·K) (CODATA 2018, exact). */
    public static final double GAS_CONSTANT = 8.314462618;

    /** Parameter names of the physical inputs, in the order they are listed. */
    public static final String[] INPUTS = {"rho", "cp", "k", "L", "E", "A", "Q", "h", "Ta"};

    /** Formula of δ in those parameter names. */
    public static String deltaFormula() {
        return "E/(" + GAS_CONSTANT + "*Ta^2)*rho*Q*A*exp(-E/(" + GAS_CONSTANT + "*Ta))*L^2/k";
    }

    /** Formula of ε. */
    public static String epsFormula() {
        return GAS_CONSTANT + "*Ta/E";
    }

    /** Formula of Bi. */
    public static String biotFormula() {
        return "h*L/k";
    }

    /** Conduction time ρ c L²/k in seconds. */
    public double timeScale(Map<String, Double> p) {
        return p.get("rho") * p.get("cp") * p.get("L") * p.get("L") / p.get("k");
    }

    /** Temperature scale R T_a²/E in kelvin. */
    public double temperatureScale(Map<String, Double> p) {
        return GAS_CONSTANT * p.get("Ta") * p.get("Ta") / p.get("E");
    }

    /** Absolute temperature (K) of a dimensionless θ. */
    public double temperature(double theta, Map<String, Double> p) {
        return p.get("Ta") + theta * temperatureScale(p);
    }

    /** A growth rate of the scaled problem in 1/s. */
    public double growthPerSecond(double scaledRate, Map<String, Double> p) {
        return scaledRate / timeScale(p);
    }
}
