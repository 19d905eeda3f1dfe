package dev.quern.expr;

import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.LocalTime;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * Recursive descent over the tokens, one method per precedence level, loosest first:
 * {@code or < and < not < comparison, between, in, is null < + - < * / % < unary minus}. Binary
 * operators group to the left; comparisons do not chain. Throws {@link SyntaxError} at the first mistake.
 */
final class Parser {

    /**
     * How many operators may sit inside one another (a chain {@code a + b + c} counts each '+'): deep enough
     * for any real formula, shallow enough that hostile input cannot overflow the stack of a later stage.
     */
    static final int MAX_DEPTH = 100;

    private final List<Token> tokens;
    private int next;
    private int depth;

    private Parser(List<Token> tokens) {
        this.tokens = tokens;
    }

    static Syntax parse(String text) {
        Parser parser = new Parser(Lexer.tokens(text));
        return parser.expression();
    }

    private Syntax expression() {
        if (peek().kind() == TokenKind.END) {
            throw new SyntaxError(0, "the expression is empty");
        }
        Syntax result = or();
        Token extra = peek();
        if (extra.kind() != TokenKind.END) {
            throw new SyntaxError(extra.start(), trailing(extra));
        }
        return result;
    }

    private static String trailing(Token extra) {
        if (extra.kind() == TokenKind.RPAREN) {
            return "')' has no matching '('";
        }
        if (extra.kind() == TokenKind.NAME && extra.text().equalsIgnoreCase("like")) {
            return "'like' is not supported: engines disagree on whether it tells upper from lower case";
        }
        return "expected an operator or the end of the expression, but found " + extra.describe();
    }

    private Syntax or() {
        Syntax left = and();
        int chained = 0;
        while (peek().kind() == TokenKind.OR) {
            Token op = advance();
            enter(op);
            chained++;
            left = new Syntax.Binary(Operator.OR, op.text(), op.start(), left, and());
        }
        depth -= chained;
        return left;
    }

    private Syntax and() {
        Syntax left = not();
        int chained = 0;
        while (peek().kind() == TokenKind.AND) {
            Token op = advance();
            enter(op);
            chained++;
            left = new Syntax.Binary(Operator.AND, op.text(), op.start(), left, not());
        }
        depth -= chained;
        return left;
    }

    private Syntax not() {
        if (peek().kind() == TokenKind.NOT) {
            Token op = advance();
            enter(op);
            Syntax operand = not();
            depth--;
            return new Syntax.Not(operand, op.start(), operand.end());
        }
        return predicate();
    }

    /** One comparison, between, in or is null after a sum; a second one must be joined with 'and'. */
    private Syntax predicate() {
        Syntax left = additive();
        Syntax result = predicateAfter(left);
        if (result != left && startsPredicate()) {
            throw new SyntaxError(peek().start(), "comparisons cannot be chained; join them with 'and'");
        }
        return result;
    }

    private Syntax predicateAfter(Syntax left) {
        Token token = peek();
        if (token.kind().isComparison()) {
            advance();
            return new Syntax.Binary(Operator.of(token.kind()), token.text(), token.start(), left, additive());
        }
        if (token.kind() == TokenKind.IS) {
            advance();
            boolean negated = peek().kind() == TokenKind.NOT;
            if (negated) {
                advance();
            }
            Token nullToken = expect(TokenKind.NULL, "expected 'null' or 'not null' after 'is'");
            return new Syntax.IsNull(left, negated, token.start(), nullToken.end());
        }
        boolean negated = token.kind() == TokenKind.NOT;
        if (negated) {
            advance();
            TokenKind after = peek().kind();
            if (after != TokenKind.IN && after != TokenKind.BETWEEN) {
                throw new SyntaxError(peek().start(), "expected 'in' or 'between' after 'not', but found "
                        + peek().describe());
            }
        }
        if (peek().kind() == TokenKind.BETWEEN) {
            advance();
            Syntax low = additive();
            expect(TokenKind.AND, "expected 'and' between the two bounds of 'between'");
            Syntax high = additive();
            return new Syntax.Between(left, low, high, negated, token.start());
        }
        if (peek().kind() == TokenKind.IN) {
            return in(left, negated, token.start());
        }
        return left;
    }

