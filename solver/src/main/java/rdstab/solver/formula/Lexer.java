package rdstab.solver.formula;

import java.util.ArrayList;
import java.util.List;

/** Splits formula text into tokens; rejects any character outside the formula alphabet. */
final class Lexer {

    enum Type { NUMBER, NAME, OPERATOR, OPEN, CLOSE, COMMA, END }

    /** One token: its type, the exact source text, its start offset and, for numbers, the value. */
    static final class Token {
        final Type type;
        final String text;
        final int pos;
        final double value;

        Token(Type type, String text, int pos, double value) {
            this.type = type;
            this.text = text;
            this.pos = pos;
            this.value = value;
        }

        boolean is(char c) {
            return text.length() == 1 && text.charAt(0) == c && type != Type.NAME && type != Type.NUMBER;
        }

        /** Plain-words description for error messages. */
        String describe() {
            switch (type) {
                case NUMBER: return "number '" + shorten(text) + "'";
                case NAME: return "name '" + shorten(text) + "'";
                case END: return "end of text";
                default: return "'" + text + "'";
            }
        }
    }

    private final String s;
    private int i;

    private Lexer(String s) {
        this.s = s;
    }

    /** @return the tokens of the text, always ending with an END token at offset text.length() */
    static List<Token> tokens(String text) {
        Lexer lx = new Lexer(text);
        List<Token> out = new ArrayList<>();
        Token t;
        do {
            t = lx.next();
            out.add(t);
        } while (t.type != Type.END);
        return out;
    }

    private Token next() {
        while (i < s.length() && isSpace(s.charAt(i))) {
            i++;
        }
        if (i >= s.length()) {
            return new Token(Type.END, "", s.length(), 0);
        }
        char c = s.charAt(i);
        int start = i;
        if (isDigit(c) || (c == '.' && i + 1 < s.length() && isDigit(s.charAt(i + 1)))) {
            return number();
        } else if (isNameStart(c)) {
            while (i < s.length() && isNamePart(s.charAt(i))) {
                i++;
            }
            return new Token(Type.NAME, s.substring(start, i), start, 0);
        }
        i++;
        switch (c) {
            case '+': case '-': case '*': case '/': case '^':
                return new Token(Type.OPERATOR, String.valueOf(c), start, 0);
            case '(': return new Token(Type.OPEN, "(", start, 0);
            case ')': return new Token(Type.CLOSE, ")", start, 0);
            case ',': return new Token(Type.COMMA, ",", start, 0);
            default:
                throw badCharacter(start);
        }
    }

    private Token number() {
        int start = i;
        while (i < s.length() && isDigit(s.charAt(i))) {
            i++;
        }
        if (i < s.length() && s.charAt(i) == '.') {
            i++;
            while (i < s.length() && isDigit(s.charAt(i))) {
                i++;
            }
        }
        if (i < s.length() && (s.charAt(i) == 'e' || s.charAt(i) == 'E')) {
            int mark = i++;
            if (i < s.length() && (s.charAt(i) == '+' || s.charAt(i) == '-')) {
                i++;
            }
            if (i >= s.length() || !isDigit(s.charAt(i))) {
                throw new FormulaException(FormulaException.Kind.SYNTAX, mark,
                        "number '" + shorten(s.substring(start, i)) + "' has an exponent mark '" + s.charAt(mark)
                                + "' without digits; expected digits such as 1.5e-3");
            }
            while (i < s.length() && isDigit(s.charAt(i))) {
                i++;
            }
        }
        String lit = s.substring(start, i);
        double v = Double.parseDouble(lit);
        if (Double.isInfinite(v)) {
            throw new FormulaException(FormulaException.Kind.SYNTAX, start,
                    "number '" + shorten(lit) + "' is too large; expected a magnitude below about 1.8e308");
        }
        return new Token(Type.NUMBER, lit, start, v);
    }

    /** @return the text, cut to at most 40 characters for messages */
    static String shorten(String text) {
        return text.length() <= 40 ? text : text.substring(0, 37) + "...";
    }

    private FormulaException badCharacter(int at) {
        int cp = s.codePointAt(at);
        String shown = Character.isISOControl(cp) || Character.isWhitespace(cp)
                ? "" : "'" + new String(Character.toChars(cp)) + "' ";
        return new FormulaException(FormulaException.Kind.SYNTAX, at,
                "unexpected character " + shown + String.format("(U+%04X)", cp)
                        + "; expected ASCII names (letters, digits, '_'), numbers, + - * / ^ ( ) or ','");
    }

    private static boolean isSpace(char c) {
        return c == ' ' || c == '\t' || c == '\n' || c == '\r';
    }

    private static boolean isDigit(char c) {
        return c >= '0' && c <= '9';
    }

    static boolean isNameStart(char c) {
        return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || c == '_';
    }

    static boolean isNamePart(char c) {
        return isNameStart(c) || isDigit(c);
    }
}
