package rdstab.solver.formula;

import java.util.HashMap;
import java.util.Map;

/** Node kinds of the expression tree: leaves, operators and functions, with their plain arithmetic. */
enum Op {
    NUM(null, 0), VAR(null, 0),
    NEG(null, 1), ADD(null, 2), SUB(null, 2), MUL(null, 2), DIV(null, 2), POW("pow", 2),
    EXP("exp", 1), LOG("log", 1), SQRT("sqrt", 1), SIN("sin", 1), COS("cos", 1), TAN("tan", 1),
    TANH("tanh", 1), ABS("abs", 1), SIGN("sign", 1), MIN("min", 2), MAX("max", 2), IFLE("ifle", 4);

    private static final Map<String, Op> FUNCTIONS = new HashMap<>();

    static {
        for (Op op : values()) {
            if (op.spelling != null) {
                FUNCTIONS.put(op.spelling, op);
            }
        }
    }

    /** Function spelling, or null for leaves and infix operators. */
    final String spelling;
    final int arity;

    Op(String spelling, int arity) {
        this.spelling = spelling;
        this.arity = arity;
    }

    /** @return the function of that spelling, or null */
    static Op function(String name) {
        return FUNCTIONS.get(name);
    }

    /** @return all function spellings, for messages */
    static String functionList() {
        StringBuilder sb = new StringBuilder();
        for (Op op : values()) {
            if (op.spelling != null) {
                sb.append(sb.length() == 0 ? "" : ", ").append(op.spelling);
            }
        }
        return sb.toString();
    }

    /**
     * The one definition of each operation's arithmetic, shared by constant folding and (through
     * the same static helpers) by compiled code, so folded and compiled values agree bit for bit.
     */
    double apply(double[] a) {
        switch (this) {
            case NEG: return -a[0];
            case ADD: return a[0] + a[1];
            case SUB: return a[0] - a[1];
            case MUL: return a[0] * a[1];
            case DIV: return a[0] / a[1];
            case POW: return power(a[0], a[1]);
            case EXP: return Math.exp(a[0]);
            case LOG: return Math.log(a[0]);
            case SQRT: return Math.sqrt(a[0]);
            case SIN: return Math.sin(a[0]);
            case COS: return Math.cos(a[0]);
            case TAN: return Math.tan(a[0]);
            case TANH: return Math.tanh(a[0]);
            case ABS: return Math.abs(a[0]);
            case SIGN: return Math.signum(a[0]);
            case MIN: return Math.min(a[0], a[1]);
            case MAX: return Math.max(a[0], a[1]);
            case IFLE: return a[0] <= a[1] ? a[2] : a[3];
            default: throw new IllegalStateException("no arithmetic for " + this);
        }
    }

    /**
     * a^b; small integer exponents by multiplication (what compiled code does too), else Math.pow.
     */
    static double power(double a, double b) {
        if (b == 2) {
            return a * a;
        } else if (b == 3) {
            return a * a * a;
        } else if (b == 4) {
            double s = a * a;
            return s * s;
        } else if (b == -1) {
            return 1 / a;
        } else if (b == -2) {
            return 1 / (a * a);
        }
        return Math.pow(a, b);
    }
}
