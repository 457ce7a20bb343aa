package rdstab.solver.formula;

import java.util.Arrays;
import java.util.Map;

/**
 * Immutable expression tree node. {@link #raw} builds a node exactly as written (the parser uses it);
 * the other factories simplify as they build. Operations on numbers only are folded first, with the
 * same arithmetic as compiled code, so a fully substituted formula folds to exactly the compiled
 * value. Then neutral terms are dropped ({@code 0*x -> 0}, {@code 1*x -> x}, {@code x+0 -> x},
 * {@code x^1 -> x}, {@code 0/x -> 0}, ...); like any such algebra this ignores that x might later be
 * infinite or NaN at run time.
 */
final class Node {

    static final Node ZERO = num(0);
    static final Node ONE = num(1);

    final Op op;
    /** Value of a NUM node, else 0. */
    final double value;
    /** Name of a VAR node, else null. */
    final String name;
    final Node[] args;
    /** 1 for a leaf, else 1 + the largest height of the arguments. */
    final int height;

    private Node(Op op, double value, String name, Node[] args) {
        this.op = op;
        this.value = value;
        this.name = name;
        this.args = args;
        int h = 0;
        for (Node a : args) {
            h = Math.max(h, a.height);
        }
        this.height = h + 1;
    }

    static Node num(double v) {
        return new Node(Op.NUM, v, null, new Node[0]);
    }

    static Node var(String name) {
        return new Node(Op.VAR, 0, name, new Node[0]);
    }

    /** A node exactly as written, no simplification. */
    static Node raw(Op op, Node... args) {
        if (args.length != op.arity || op == Op.NUM || op == Op.VAR) {
            throw new IllegalArgumentException(op + " with " + args.length + " arguments");
        }
        return new Node(op, 0, null, args.clone());
    }

    boolean isNum() {
        return op == Op.NUM;
    }

    boolean isNum(double v) {
        return op == Op.NUM && Double.compare(value, v) == 0;
    }

    /** @return whether the subtree mentions the name */
    boolean references(String n) {
        if (op == Op.VAR) {
            return name.equals(n);
        }
        for (Node a : args) {
            if (a.references(n)) {
                return true;
            }
        }
        return false;
    }

    private static boolean allNumbers(Node... a) {
        for (Node n : a) {
            if (!n.isNum()) {
                return false;
            }
        }
        return true;
    }

    /** op(args), folded to a number when every argument is a number. */
    static Node fold(Op op, Node... a) {
        double[] v = new double[a.length];
        for (int i = 0; i < a.length; i++) {
            if (!a[i].isNum()) {
                return raw(op, a);
            }
            v[i] = a[i].value;
        }
        return num(op.apply(v));
    }

    static Node neg(Node a) {
        if (allNumbers(a)) {
            return fold(Op.NEG, a);
        }
        if (a.op == Op.NEG) {
            return a.args[0];
        }
        return fold(Op.NEG, a);
    }

    static Node add(Node a, Node b) {
        if (allNumbers(a, b)) {
            return fold(Op.ADD, a, b);
        }
        if (a.isNum(0)) {
            return b;
        } else if (b.isNum(0)) {
            return a;
        } else if (b.op == Op.NEG) {
            return sub(a, b.args[0]);
        }
        return fold(Op.ADD, a, b);
    }

    static Node sub(Node a, Node b) {
        if (allNumbers(a, b)) {
            return fold(Op.SUB, a, b);
        }
        if (b.isNum(0)) {
            return a;
        } else if (a.isNum(0)) {
            return neg(b);
        } else if (b.op == Op.NEG) {
            return add(a, b.args[0]);
        }
        return fold(Op.SUB, a, b);
    }

    static Node mul(Node a, Node b) {
        if (allNumbers(a, b)) {
            return fold(Op.MUL, a, b);
        }
        if (a.isNum(0) || b.isNum(0)) {
            return ZERO;
        } else if (a.isNum(1)) {
            return b;
        } else if (b.isNum(1)) {
            return a;
        } else if (a.isNum(-1)) {
            return neg(b);
        } else if (b.isNum(-1)) {
            return neg(a);
        } else if (a.op == Op.NEG && b.op == Op.NEG) {
            return mul(a.args[0], b.args[0]);
        }
        return fold(Op.MUL, a, b);
    }

    static Node div(Node a, Node b) {
        if (allNumbers(a, b)) {
            return fold(Op.DIV, a, b);
        }
        if (a.isNum(0) && !b.isNum(0)) {
            return ZERO;
        } else if (b.isNum(1)) {
            return a;
        }
        return fold(Op.DIV, a, b);
    }

    static Node pow(Node a, Node b) {
        if (allNumbers(a, b)) {
            return fold(Op.POW, a, b);
        }
        if (b.isNum(1)) {
            return a;
        } else if (b.isNum(0)) {
            return ONE;
        }
        return fold(Op.POW, a, b);
    }

    static Node ifle(Node a, Node b, Node p, Node q) {
        if (allNumbers(a, b, p, q)) {
            return fold(Op.IFLE, a, b, p, q);
        }
        if (p.isNum() && q.isNum() && Double.compare(p.value, q.value) == 0) {
            return p;
        }
        return fold(Op.IFLE, a, b, p, q);
    }

    /**
     * @return the tree with names replaced by numbers from the map and every operation on numbers
     *         only computed; no algebraic rewriting, so values stay exactly those of this tree
     */
    Node substitute(Map<String, Double> constants) {
        if (op == Op.VAR) {
            Double v = constants.get(name);
            return v == null ? this : num(v);
        } else if (op == Op.NUM) {
            return this;
        }
        Node[] a = new Node[args.length];
        for (int i = 0; i < a.length; i++) {
            a[i] = args[i].substitute(constants);
        }
        return fold(op, a);
    }

    @Override
    public String toString() {
        return op == Op.NUM ? Double.toString(value) : op == Op.VAR ? name : op + Arrays.toString(args);
    }
}
