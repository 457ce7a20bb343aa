package rdstab.solver.formula;

import static rdstab.solver.formula.Node.ONE;
import static rdstab.solver.formula.Node.ZERO;
import static rdstab.solver.formula.Node.add;
import static rdstab.solver.formula.Node.div;
import static rdstab.solver.formula.Node.fold;
import static rdstab.solver.formula.Node.ifle;
import static rdstab.solver.formula.Node.mul;
import static rdstab.solver.formula.Node.neg;
import static rdstab.solver.formula.Node.num;
import static rdstab.solver.formula.Node.pow;
import static rdstab.solver.formula.Node.sub;

/**
 * Exact symbolic differentiation by the chain rule; the result is simplified as it is built.
 * Non-smooth functions take one-sided choices: d abs(a) = sign(a) a' with sign(0) = 0; min and max
 * take the derivative of the active argument, the first one on a tie; sign has derivative 0.
 */
final class Derivative {

    private Derivative() {
    }

    /** @return d n / d name */
    static Node of(Node n, String name) {
        if (!n.references(name)) {
            return ZERO;
        }
        Node[] a = n.args;
        switch (n.op) {
            case VAR: return ONE;
            case NEG: return neg(of(a[0], name));
            case ADD: return add(of(a[0], name), of(a[1], name));
            case SUB: return sub(of(a[0], name), of(a[1], name));
            case MUL: return add(mul(of(a[0], name), a[1]), mul(a[0], of(a[1], name)));
            case DIV: return quotient(a[0], a[1], name);
            case POW: return power(n, name);
            case MIN: return ifle(a[0], a[1], of(a[0], name), of(a[1], name));
            case MAX: return ifle(a[1], a[0], of(a[0], name), of(a[1], name));
            case IFLE: return ifle(a[0], a[1], of(a[2], name), of(a[3], name));
            case SIGN: return ZERO;
            default: return mul(outer(n), of(a[0], name));
        }
    }

    /** Derivative of a one-argument function with respect to its argument, at the argument. */
    private static Node outer(Node n) {
        Node a = n.args[0];
        switch (n.op) {
            case EXP: return n;
            case LOG: return div(ONE, a);
            case SQRT: return div(ONE, mul(num(2), n));
            case SIN: return fold(Op.COS, a);
            case COS: return neg(fold(Op.SIN, a));
            case TAN: return div(ONE, pow(fold(Op.COS, a), num(2)));
            case TANH: return sub(ONE, pow(n, num(2)));
            case ABS: return fold(Op.SIGN, a);
            default: throw new IllegalStateException("no derivative rule for " + n.op);
        }
    }

    /** (a/b)' = a'/b - (a/b)(b'/b): no b^2, so no early overflow for large b. */
    private static Node quotient(Node a, Node b, String name) {
        Node da = of(a, name);
        if (!b.references(name)) {
            return div(da, b);
        }
        return sub(div(da, b), mul(div(a, b), div(of(b, name), b)));
    }

    /**
     * Constant exponent: b a^(b-1) a' (fine at a = 0 and a &lt; 0). Constant base: a^b ln(a) b'.
     * Otherwise the general rule a^b (b' ln a + b a'/a).
     */
    private static Node power(Node n, String name) {
        Node a = n.args[0];
        Node b = n.args[1];
        if (!b.references(name)) {
            return mul(mul(b, pow(a, sub(b, ONE))), of(a, name));
        }
        Node log = fold(Op.LOG, a);
        if (!a.references(name)) {
            return mul(mul(n, log), of(b, name));
        }
        return mul(n, add(mul(of(b, name), log), div(mul(b, of(a, name)), a)));
    }
}
