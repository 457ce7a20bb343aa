package rdstab.solver.formula;

import java.util.Map;
import java.util.TreeMap;

/**
 * Writes a tree as infix text that {@link Parser} reads back to the same tree shape (so the same
 * values): parentheses wherever precedence or left-to-right grouping requires them. Records where
 * each name first occurs in the written text.
 */
final class Printer {

    private static final int SUM = 1;
    private static final int PRODUCT = 2;
    private static final int SIGN = 3;
    private static final int POWER = 4;
    private static final int ATOM = 5;

    private final StringBuilder out = new StringBuilder();
    private final Map<String, Integer> firstPositions = new TreeMap<>();

    private Printer() {
    }

    /** @return the text of the tree; fills {@code positions} with each name's first offset */
    static String print(Node root, Map<String, Integer> positions) {
        Printer p = new Printer();
        p.write(root);
        positions.putAll(p.firstPositions);
        return p.out.toString();
    }

    private static int precedence(Node n) {
        switch (n.op) {
            case ADD: case SUB: return SUM;
            case MUL: case DIV: return PRODUCT;
            case NEG: return SIGN;
            case POW: return POWER;
            case NUM: return n.value < 0 && n.value != Double.NEGATIVE_INFINITY
                    || (n.value == 0 && 1 / n.value < 0) ? SIGN : ATOM;
            default: return ATOM;
        }
    }

    private void write(Node n) {
        switch (n.op) {
            case NUM: number(n.value); break;
            case VAR:
                firstPositions.putIfAbsent(n.name, out.length());
                out.append(n.name);
                break;
            case NEG:
                out.append('-');
                operand(n.args[0], SIGN);
                break;
            case ADD: case SUB: infix(n, n.op == Op.ADD ? " + " : " - ", SUM); break;
            case MUL: case DIV: infix(n, n.op == Op.MUL ? "*" : "/", PRODUCT); break;
            case POW:
                operand(n.args[0], ATOM);
                out.append('^');
                operand(n.args[1], POWER);
                break;
            default: call(n);
        }
    }

    /** Left operand may share the level; the right one must bind tighter (left-to-right grouping). */
    private void infix(Node n, String symbol, int level) {
        operand(n.args[0], level);
        out.append(symbol);
        operand(n.args[1], level + 1);
    }

    private void operand(Node a, int minLevel) {
        if (precedence(a) >= minLevel) {
            write(a);
        } else {
            out.append('(');
            write(a);
            out.append(')');
        }
    }

    private void call(Node n) {
        out.append(n.op.spelling).append('(');
        for (int i = 0; i < n.args.length; i++) {
            out.append(i == 0 ? "" : ", ");
            write(n.args[i]);
        }
        out.append(')');
    }

    /**
     * Finite negative numbers and -0 are written with a leading '-' (level SIGN); infinities and NaN,
     * which have no literal, as parenthesised quotients (level ATOM).
     */
    private void number(double v) {
        if (Double.isNaN(v)) {
            out.append("(0/0)");
        } else if (Double.isInfinite(v)) {
            out.append(v > 0 ? "(1/0)" : "(-1/0)");
        } else if (v == Math.PI) {
            out.append(Formula.PI);
        } else if (v == -Math.PI) {
            out.append('-').append(Formula.PI);
        } else if (v == Math.rint(v) && Math.abs(v) < 1e15 && !(v == 0 && 1 / v < 0)) {
            out.append((long) v);
        } else {
            out.append(Double.toString(v));
        }
    }
}
