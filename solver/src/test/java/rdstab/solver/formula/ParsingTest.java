package rdstab.solver.formula;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import java.util.Set;

import org.junit.jupiter.api.Test;

/**
 * Parsing, precedence and compilation. Expected values are evaluated by hand with the usual
 * conventions of mathematics and programming languages (common practice, no particular source):
 * ^ binds tighter than unary minus and groups right to left; * and / before + and -, both left to right.
 */
class ParsingTest {

    @Test
    void precedenceMatchesHandEvaluation() {
        assertEquals(7.0, Eval.of("1 + 2*3"));
        assertEquals(9.0, Eval.of("(1 + 2)*3"));
        assertEquals(512.0, Eval.of("2^3^2"));
        assertEquals(64.0, Eval.of("(2^3)^2"));
        assertEquals(-4.0, Eval.of("-2^2"));
        assertEquals(4.0, Eval.of("(-2)^2"));
        assertEquals(0.125, Eval.of("2^-3"));
        assertEquals(2.0, Eval.of("8/2/2"));
        assertEquals(-4.0, Eval.of("1-2-3"));
        assertEquals(6.0, Eval.of("1 - -2 - -3"));
        assertEquals(3.0, Eval.of("--3"));
        assertEquals(5.0, Eval.of("+5"));
        assertEquals(-8.0, Eval.of("-2*4"));
        assertEquals(10.0, Eval.of("2*-(-5)"));
        assertEquals(2.0 * 81, Eval.of("2*3^2^2/1"));
    }

    @Test
    void numberFormats() {
        assertEquals(1.5e-3, Eval.of("1.5e-3"));
        assertEquals(2e4, Eval.of("2E+4"));
        assertEquals(0.5, Eval.of(".5"));
        assertEquals(3.0, Eval.of("3."));
        assertEquals(12.0, Eval.of("12"));
        assertEquals(Math.PI, Eval.of("pi"));
        assertEquals(0.25, Eval.of("25e-2"));
    }

    @Test
    void caseFileExamplesEvaluate() {
        // delta*exp(T/(1+eps*T)) at delta = 0.8, eps = 0.1, T = 2: 0.8*exp(2/1.2)
        Formula f = Formula.parse("delta*exp(T/(1+eps*T))");
        assertEquals(Set.of("T", "delta", "eps"), f.names());
        assertEquals(List.of("T", "delta", "eps"), List.copyOf(f.names()));
        CompiledFormula c = f.compile(List.of("T"), Map.of("delta", 0.8, "eps", 0.1));
        assertEquals(0.8 * Math.exp(2 / 1.2), c.evaluate(new double[] {2}), 1e-15);
        // A - (B+1)*u + u^2*v at A=1, B=3, u=2, v=0.5: 1 - 8 + 2 = -5
        CompiledFormula b = Formula.parse("A - (B+1)*u + u^2*v").compile(List.of("u", "v"), Map.of("A", 1.0, "B", 3.0));
        assertEquals(-5.0, b.evaluate(new double[] {2, 0.5}));
        // 1 + 0.5*sin(pi*x) at x = 0.5: 1.5
        assertEquals(1.5, Eval.at("1 + 0.5*sin(pi*x)", Map.of("x", 0.5)), 1e-15);
        assertEquals(-2.0 * (3 - 1), Eval.at("-Bi*(u - ua)", Map.of("Bi", 2.0, "u", 3.0, "ua", 1.0)));
    }

    @Test
    void namesReferencesAndPi() {
        Formula f = Formula.parse("a_1 * x + pi*_b2 - x");
        assertEquals(Set.of("_b2", "a_1", "x"), f.names());
        assertTrue(f.references("x"));
        assertFalse(f.references("pi"));
        assertFalse(f.references("y"));
        assertEquals("a_1 * x + pi*_b2 - x", f.text());
        assertThrows(UnsupportedOperationException.class, () -> f.names().add("z"));
    }

    @Test
    void piCannotBeShadowed() {
        Formula f = Formula.parse("2*pi");
        assertTrue(f.isConstant());
        assertEquals(2 * Math.PI, f.constantValue());
        assertEquals(2 * Math.PI, f.compile(List.of("pi"), Map.of("pi", 3.0)).evaluate(new double[] {3.0}));
    }

    @Test
    void variablesReadFromTheirSlotsAndWinOverConstants() {
        CompiledFormula c = Formula.parse("x - 10*y").compile(List.of("y", "x"), Map.of("x", 100.0));
        assertEquals(3 - 10 * 2.0, c.evaluate(new double[] {2, 3}));
    }

    @Test
    void substituteFoldsToConstants() {
        Formula f = Formula.parse("a*x + b^2");
        Formula g = f.substitute(Map.of("a", 2.0, "b", 3.0, "x", 5.0));
        assertTrue(g.isConstant());
        assertEquals(19.0, g.constantValue());
        // folding only, no algebra: 0*x stays, so at x = infinity the value is NaN as written
        Formula zero = f.substitute(Map.of("a", 0.0, "b", 3.0));
        assertEquals(Set.of("x"), zero.names());
        assertTrue(Double.isNaN(Eval.at(zero, Map.of("x", Double.POSITIVE_INFINITY))));
        assertEquals(9.0, Eval.at(zero, Map.of("x", 1e300)));
        Formula h = f.substitute(Map.of("b", 2.0));
        assertEquals(Set.of("a", "x"), h.names());
        assertEquals(2 * 5 + 4.0, Eval.at(h, Map.of("a", 2.0, "x", 5.0)));
        assertThrows(IllegalStateException.class, h::constantValue);
    }

    @Test
    void integerPowersByMultiplicationAgreeWithMathPow() {
        double[] xs = {-3.7, -1, -0.0, 0, 0.3, 1.9, 1e5};
        for (String e : new String[] {"2", "3", "4", "-1", "-2", "0", "1", "2.5", "-3"}) {
            Formula f = Formula.parse("x^" + e);
            for (double x : xs) {
                double want = Math.pow(x, Double.parseDouble(e));
                double got = Eval.at(f, Map.of("x", x));
                double tol = Double.isFinite(want) ? Math.ulp(want) * 4 : 0;
                assertEquals(want, got, tol, "x=" + x + " ^" + e);
            }
        }
    }

    @Test
    void toStringReadsBackToTheSameShape() {
        String[] texts = {"a - (b - c)", "a/(b*c)", "(a^b)^c", "-(a+b)", "(-a)^2", "a - -b", "a*(b + c)",
            "pow(a, b)", "2^-a", "-a^b", "min(a, b) + max(a, -b)"};
        Map<String, Double> at = Map.of("a", 1.7, "b", -0.3, "c", 2.9);
        for (String t : texts) {
            Formula f = Formula.parse(t);
            Formula g = Formula.parse(f.toString());
            assertEquals(Eval.at(f, at), Eval.at(g, at), t + " printed as " + f);
            assertEquals(f.toString(), g.toString());
        }
    }
}
