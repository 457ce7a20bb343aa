package rdstab.solver.formula;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;

import org.junit.jupiter.api.Test;

/**
 * Derivatives of known formulas against their hand-derived analytic derivatives (source: the
 * elementary rules of calculus: chain, product, quotient and power rules), evaluated at random points.
 */
class DerivativeAnalyticTest {

    private static void assertSameFunction(String formula, String name, String analytic, List<String> vars) {
        Formula d = Formula.parse(formula).derivative(name);
        Formula want = Formula.parse(analytic);
        CompiledFormula dc = d.compile(vars, Map.of());
        CompiledFormula wc = want.compile(vars, Map.of());
        Random rnd = new Random(formula.hashCode());
        for (int i = 0; i < 100; i++) {
            double[] v = new double[vars.size()];
            for (int k = 0; k < v.length; k++) {
                v[k] = 0.1 + 2 * rnd.nextDouble();
            }
            double w = wc.evaluate(v);
            assertEquals(w, dc.evaluate(v), 1e-12 * Math.max(1, Math.abs(w)), "d/d" + name + " " + formula + " = " + d);
        }
    }

    @Test
    void arrheniusTermDerivatives() {
        // d/du [delta*exp(u)] = delta*exp(u)
        assertSameFunction("delta*exp(u)", "u", "delta*exp(u)", List.of("delta", "u"));
        // d/dT [delta*exp(T/(1+eps*T))] = delta*exp(T/(1+eps*T)) / (1+eps*T)^2
        assertSameFunction("delta*exp(T/(1+eps*T))", "T", "delta*exp(T/(1+eps*T))/(1+eps*T)^2",
                List.of("T", "delta", "eps"));
        // d/deps [delta*exp(T/(1+eps*T))] = -delta*T^2*exp(T/(1+eps*T))/(1+eps*T)^2
        assertSameFunction("delta*exp(T/(1+eps*T))", "eps", "-delta*T^2*exp(T/(1+eps*T))/(1+eps*T)^2",
                List.of("T", "delta", "eps"));
    }

    @Test
    void brusselatorTermDerivatives() {
        // f = A - (B+1)u + u^2 v: df/du = -(B+1) + 2uv, df/dv = u^2
        assertSameFunction("A - (B+1)*u + u^2*v", "u", "-(B+1) + 2*u*v", List.of("A", "B", "u", "v"));
        assertSameFunction("A - (B+1)*u + u^2*v", "v", "u^2", List.of("A", "B", "u", "v"));
        assertSameFunction("1 + 0.5*sin(pi*x)", "x", "0.5*pi*cos(pi*x)", List.of("x"));
        assertSameFunction("x^y", "y", "x^y*log(x)", List.of("x", "y"));
        assertSameFunction("sqrt(x)*tan(x)", "x", "tan(x)/(2*sqrt(x)) + sqrt(x)*(1 + tan(x)^2)", List.of("x"));
        assertSameFunction("tanh(x)", "x", "1 - tanh(x)^2", List.of("x"));
    }

    @Test
    void simplifiedResultsAreCompact() {
        Formula robin = Formula.parse("-Bi*(u - ua)").derivative("u");
        assertEquals(Set.of("Bi"), robin.names());
        assertEquals(-2.5, robin.compile(List.of(), Map.of("Bi", 2.5)).evaluate(new double[0]));
        assertEquals("delta*exp(u)", Formula.parse("delta*exp(u)").derivative("u").toString());
        Formula one = Formula.parse("x*1 + 0*y + 3").derivative("x");
        assertTrue(one.isConstant());
        assertEquals(1.0, one.constantValue());
        assertEquals(0.0, Formula.parse("x^2 + y").derivative("q").constantValue());
        assertFalse(Formula.parse("x^2").derivative("x").toString().contains("0"));
    }

    @Test
    void constantPowersAreFineAtZeroAndNegativeBase() {
        // d/du u^2 = 2u: 0 at u = 0, -6 at u = -3 (no log of a negative number)
        Formula d = Formula.parse("u^2").derivative("u");
        assertEquals(0.0, Eval.at(d, Map.of("u", 0.0)));
        assertEquals(-6.0, Eval.at(d, Map.of("u", -3.0)));
        assertEquals(12.0, Eval.at(Formula.parse("x^3").derivative("x"), Map.of("x", -2.0)));
        // a parameter exponent counts as constant: d/dx x^n = n x^(n-1) = 3 * 4 at x = -2, n = 3
        assertEquals(12.0, Eval.at(Formula.parse("x^n").derivative("x"), Map.of("x", -2.0, "n", 3.0)));
    }

    @Test
    void kinksTakeTheDocumentedSide() {
        // abs: sign(0) = 0; min/max: the first argument wins a tie
        assertEquals(0.0, Eval.at(Formula.parse("abs(x)").derivative("x"), Map.of("x", 0.0)));
        assertEquals(-1.0, Eval.at(Formula.parse("abs(x)").derivative("x"), Map.of("x", -0.5)));
        Map<String, Double> tie = Map.of("x", 1.0, "y", 1.0);
        assertEquals(1.0, Eval.at(Formula.parse("min(x, y)").derivative("x"), tie));
        assertEquals(0.0, Eval.at(Formula.parse("min(x, y)").derivative("y"), tie));
        assertEquals(1.0, Eval.at(Formula.parse("max(x, y)").derivative("x"), tie));
        assertEquals(0.0, Eval.at(Formula.parse("max(x, y)").derivative("y"), tie));
        assertEquals(2.0, Eval.at(Formula.parse("max(2*x, y + 1)").derivative("x"), Map.of("x", 1.0, "y", 1.0)));
    }
}
