package rdstab.solver.continuation;

/**
 * Settings of a branch trace. Immutable; validated on construction.
 *
 * <p>Step control (arclength in the scaled inner product of {@link ParameterFamily}): a step is rejected and
 * halved when the corrector fails, when the angle between the secant (new point − old point) and the old
 * tangent exceeds {@code maxAngle} (equivalently, the corrector moved the predictor by more than
 * Δs·tan(maxAngle)), or when the tangent turned by more than {@code maxAngle}. These guards keep the corrector
 * from jumping to another branch and resolve folds with several steps. An accepted step grows the next one by
 * 1.5 when the corrector took at most 3 iterations and the tangent turned by less than maxAngle/3; it shrinks
 * it by 0.7 when the corrector needed 6 or more. The step stays within [minStep, maxStep].
 *
 * @param name          the parameter traced
 * @param from          start value (the branch starts at the case's Newton solution there)
 * @param to            the other end of the range; the trace stops when p leaves [min(from,to), max(from,to)]
 * @param maxSteps      cap on accepted continuation steps
 * @param step          initial arclength step
 * @param minStep       smallest step before the trace stops
 * @param maxStep       largest step
 * @param maxAngle      largest secant and turning angle per step, radians
 * @param maxCorrectorIterations Newton iterations per corrector solve
 */
public record TraceOptions(String name, double from, double to, int maxSteps, double step, double minStep, double maxStep,
                           double maxAngle, int maxCorrectorIterations) {

    /** Default maximum angle: 0.3 rad (about 17 degrees). */
    public static final double DEFAULT_ANGLE = 0.3;

    /**
     * Defaults for a range: initial step |to − from| / 20, steps between 10⁻⁶ and 50 times that, 0.3 rad, 10 corrector
     * iterations.
     */
    public static TraceOptions of(String name, double from, double to, int maxSteps, double step) {
        double s = Double.isNaN(step) ? Math.abs(to - from) / 20 : step;
        return new TraceOptions(name, from, to, maxSteps, s, 1e-6 * s, 50 * s, DEFAULT_ANGLE, 10);
    }

    public TraceOptions {
        if (name == null || name.isBlank()) {
            throw new IllegalArgumentException("the traced parameter needs a name");
        }
        if (!Double.isFinite(from) || !Double.isFinite(to) || from == to) {
            throw new IllegalArgumentException("the range of '" + name + "' must be two different finite numbers FROM:TO, got "
                    + from + ":" + to);
        }
        if (maxSteps < 1) {
            throw new IllegalArgumentException("the step cap must be >= 1, got " + maxSteps);
        }
        if (!(step > 0) || !(minStep > 0) || !(maxStep >= step) || !(minStep <= step) || !Double.isFinite(maxStep)) {
            throw new IllegalArgumentException("steps must satisfy 0 < min <= step <= max, got " + minStep + ", " + step + ", "
                    + maxStep);
        }
        if (!(maxAngle > 0 && maxAngle < 1.5)) {
            throw new IllegalArgumentException("the angle guard must be in (0, 1.5) rad, got " + maxAngle);
        }
        if (maxCorrectorIterations < 2) {
            throw new IllegalArgumentException("the corrector needs at least 2 iterations, got " + maxCorrectorIterations);
        }
    }

    /** Lower end of the range. */
    public double low() {
        return Math.min(from, to);
    }

    /** Upper end of the range. */
    public double high() {
        return Math.max(from, to);
    }
}
