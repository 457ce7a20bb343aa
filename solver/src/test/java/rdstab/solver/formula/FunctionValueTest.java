package rdstab.solver.formula;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Map;
import java.util.Random;
import java.util.function.DoubleBinaryOperator;
import java.util.function.DoubleUnaryOperator;

import org.junit.jupiter.api.Test;

/** Every function's value against java.lang.Math (source: the java.lang.Math definitions). */
class FunctionValueTest {

    private static final double[] SPECIAL = {0.0, -0.0, 1, -1, 0.5, -2.5, 3.0, 1e-300, 700, Double.NaN,
        Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY};

    private static void unary(String fn, DoubleUnaryOperator ref) {
        Formula f = Formula.parse(fn + "(x)");
        Random r = new Random(11);
        for (int i = 0; i < 200 + SPECIAL.length; i++) {
            double x = i < SPECIAL.length ? SPECIAL[i] : (r.nextDouble() - 0.5) * 20;
            assertEquals(ref.applyAsDouble(x), Eval.at(f, Map.of("x", x)), fn + "(" + x + ")");
        }
    }

    private static void binary(String fn, DoubleBinaryOperator ref) {
        Formula f = Formula.parse(fn + "(x, y)");
        Random r = new Random(12);
        for (int i = 0; i < 300; i++) {
            double x = i < SPECIAL.length ? SPECIAL[i] : (r.nextDouble() - 0.5) * 20;
            double y = i < SPECIAL.length ? SPECIAL[(i * 7) % SPECIAL.length] : (r.nextDouble() - 0.5) * 20;
            assertEquals(ref.applyAsDouble(x, y), Eval.at(f, Eval.xyz(x, y, 0)), fn + "(" + x + ", " + y + ")");
        }
    }

    @Test
    void oneArgumentFunctionsMatchMath() {
        unary("exp", Math::exp);
        unary("log", Math::log);
        unary("sqrt", Math::sqrt);
        unary("sin", Math::sin);
        unary("cos", Math::cos);
        unary("tan", Math::tan);
        unary("tanh", Math::tanh);
        unary("abs", Math::abs);
        unary("sign", Math::signum);
    }

    @Test
    void twoArgumentFunctionsMatchMath() {
        binary("min", Math::min);
        binary("max", Math::max);
        binary("pow", Math::pow);
    }

    @Test
    void ifleChoosesByComparison() {
        // ifle(a, b, p, q) = a <= b ? p : q, as documented in the package description
        assertEquals(1.0, Eval.of("ifle(1, 2, 1, 2)"));
        assertEquals(1.0, Eval.of("ifle(2, 2, 1, 2)"));
        assertEquals(2.0, Eval.of("ifle(3, 2, 1, 2)"));
        assertEquals(2.0, Eval.of("ifle(0/0, 2, 1, 2)"));
    }
}
