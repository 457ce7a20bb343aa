package rdstab.solver.formula;

import java.util.List;
import java.util.Map;
import java.util.TreeMap;

import rdstab.solver.formula.FormulaException.Kind;
import rdstab.solver.formula.Lexer.Token;
import rdstab.solver.formula.Lexer.Type;

/**
 * Recursive-descent parser with a nesting counter: every parenthesis, sign, function call and
 * exponent opens one level, and no built node may be taller than {@link Formula#MAX_DEPTH}, so
 * neither parsing nor any later walk over the tree can exhaust the Java stack. Chains of binary
 * operators are read in loops (no recursion) and count one level per operator.
 */
final class Parser {

    private final List<Token> tokens;
    private final Map<String, Integer> firstPositions = new TreeMap<>();
    private int at;
    private int depth;

    private Parser(List<Token> tokens) {
        this.tokens = tokens;
    }

    /** Result of a parse: the tree exactly as written and where each free name first occurs. */
    static final class Parsed {
        final Node root;
        final Map<String, Integer> firstPositions;

        Parsed(Node root, Map<String, Integer> firstPositions) {
            this.root = root;
            this.firstPositions = firstPositions;
        }
    }

    static Parsed parse(String text) {
        if (text.length() > Formula.MAX_LENGTH) {
            throw new FormulaException(Kind.TOO_LONG, Formula.MAX_LENGTH, "formula has " + text.length()
                    + " characters; expected at most " + Formula.MAX_LENGTH);
        }
        Parser p = new Parser(Lexer.tokens(text));
        if (p.peek().type == Type.END) {
            throw new FormulaException(Kind.SYNTAX, 0, "formula is empty; expected an expression such as 2*x + 1");
        }
        Node root = p.expression();
        Token rest = p.peek();
        if (rest.type != Type.END) {
            String hint = rest.type == Type.CLOSE ? "; this ')' has no matching '('"
                    : "; expected an operator (+ - * / ^) or end of text";
            throw syntax(rest, "unexpected " + rest.describe() + " after a complete expression" + hint);
        }
        return new Parsed(root, p.firstPositions);
    }

    private Token peek() {
        return tokens.get(at);
    }

    private Token next() {
        return tokens.get(at++);
    }

    private static FormulaException syntax(Token t, String problem) {
        return new FormulaException(Kind.SYNTAX, t.pos, problem);
    }

    private void enter(Token t) {
        if (++depth > Formula.MAX_DEPTH) {
            throw tooDeep(t);
        }
    }

    private static FormulaException tooDeep(Token t) {
        return new FormulaException(Kind.TOO_DEEP, t.pos, "expression nests more than " + Formula.MAX_DEPTH
                + " levels (parentheses, signs, function calls, powers or a long operator chain)");
    }

    private static Node build(Token t, Op op, Node... args) {
        Node n = Node.raw(op, args);
        if (n.height > Formula.MAX_DEPTH) {
            throw tooDeep(t);
        }
        return n;
    }

    private Node expression() {
        Node left = term();
        while (peek().is('+') || peek().is('-')) {
            Token t = next();
            Node right = term();
            left = build(t, t.is('+') ? Op.ADD : Op.SUB, left, right);
        }
        return left;
    }

    private Node term() {
        Node left = unary();
        while (peek().is('*') || peek().is('/')) {
            Token t = next();
            Node right = unary();
            left = build(t, t.is('*') ? Op.MUL : Op.DIV, left, right);
        }
        return left;
    }

    private Node unary() {
        if (peek().is('+') || peek().is('-')) {
            Token t = next();
            enter(t);
            Node a = unary();
            depth--;
            return t.is('-') ? build(t, Op.NEG, a) : a;
        }
        return power();
    }

    private Node power() {
        Node base = primary();
        if (peek().is('^')) {
            Token t = next();
            enter(t);
            Node exponent = unary();
            depth--;
            return build(t, Op.POW, base, exponent);
        }
        return base;
    }

    private Node primary() {
        Token t = next();
        switch (t.type) {
            case NUMBER:
                return Node.num(t.value);
            case NAME:
                return peek().type == Type.OPEN ? call(t) : name(t);
            case OPEN: {
                enter(t);
                Node inner = expression();
                expectClose(t, "to close the '(' at character " + t.pos);
                depth--;
                return inner;
            }
            default:
                throw syntax(t, "found " + t.describe() + "; expected a number, a name, a function call or '('");
        }
    }

    private Node name(Token t) {
        if (t.text.equals(Formula.PI)) {
            return Node.num(Math.PI);
        } else if (Op.function(t.text) != null) {
            throw syntax(t, "'" + t.text + "' is a function; expected '(' and its arguments after it");
        }
        firstPositions.putIfAbsent(t.text, t.pos);
        return Node.var(t.text);
    }

    private Node call(Token name) {
        Op fn = Op.function(name.text);
        if (fn == null) {
            String what = name.text.equals(Formula.PI) ? "'pi' is a constant, not a function"
                    : "unknown function '" + Lexer.shorten(name.text) + "'";
            throw new FormulaException(Kind.UNKNOWN_FUNCTION, name.pos, what + "; known functions: " + Op.functionList());
        }
        Token open = next();
        enter(open);
        Node[] args = new Node[fn.arity];
        int count = 0;
        if (peek().type != Type.CLOSE) {
            while (true) {
                Node a = expression();
                if (count < args.length) {
                    args[count] = a;
                }
                count++;
                if (peek().type != Type.COMMA) {
                    break;
                }
                next();
            }
        }
        expectClose(open, "or ',' in the call of " + name.text + " opened at character " + open.pos);
        depth--;
        if (count != fn.arity) {
            throw new FormulaException(Kind.WRONG_ARGUMENT_COUNT, name.pos, name.text + " takes " + fn.arity
                    + (fn.arity == 1 ? " argument" : " arguments") + ", found " + count);
        }
        return build(name, fn, args);
    }

    private void expectClose(Token open, String why) {
        Token t = next();
        if (t.type != Type.CLOSE) {
            throw syntax(t, "found " + t.describe() + "; expected ')' " + why);
        }
    }
}