    private boolean startsPredicate() {
        TokenKind kind = peek().kind();
        return kind.isComparison() || kind == TokenKind.IS || kind == TokenKind.BETWEEN || kind == TokenKind.IN
                || (kind == TokenKind.NOT && (peek(1).kind() == TokenKind.IN || peek(1).kind() == TokenKind.BETWEEN));
    }

    private Syntax in(Syntax value, boolean negated, int at) {
        advance();
        Token open = expect(TokenKind.LPAREN, "expected '(' after 'in'");
        enter(open);
        if (peek().kind() == TokenKind.RPAREN) {
            throw new SyntaxError(peek().start(), "'in' needs at least one value between the parentheses");
        }
        List<Syntax> items = new ArrayList<>();
        items.add(or());
        while (peek().kind() == TokenKind.COMMA) {
            advance();
            items.add(or());
        }
        Token close = expect(TokenKind.RPAREN, "expected ',' or ')' in the list of 'in'");
        depth--;
        return new Syntax.In(value, items, negated, at, close.end());
    }

    private Syntax additive() {
        Syntax left = multiplicative();
        int chained = 0;
        while (peek().kind() == TokenKind.PLUS || peek().kind() == TokenKind.MINUS) {
            Token op = advance();
            enter(op);
            chained++;
            left = new Syntax.Binary(Operator.of(op.kind()), op.text(), op.start(), left, multiplicative());
        }
        depth -= chained;
        return left;
    }

    private Syntax multiplicative() {
        Syntax left = unary();
        int chained = 0;
        while (peek().kind() == TokenKind.STAR || peek().kind() == TokenKind.SLASH
                || peek().kind() == TokenKind.PERCENT) {
            Token op = advance();
            enter(op);
            chained++;
            left = new Syntax.Binary(Operator.of(op.kind()), op.text(), op.start(), left, unary());
        }
        depth -= chained;
        return left;
    }

    private Syntax unary() {
        if (peek().kind() != TokenKind.MINUS) {
            return primary();
        }
        Token minus = advance();
        if (peek().kind() == TokenKind.NUMBER) {
            // Folded, so that the most negative whole number, whose positive is out of range, can be written.
            Token number = advance();
            return new Syntax.NumberLiteral(number("-" + number.text(), minus.start()), minus.start(), number.end());
        }
        enter(minus);
        Syntax operand = unary();
        depth--;
        return new Syntax.Negate(operand, minus.start(), operand.end());
    }

    private Syntax primary() {
        Token token = peek();
        switch (token.kind()) {
            case NUMBER -> {
                advance();
                return new Syntax.NumberLiteral(number(token.text(), token.start()), token.start(), token.end());
            }
            case TEXT -> {
                advance();
                return new Syntax.TextLiteral(unquote(token.text()), token.start(), token.end());
            }
            case TRUE, FALSE -> {
                advance();
                return new Syntax.BooleanLiteral(token.kind() == TokenKind.TRUE, token.start(), token.end());
            }
            case NULL -> {
                advance();
                return new Syntax.NullLiteral(token.start(), token.end());
            }
            case LPAREN -> {
                advance();
                enter(token);
                Syntax inner = or();
                Token close = expect(TokenKind.RPAREN, "expected ')' to close the '('");
                depth--;
                return new Syntax.Group(inner, token.start(), close.end());
            }
            case NAME -> {
                return name();
            }
            default -> throw new SyntaxError(token.start(), expectedValue(token));
        }
    }

    private String expectedValue(Token found) {
        String hint = found.kind() == TokenKind.NOT ? " (put 'not ...' in parentheses)" : "";
        if (next == 0) {
            return "expected a value, but found " + found.describe() + hint;
        }
        return "expected a value after '" + tokens.get(next - 1).text() + "', but found " + found.describe() + hint;
    }

