package rdstab.solver.formula;

import java.util.Map;

/**
 * Turns a tree (constants already folded) into a tree of small closures over the variable array.
 * Names were resolved to array slots here, once; evaluation does no look-ups.
 */
final class Compiler {

    private Compiler() {
    }

    /** @param slots variable name to index in the evaluation array; every VAR in the tree is a key */
    static CompiledFormula compile(Node n, Map<String, Integer> slots) {
        switch (n.op) {
            case NUM: {
                double c = n.value;
                return v -> c;
            }
            case VAR: {
                int i = slots.get(n.name);
                return v -> v[i];
            }
            case POW: return power(n, slots);
            case IFLE: {
                CompiledFormula a = compile(n.args[0], slots);
                CompiledFormula b = compile(n.args[1], slots);
                CompiledFormula p = compile(n.args[2], slots);
                CompiledFormula q = compile(n.args[3], slots);
                return v -> a.evaluate(v) <= b.evaluate(v) ? p.evaluate(v) : q.evaluate(v);
            }
            default:
                return n.op.arity == 1 ? unary(n.op, compile(n.args[0], slots))
                        : binary(n.op, compile(n.args[0], slots), compile(n.args[1], slots));
        }
    }

    private static CompiledFormula unary(Op op, CompiledFormula a) {
        switch (op) {
            case NEG: return v -> -a.evaluate(v);
            case EXP: return v -> Math.exp(a.evaluate(v));
            case LOG: return v -> Math.log(a.evaluate(v));
            case SQRT: return v -> Math.sqrt(a.evaluate(v));
            case SIN: return v -> Math.sin(a.evaluate(v));
            case COS: return v -> Math.cos(a.evaluate(v));
            case TAN: return v -> Math.tan(a.evaluate(v));
            case TANH: return v -> Math.tanh(a.evaluate(v));
            case ABS: return v -> Math.abs(a.evaluate(v));
            case SIGN: return v -> Math.signum(a.evaluate(v));
            default: throw new IllegalStateException("not a one-argument operation: " + op);
        }
    }

    private static CompiledFormula binary(Op op, CompiledFormula a, CompiledFormula b) {
        switch (op) {
            case ADD: return v -> a.evaluate(v) + b.evaluate(v);
            case SUB: return v -> a.evaluate(v) - b.evaluate(v);
            case MUL: return v -> a.evaluate(v) * b.evaluate(v);
            case DIV: return v -> a.evaluate(v) / b.evaluate(v);
            case MIN: return v -> Math.min(a.evaluate(v), b.evaluate(v));
            case MAX: return v -> Math.max(a.evaluate(v), b.evaluate(v));
            default: throw new IllegalStateException("not a two-argument operation: " + op);
        }
    }

    /** Small integer exponents by multiplication, exactly as {@link Op#power} folds them. */
    private static CompiledFormula power(Node n, Map<String, Integer> slots) {
        CompiledFormula a = compile(n.args[0], slots);
        Node e = n.args[1];
        if (e.isNum(2)) {
            return v -> {
                double x = a.evaluate(v);
                return x * x;
            };
        } else if (e.isNum(3)) {
            return v -> {
                double x = a.evaluate(v);
                return x * x * x;
            };
        } else if (e.isNum()) {
            double c = e.value;
            return v -> Op.power(a.evaluate(v), c);
        }
        CompiledFormula b = compile(e, slots);
        return v -> Op.power(a.evaluate(v), b.evaluate(v));
    }
}
