package rdstab.solver.formula;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Tuple;

/**
 * Properties over generated formulas (source: the round-trip requirement of the formula
 * specification, and IEEE 754 determinism: the same operations on the same doubles give the same
 * bits). Values are compared bit for bit, so NaN equals NaN and 0.0 differs from -0.0.
 */
class FormulaPropertiesTest {

    private static final List<String> XYZ = List.of("x", "y", "z");
    private static final double[][] POINTS = {{0.7, -1.3, 2.0}, {0, 1, -0.5}, {-2.5, 0.3, 1e-3}, {1e3, -0.0, 4}};

    @Provide
    Arbitrary<String> expressions() {
        return expression(4);
    }

    private static Arbitrary<String> expression(int depth) {
        Arbitrary<String> leaf = Arbitraries.oneOf(
                Arbitraries.of("x", "y", "z", "pi", "0", "1", "2", "3", "0.5", "1.5e-3", "2E+4", "1e300", "-1", "-0.0"),
                Arbitraries.doubles().between(-1e6, 1e6).map(v -> Double.toString(v)));
        if (depth == 0) {
            return leaf;
        }
        Arbitrary<String> sub = Arbitraries.lazy(() -> expression(depth - 1));
        return Arbitraries.frequencyOf(
                Tuple.of(3, leaf),
                Tuple.of(4, Combinators.combine(sub, Arbitraries.of(" + ", "-", "*", "/", "^"), sub)
                        .as((a, op, b) -> a + op + b)),
                Tuple.of(1, sub.map(a -> "-" + a)),
                Tuple.of(2, sub.map(a -> "(" + a + ")")),
                Tuple.of(2, Combinators.combine(
                        Arbitraries.of("exp", "log", "sqrt", "sin", "cos", "tan", "tanh", "abs", "sign"), sub)
                        .as((fn, a) -> fn + "(" + a + ")")),
                Tuple.of(1, Combinators.combine(Arbitraries.of("min", "max", "pow"), sub, sub)
                        .as((fn, a, b) -> fn + "(" + a + ", " + b + ")")),
                Tuple.of(1, Combinators.combine(sub, sub, sub, sub)
                        .as((a, b, p, q) -> "ifle(" + a + ", " + b + ", " + p + ", " + q + ")")));
    }

    private static void assertSameValues(Formula f, Formula g) {
        CompiledFormula fc = f.compile(XYZ, Map.of());
        CompiledFormula gc = g.compile(XYZ, Map.of());
        for (double[] p : POINTS) {
            assertEquals(fc.evaluate(p), gc.evaluate(p), () -> f + "  vs  " + g);
        }
    }

    @Property(tries = 2000)
    void printedFormulaReadsBackWithIdenticalValues(@ForAll("expressions") String text) {
        Formula f = Formula.parse(text);
        Formula back = Formula.parse(f.toString());
        assertSameValues(f, back);
        assertEquals(f.names(), back.names());
        Formula d = f.derivative("x");
        assertSameValues(d, Formula.parse(d.toString()));
    }

    @Property(tries = 2000)
    void substitutingEveryNameFoldsToTheCompiledValue(@ForAll("expressions") String text) {
        Formula f = Formula.parse(text);
        CompiledFormula c = f.compile(XYZ, Map.of());
        for (double[] p : POINTS) {
            Formula folded = f.substitute(Map.of("x", p[0], "y", p[1], "z", p[2]));
            assertTrue(folded.isConstant(), folded::toString);
            assertEquals(c.evaluate(p), folded.constantValue(), () -> text + " folded to " + folded);
        }
    }

    @Provide
    Arbitrary<String> characterSoup() {
        return Arbitraries.strings().withChars("0123456789.eE+-*/^(), \txyzpisnqrtlogmaxw_\u00e9").ofMaxLength(30);
    }

    @Provide
    Arbitrary<String> tokenSoup() {
        return Arbitraries.of("x", "y", "pi", "exp", "min", "max", "pow", "ifle", "sign", "foo", "(", ")", ",",
                "+", "-", "*", "/", "^", "1", "2.5", "1e-3", "e", "3E", " ", ".").list().ofMaxSize(25)
                .map(parts -> String.join("", parts));
    }

    @Property(tries = 2000)
    void randomCharactersGiveAFormulaOrAFormulaException(@ForAll("characterSoup") String text) {
        checkParseOutcome(text);
    }

    @Property(tries = 2000)
    void randomTokensGiveAFormulaOrAFormulaException(@ForAll("tokenSoup") String text) {
        checkParseOutcome(text);
    }

    /** Any exception other than FormulaException propagates and fails the property. */
    private static void checkParseOutcome(String text) {
        Formula f;
        try {
            f = Formula.parse(text);
        } catch (FormulaException e) {
            assertNotNull(e.kind());
            assertTrue(e.position() >= -1 && e.position() <= text.length(), e::getMessage);
            assertFalse(e.problem().isBlank());
            return;
        }
        assertEquals(f.names(), Formula.parse(f.toString()).names(), f::toString);
    }
}