    /** A column, a function call, or a date or timestamp literal: which one depends on what follows. */
    private Syntax name() {
        Token name = advance();
        String lowered = name.text().toLowerCase(Locale.ROOT);
        if (peek().kind() == TokenKind.TEXT && (lowered.equals("date") || lowered.equals("timestamp"))) {
            Token literal = advance();
            String value = unquote(literal.text());
            if (lowered.equals("date")) {
                return new Syntax.DateLiteral(date(value, literal), name.start(), literal.end());
            }
            return new Syntax.TimestampLiteral(timestamp(value, literal), name.start(), literal.end());
        }
        if (peek().kind() == TokenKind.LPAREN) {
            return call(name, lowered);
        }
        if (peek().kind() == TokenKind.DOT) {
            Token dot = advance();
            Token column = peek();
            if (column.kind() != TokenKind.NAME && !column.kind().isKeyword()) {
                throw new SyntaxError(column.start(), "expected a column name after '" + name.text() + ".', but found "
                        + column.describe());
            }
            advance();
            if (dot.start() != name.end() || column.start() != dot.end()) {
                throw new SyntaxError(dot.start(), "write a qualified name without spaces, like "
                        + name.text() + "." + column.text());
            }
            return new Syntax.Name(Optional.of(name.text()), column.text(), name.start(), column.end());
        }
        return new Syntax.Name(Optional.empty(), name.text(), name.start(), name.end());
    }

    private Syntax call(Token name, String lowered) {
        Token open = advance();
        enter(open);
        List<Syntax> arguments = new ArrayList<>();
        if (peek().kind() != TokenKind.RPAREN) {
            arguments.add(or());
            while (peek().kind() == TokenKind.COMMA) {
                advance();
                arguments.add(or());
            }
        }
        Token close = expect(TokenKind.RPAREN, "expected ',' or ')' in the arguments of " + lowered);
        depth--;
        return new Syntax.Call(lowered, arguments, name.start(), close.end());
    }

    private static Number number(String text, int at) {
        boolean whole = text.chars().allMatch(c -> c == '-' || (c >= '0' && c <= '9'));
        if (whole) {
            try {
                return Long.parseLong(text);
            } catch (NumberFormatException e) {
                throw new SyntaxError(at, "the number " + text + " is too large for a whole number"
                        + " (the largest is 9223372036854775807)");
            }
        }
        double value = Double.parseDouble(text);
        if (Double.isInfinite(value)) {
            throw new SyntaxError(at, "the number " + text + " is too large");
        }
        return value;
    }

    private static LocalDate date(String value, Token at) {
        try {
            return LocalDate.parse(value);
        } catch (DateTimeParseException e) {
            throw new SyntaxError(at.start(), at.text() + " is not a date; write date 'YYYY-MM-DD'");
        }
    }

    /** {@code YYYY-MM-DD HH:MM[:SS[.fraction]]}, with a space or a {@code T} between date and time. */
    private static LocalDateTime timestamp(String value, Token at) {
        try {
            if (value.length() > 11 && (value.charAt(10) == ' ' || value.charAt(10) == 'T')) {
                return LocalDateTime.of(LocalDate.parse(value.substring(0, 10)), LocalTime.parse(value.substring(11)));
            }
        } catch (DateTimeParseException e) {
            // reported below, with the form that is accepted
        }
        throw new SyntaxError(at.start(), at.text() + " is not a timestamp; write timestamp 'YYYY-MM-DD HH:MM:SS'");
    }

    private static String unquote(String literal) {
        return literal.substring(1, literal.length() - 1).replace("''", "'");
    }

    private void enter(Token at) {
        if (++depth > MAX_DEPTH) {
            throw new SyntaxError(at.start(), "the expression nests too deeply (more than " + MAX_DEPTH
                    + " operators inside one another)");
        }
    }

    private Token expect(TokenKind kind, String message) {
        Token token = peek();
        if (token.kind() != kind) {
            throw new SyntaxError(token.start(), message + ", but found " + token.describe());
        }
        return advance();
    }

    private Token peek() {
        return tokens.get(next);
    }

    private Token peek(int ahead) {
        return tokens.get(Math.min(next + ahead, tokens.size() - 1));
    }

    private Token advance() {
        Token token = tokens.get(next);
        if (token.kind() != TokenKind.END) {
            next++;
        }
        return token;
    }
}
