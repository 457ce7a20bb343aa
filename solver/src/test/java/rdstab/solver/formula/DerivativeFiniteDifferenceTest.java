package rdstab.solver.formula;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import java.util.Random;

import org.junit.jupiter.api.Test;

/**
 * Symbolic derivatives against a central finite difference (f(x+h) - f(x-h)) / (2h) at random
 * points (source: standard numerical analysis, e.g. any text on numerical differentiation).
 *
 * <p>Rationale for step and tolerance: with h = 1e-6 * max(1, |x|) the truncation error is about
 * h^2 |f'''| / 6 ~ 1e-13 and the rounding error about eps |f| / h ~ 1e-16 / 1e-6 = 1e-10 relative
 * to |f|, both far below the tolerance 1e-6 * max(1, |f'|, |f|). A wrong derivative rule (a missing
 * factor, a wrong sign) is off by O(1) relative and fails.
 */
class DerivativeFiniteDifferenceTest {

    /** A formula in x and y, a kink guard (|guard| must exceed 1e-3, or null) and whether x may be negative. */
    private record Case(String text, String guard, boolean signedX) { }

    private static final List<Case> CASES = List.of(
            new Case("x + y", null, true), new Case("x - y", null, true), new Case("y - x", null, true),
            new Case("x*y", null, true), new Case("x/y", null, true), new Case("y/x", null, false),
            new Case("-x", null, true), new Case("+x", null, true), new Case("x^2", null, true),
            new Case("x^3", null, true), new Case("x^4", null, true), new Case("x^-2", null, false),
            new Case("x^y", null, false), new Case("y^x", null, true), new Case("x^x", null, false),
            new Case("pow(x, y)", null, false), new Case("pow(x, 2.5)", null, false), new Case("2^x", null, true),
            new Case("exp(x)", null, true), new Case("log(x)", null, false), new Case("sqrt(x)", null, false),
            new Case("sin(x)", null, true), new Case("cos(x)", null, true), new Case("tan(x)", null, true),
            new Case("tanh(x)", null, true), new Case("abs(x)", "x", true), new Case("abs(x - y)", "x - y", true),
            new Case("min(x, y)", "x - y", true), new Case("max(x, y)", "x - y", true),
            new Case("min(x^2, y)", "x^2 - y", true), new Case("max(y, sin(3*x))", "y - sin(3*x)", true),
            new Case("sign(x)*x^2", "x", true), new Case("ifle(x, y, x^2, sin(x))", "x - y", true),
            new Case("pi*x", null, true),
            new Case("a*exp(x/(1 + b*x))", null, false),
            new Case("exp(sin(x)*y)/(1 + x^2)", null, true),
            new Case("log(1 + x^2)*sqrt(y + x^2)", null, true),
            new Case("tanh(cos(x*y))^3", null, true),
            new Case("max(abs(x - 1), sin(y*x))", "(abs(x - 1) - sin(y*x))*(x - 1)", true),
            new Case("pow(sqrt(x), tan(y/3))", null, false),
            new Case("-x^2*exp(-x/y) + a - (b + 1)*x + x^2*y", null, true),
            new Case("x^(y + x)/log(2 + x)", null, false),
            new Case("1/(1 + exp(-a*x))^2", null, true));

    private static final Map<String, Double> PARAMETERS = Map.of("a", 0.7, "b", 0.3);
    private static final List<String> VARS = List.of("x", "y");

    @Test
    void derivativeOfEveryFunctionAndOperatorMatchesCentralDifference() {
        Random rnd = new Random(20240611L);
        int checked = 0;
        for (Case c : CASES) {
            Formula f = Formula.parse(c.text());
            CompiledFormula fc = f.compile(VARS, PARAMETERS);
            CompiledFormula dx = f.derivative("x").compile(VARS, PARAMETERS);
            CompiledFormula dy = f.derivative("y").compile(VARS, PARAMETERS);
            CompiledFormula guard = c.guard() == null ? null : Formula.parse(c.guard()).compile(VARS, PARAMETERS);
            for (int i = 0; i < 40; i++) {
                double x = c.signedX() ? -1.3 + 2.6 * rnd.nextDouble() : 0.3 + rnd.nextDouble();
                double y = 0.4 + 1.2 * rnd.nextDouble();
                if (guard != null && Math.abs(guard.evaluate(new double[] {x, y})) < 1e-3) {
                    continue;
                }
                check(c.text() + " d/dx", fc, dx, new double[] {x, y}, 0);
                check(c.text() + " d/dy", fc, dy, new double[] {x, y}, 1);
                checked++;
            }
        }
        assertTrue(checked > CASES.size() * 30, "too many points skipped: " + checked);
    }

    private static void check(String what, CompiledFormula f, CompiledFormula d, double[] at, int k) {
        double h = 1e-6 * Math.max(1, Math.abs(at[k]));
        double[] plus = at.clone();
        double[] minus = at.clone();
        plus[k] += h;
        minus[k] -= h;
        double fd = (f.evaluate(plus) - f.evaluate(minus)) / (plus[k] - minus[k]);
        double exact = d.evaluate(at);
        double scale = Math.max(1, Math.max(Math.abs(exact), Math.abs(f.evaluate(at))));
        assertEquals(fd, exact, 1e-6 * scale, what + " at x=" + at[0] + ", y=" + at[1]);
    }

    @Test
    void secondDerivativeMatchesDifferenceOfFirst() {
        Formula f = Formula.parse("a*exp(x/(1 + b*x))*y^2 - sin(x*y)");
        Random rnd = new Random(7);
        CompiledFormula d1 = f.derivative("x").compile(VARS, PARAMETERS);
        CompiledFormula d2 = f.derivative("x").derivative("x").compile(VARS, PARAMETERS);
        for (int i = 0; i < 50; i++) {
            check("second derivative", d1, d2, new double[] {0.2 + rnd.nextDouble(), 0.5 + rnd.nextDouble()}, 0);
        }
    }
}
