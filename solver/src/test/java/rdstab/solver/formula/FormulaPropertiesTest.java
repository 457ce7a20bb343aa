package rdstab.solver.formula;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Properties over generated formulas (source: the round-trip requirement of the formula
 * specification, and IEEE 754 determinism: the same operations on the same doubles give the same
 * bits). Values are compared bit for bit, so NaN equals NaN and 0.0 differs from -0.0.
 *
 * <p>Inputs come from a seeded {@link Random} (reproducible; a failure message carries the input),
 * 2,000 per property.
 */
class FormulaPropertiesTest {

    static final int TRIES = 2000;
    private static final List<String> XYZ = List.of("x", "y", "z");
    private static final double[][] POINTS = {{0.7, -1.3, 2.0}, {0, 1, -0.5}, {-2.5, 0.3, 1e-3}, {1e3, -0.0, 4}};
    private static final String[] LEAVES = {"x", "y", "z", "pi", "0", "1", "2", "3", "0.5", "1.5e-3", "2E+4", "1e300", "-1", "-0.0"};
    private static final String[] OPS = {" + ", "-", "*", "/", "^"};
    private static final String[] FN1 = {"exp", "log", "sqrt", "sin", "cos", "tan", "tanh", "abs", "sign"};
    private static final String[] FN2 = {"min", "max", "pow"};

    /** A random expression of bounded depth from the grammar. */
    static String expression(Random r, int depth) {
        int pick = depth == 0 ? 0 : r.nextInt(14);
        if (pick < 3) {
            return r.nextInt(4) == 0 ? Double.toString((r.nextDouble() * 2 - 1) * 1e6) : LEAVES[r.nextInt(LEAVES.length)];
        }
        if (pick < 7) {
            return expression(r, depth - 1) + OPS[r.nextInt(OPS.length)] + expression(r, depth - 1);
        }
        if (pick < 8) {
            return "-" + expression(r, depth - 1);
        }
        if (pick < 10) {
            return "(" + expression(r, depth - 1) + ")";
        }
        if (pick < 12) {
            return FN1[r.nextInt(FN1.length)] + "(" + expression(r, depth - 1) + ")";
        }
        if (pick < 13) {
            return FN2[r.nextInt(FN2.length)] + "(" + expression(r, depth - 1) + ", " + expression(r, depth - 1) + ")";
        }
        return "ifle(" + expression(r, depth - 1) + ", " + expression(r, depth - 1) + ", " + expression(r, depth - 1)
                + ", " + expression(r, depth - 1) + ")";
    }

    private static void assertSameValues(Formula f, Formula g) {
        CompiledFormula fc = f.compile(XYZ, Map.of());
        CompiledFormula gc = g.compile(XYZ, Map.of());
        for (double[] p : POINTS) {
            assertEquals(fc.evaluate(p), gc.evaluate(p), () -> f + "  vs  " + g);
        }
    }

    @Test
    void printedFormulaReadsBackWithIdenticalValues() {
        Random r = new Random(20261202L);
        for (int t = 0; t < TRIES; t++) {
            Formula f = Formula.parse(expression(r, 4));
            Formula back = Formula.parse(f.toString());
            assertSameValues(f, back);
            assertEquals(f.names(), back.names());
            Formula d = f.derivative("x");
            assertSameValues(d, Formula.parse(d.toString()));
        }
    }

    @Test
    void substitutingEveryNameFoldsToTheCompiledValue() {
        Random r = new Random(7L);
        for (int t = 0; t < TRIES; t++) {
            String text = expression(r, 4);
            Formula f = Formula.parse(text);
            CompiledFormula c = f.compile(XYZ, Map.of());
            for (double[] p : POINTS) {
                Formula folded = f.substitute(Map.of("x", p[0], "y", p[1], "z", p[2]));
                assertTrue(folded.isConstant(), folded::toString);
                assertEquals(c.evaluate(p), folded.constantValue(), () -> text + " folded to " + folded);
            }
        }
    }

    @Test
    void randomCharactersGiveAFormulaOrAFormulaException() {
        String alphabet = "0123456789.eE+-*/^(), \txyzpisnqrtlogmaxw_\u00e9";
        Random r = new Random(11L);
        for (int t = 0; t < TRIES; t++) {
            StringBuilder sb = new StringBuilder();
            int len = r.nextInt(31);
            for (int i = 0; i < len; i++) {
                sb.append(alphabet.charAt(r.nextInt(alphabet.length())));
            }
            checkParseOutcome(sb.toString());
        }
    }

    @Test
    void randomTokensGiveAFormulaOrAFormulaException() {
        String[] tokens = {"x", "y", "pi", "exp", "min", "max", "pow", "ifle", "sign", "foo", "(", ")", ",",
            "+", "-", "*", "/", "^", "1", "2.5", "1e-3", "e", "3E", " ", "."};
        Random r = new Random(13L);
        for (int t = 0; t < TRIES; t++) {
            StringBuilder sb = new StringBuilder();
            int len = r.nextInt(26);
            for (int i = 0; i < len; i++) {
                sb.append(tokens[r.nextInt(tokens.length)]);
            }
            checkParseOutcome(sb.toString());
        }
    }

    /** Any exception other than FormulaException propagates and fails the test. */
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
