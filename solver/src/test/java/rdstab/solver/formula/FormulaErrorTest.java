package rdstab.solver.formula;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.util.List;
import java.util.Map;
import java.util.concurrent.atomic.AtomicReference;

import org.junit.jupiter.api.Test;

import rdstab.solver.formula.FormulaException.Kind;

/**
 * Error kinds and positions (source: the project's formula specification; positions counted by
 * hand as 0-based character offsets). Deep inputs are parsed on a thread with a small stack so a
 * recursion that is not depth-limited would fail here even though surefire runs with -Xss8m.
 */
class FormulaErrorTest {

    private static FormulaException fails(String text) {
        return assertThrows(FormulaException.class, () -> Formula.parse(text), text);
    }

    private static void assertError(String text, Kind kind, int position) {
        FormulaException e = fails(text);
        assertEquals(kind, e.kind(), e.getMessage());
        assertEquals(position, e.position(), e.getMessage());
        assertTrue(e.getMessage().contains(e.problem()));
    }

    /** Runs parse on a thread with a 512 KiB stack; returns what it threw. */
    private static Throwable parseOnSmallStack(String text) throws InterruptedException {
        AtomicReference<Throwable> thrown = new AtomicReference<>();
        Thread t = new Thread(null, () -> {
            try {
                Formula.parse(text);
            } catch (Throwable e) {
                thrown.set(e);
            }
        }, "small-stack-parse", 512 * 1024);
        t.start();
        t.join();
        return thrown.get();
    }

    private static void assertTooDeepOnSmallStack(String text) throws InterruptedException {
        Throwable e = parseOnSmallStack(text);
        assertNotNull(e, "expected TOO_DEEP");
        assertEquals(FormulaException.class, e.getClass(), String.valueOf(e));
        assertEquals(Kind.TOO_DEEP, ((FormulaException) e).kind());
    }

    @Test
    void syntaxErrorsAtTheirPosition() {
        assertError("2*(x+1", Kind.SYNTAX, 6);
        assertError("x $ y", Kind.SYNTAX, 2);
        assertError("1 2", Kind.SYNTAX, 2);
        assertError("x)", Kind.SYNTAX, 1);
        assertError("", Kind.SYNTAX, 0);
        assertError("   \t", Kind.SYNTAX, 0);
        assertError("x + ", Kind.SYNTAX, 4);
        assertError("x * * y", Kind.SYNTAX, 4);
        assertError("()", Kind.SYNTAX, 1);
        assertError("1.5e", Kind.SYNTAX, 3);
        assertError("2e+x", Kind.SYNTAX, 1);
        assertError("exp + 1", Kind.SYNTAX, 0);
        assertError("min(1, 2", Kind.SYNTAX, 8);
        assertError("1e999", Kind.SYNTAX, 0);
        assertError("3x", Kind.SYNTAX, 1);
    }

    @Test
    void functionErrors() {
        assertError("foo(1)", Kind.UNKNOWN_FUNCTION, 0);
        assertError("2 + pi(1)", Kind.UNKNOWN_FUNCTION, 4);
        assertError("max(1)", Kind.WRONG_ARGUMENT_COUNT, 0);
        assertError("x*exp(1, 2)", Kind.WRONG_ARGUMENT_COUNT, 2);
        assertError("sin()", Kind.WRONG_ARGUMENT_COUNT, 0);
        assertTrue(fails("foo(1)").problem().contains("foo"));
        assertTrue(fails("max(1)").problem().contains("2 arguments"));
    }

    @Test
    void unknownNameAtCompileNamesItAndTheKnownNames() {
        Formula f = Formula.parse("a*x + b*q - q");
        FormulaException e = assertThrows(FormulaException.class,
                () -> f.compile(List.of("x"), Map.of("a", 1.0, "b", 2.0)));
        assertEquals(Kind.UNKNOWN_NAME, e.kind());
        assertEquals(8, e.position());
        assertTrue(e.problem().contains("'q'"), e.problem());
        assertTrue(e.problem().contains("a, b, pi, x"), e.problem());
    }

    @Test
    void nonAsciiCharactersAreSyntaxErrorsNamingThem() {
        assertError("é", Kind.SYNTAX, 0);
        assertError("caf\u00e9 + 1", Kind.SYNTAX, 3);
        assertError("x + \u03b1", Kind.SYNTAX, 4);
        assertError("x*\uD83D\uDE00", Kind.SYNTAX, 2);
        assertTrue(fails("x + \u03b1").problem().contains("\u03b1"));
        assertTrue(fails("x*\uD83D\uDE00").problem().contains("U+1F600"));
        assertTrue(fails("1\u00a0+ 1").problem().contains("U+00A0"));
    }

    @Test
    void tooLongIsRejectedFast() {
        String huge = "x+".repeat(500_000);
        FormulaException e = assertTimeoutPreemptively(Duration.ofMillis(500),
                () -> assertThrows(FormulaException.class, () -> Formula.parse(huge)));
        assertEquals(Kind.TOO_LONG, e.kind());
        assertEquals(Kind.TOO_LONG, fails("1" + "0".repeat(Formula.MAX_LENGTH)).kind());
        assertEquals(1.0 / 9, Formula.parse("0." + "1".repeat(Formula.MAX_LENGTH - 2)).constantValue(), 1e-16);
        assertTrue(fails("1".repeat(400)).problem().length() < 200, "long literals are shortened in messages");
    }

    @Test
    void longChainsAreTooLongOrTooDeepButNeverOverflowTheStack() throws InterruptedException {
        Throwable e = parseOnSmallStack("x" + "+x".repeat(99_999));
        assertEquals(Kind.TOO_LONG, ((FormulaException) e).kind());
        assertTooDeepOnSmallStack("x" + "+x".repeat(4_000));
        assertTooDeepOnSmallStack("x" + "*x".repeat(4_000));
        assertTooDeepOnSmallStack("x" + "^x".repeat(4_000));
        assertTooDeepOnSmallStack("x" + "+x".repeat(Formula.MAX_DEPTH));
        Formula ok = Formula.parse("x" + "+x".repeat(Formula.MAX_DEPTH - 1));
        assertEquals(Formula.MAX_DEPTH * 2.0, Eval.at(ok, Map.of("x", 2.0)));
        assertEquals(Formula.MAX_DEPTH * 1.0, Eval.at(ok.derivative("x"), Map.of("x", 2.0)));
    }

    @Test
    void deepNestingIsTooDeep() throws InterruptedException {
        // 10,000 balanced parentheses need 20,001 characters, over MAX_LENGTH: use the most that fit
        assertTooDeepOnSmallStack("(".repeat(4_999) + "x" + ")".repeat(4_999));
        assertTooDeepOnSmallStack("(".repeat(9_999) + "x");
        assertTooDeepOnSmallStack("-(".repeat(3_333) + "x" + ")".repeat(3_333));
        assertTooDeepOnSmallStack("-".repeat(9_999) + "x");
        assertTooDeepOnSmallStack("exp(".repeat(1_999) + "x" + ")".repeat(1_999));
        assertEquals(Kind.TOO_LONG, fails("(".repeat(10_000) + "x" + ")".repeat(10_000)).kind());
        assertTooDeepOnSmallStack("(".repeat(Formula.MAX_DEPTH + 1) + "x" + ")".repeat(Formula.MAX_DEPTH + 1));
        Formula ok = Formula.parse("(".repeat(Formula.MAX_DEPTH) + "x" + ")".repeat(Formula.MAX_DEPTH));
        assertEquals(3.0, Eval.at(ok, Map.of("x", 3.0)));
    }
}
