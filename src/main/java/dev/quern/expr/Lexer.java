package dev.quern.expr;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Splits an expression into tokens. Outside text literals only ASCII letters, digits, {@code _}, the
 * operators and white space are accepted: quotes other than {@code '}, semicolons, comment markers and
 * look-alike characters from other scripts are refused here, so nothing that could end a SQL literal or
 * statement ever gets past this point unless it sits inside a text literal, which is data.
 */
final class Lexer {

    private static final Map<String, TokenKind> KEYWORDS = Map.of(
            "and", TokenKind.AND, "or", TokenKind.OR, "not", TokenKind.NOT, "in", TokenKind.IN,
            "is", TokenKind.IS, "null", TokenKind.NULL, "true", TokenKind.TRUE, "false", TokenKind.FALSE,
            "between", TokenKind.BETWEEN);

    private final String text;
    private final List<Token> tokens = new ArrayList<>();
    private int pos;

    private Lexer(String text) {
        this.text = text;
    }

    /** The tokens of {@code text}, ending with an END token; throws {@link SyntaxError} at the first mistake. */
    static List<Token> tokens(String text) {
        Lexer lexer = new Lexer(text);
        lexer.run();
        return List.copyOf(lexer.tokens);
    }

    private void run() {
        while (true) {
            while (pos < text.length() && isSpace(text.charAt(pos))) {
                pos++;
            }
            if (pos >= text.length()) {
                tokens.add(new Token(TokenKind.END, "", text.length(), text.length()));
                return;
            }
            char c = text.charAt(pos);
            if (isNameStart(c)) {
                word();
            } else if (isDigit(c)) {
                number();
            } else if (c == '\'') {
                string();
            } else {
                operator(c);
            }
        }
    }

    private void word() {
        int start = pos;
        while (pos < text.length() && isNamePart(text.charAt(pos))) {
            pos++;
        }
        String word = text.substring(start, pos);
        TokenKind kind = KEYWORDS.getOrDefault(word.toLowerCase(Locale.ROOT), TokenKind.NAME);
        tokens.add(new Token(kind, word, start, pos));
    }

    private void number() {
        int start = pos;
        digits();
        if (peek(0) == '.') {
            if (!isDigit(peek(1))) {
                throw new SyntaxError(pos, "a number needs digits after the decimal point");
            }
            pos++;
            digits();
        }
        if ((peek(0) == 'e' || peek(0) == 'E')
                && (isDigit(peek(1)) || ((peek(1) == '+' || peek(1) == '-') && isDigit(peek(2))))) {
            pos += isDigit(peek(1)) ? 1 : 2;
            digits();
        }
        if (isNamePart(peek(0))) {
            while (pos < text.length() && isNamePart(text.charAt(pos))) {
                pos++;
            }
            throw new SyntaxError(start, "'" + text.substring(start, pos)
                    + "' is neither a number nor a name (names start with a letter or _)");
        }
        tokens.add(new Token(TokenKind.NUMBER, text.substring(start, pos), start, pos));
    }

    private void digits() {
        while (pos < text.length() && isDigit(text.charAt(pos))) {
            pos++;
        }
    }

    /** A text literal: {@code ''} stands for one quote; control characters are refused as sure mistakes. */
    private void string() {
        int start = pos;
        pos++;
        while (true) {
            if (pos >= text.length()) {
                throw new SyntaxError(start, "this text has no closing quote (')");
            }
            char c = text.charAt(pos);
            if (c == '\'') {
                if (peek(1) == '\'') {
                    pos += 2;
                    continue;
                }
                pos++;
                tokens.add(new Token(TokenKind.TEXT, text.substring(start, pos), start, pos));
                return;
            }
            if (Character.isISOControl(c) && c != '\t' && c != '\n' && c != '\r') {
                throw new SyntaxError(pos, "text cannot hold the control character " + codePoint(c));
            }
            pos++;
        }
    }

    private void operator(char c) {
        int start = pos;
        TokenKind kind = switch (c) {
            case '+' -> TokenKind.PLUS;
            case '*' -> TokenKind.STAR;
            case '%' -> TokenKind.PERCENT;
            case '(' -> TokenKind.LPAREN;
            case ')' -> TokenKind.RPAREN;
            case ',' -> TokenKind.COMMA;
            case '-' -> {
                if (peek(1) == '-') {
                    throw new SyntaxError(pos, "comments are not allowed in expressions"
                            + " (to subtract a negative value, write '- -')");
                }
                yield TokenKind.MINUS;
            }
            case '/' -> {
                if (peek(1) == '*') {
                    throw new SyntaxError(pos, "comments are not allowed in expressions");
                }
                yield TokenKind.SLASH;
            }
            case '=' -> {
                if (peek(1) == '=') {
                    throw new SyntaxError(pos, "'==' is not an operator; write '='");
                }
                yield TokenKind.EQ;
            }
            case '!' -> {
                if (peek(1) != '=') {
                    throw new SyntaxError(pos, "'!' is not an operator; write 'not'");
                }
                pos++;
                yield TokenKind.NE;
            }
            case '<' -> {
                if (peek(1) == '=') {
                    pos++;
                    yield TokenKind.LE;
                }
                if (peek(1) == '>') {
                    pos++;
                    yield TokenKind.NE;
                }
                yield TokenKind.LT;
            }
            case '>' -> {
                if (peek(1) == '=') {
                    pos++;
                    yield TokenKind.GE;
                }
                yield TokenKind.GT;
            }
            case '.' -> {
                if (isDigit(peek(1))) {
                    throw new SyntaxError(pos, "write a digit before the decimal point, like 0.5");
                }
                yield TokenKind.DOT;
            }
            case '"', '`' -> throw new SyntaxError(pos, "names are written without quotes, and text in single"
                    + " quotes ('like this'); " + c + " is not allowed");
            default -> throw new SyntaxError(pos, "unexpected character " + describe(text.codePointAt(pos)));
        };
        pos++;
        tokens.add(new Token(kind, text.substring(start, pos), start, pos));
    }

    /**
     * ';' for plain ASCII, 'ｓ' (U+FF53) for anything else, so that look-alikes are told apart, and only the
     * code point for characters that cannot be seen (spaces other than the ASCII one, controls, joiners).
     */
    private static String describe(int codePoint) {
        if (codePoint < 0x80 && !Character.isISOControl(codePoint)) {
            return "'" + Character.toString(codePoint) + "'";
        }
        if (Character.isISOControl(codePoint) || Character.isWhitespace(codePoint) || Character.isSpaceChar(codePoint)
                || Character.getType(codePoint) == Character.FORMAT) {
            return codePoint(codePoint);
        }
        return "'" + Character.toString(codePoint) + "' (" + codePoint(codePoint) + ")";
    }

    private static String codePoint(int codePoint) {
        return String.format(Locale.ROOT, "U+%04X", codePoint);
    }

    private char peek(int ahead) {
        int at = pos + ahead;
        return at < text.length() ? text.charAt(at) : '\0';
    }

    private static boolean isSpace(char c) {
        return c == ' ' || c == '\t' || c == '\n' || c == '\r';
    }

    private static boolean isNameStart(char c) {
        return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || c == '_';
    }

    private static boolean isNamePart(char c) {
        return isNameStart(c) || isDigit(c);
    }

    private static boolean isDigit(char c) {
        return c >= '0' && c <= '9';
    }
}
