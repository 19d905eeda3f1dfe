package dev.quern.expr;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.quern.Diagnostic;
import dev.quern.Diagnostics;
import dev.quern.Position;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class ParserTest {

    private static final Position AT = new Position("r.yaml", 3, 10);

    private static String grouped(String text) {
        return SyntaxPrinter.print(Parser.parse(text));
    }

    /** The one diagnostic parsing {@code text} gives, rendered as the user sees it. */
    private static String error(String text) {
        Diagnostics out = new Diagnostics();
        assertEquals(java.util.Optional.empty(), Expressions.parse(text, AT, out));
        List<Diagnostic> all = out.all();
        assertEquals(1, all.size(), () -> "diagnostics: " + all);
        return all.get(0).render();
    }

    @ParameterizedTest
    @CsvSource(delimiter = '|', quoteCharacter = '"', textBlock = """
            a or b and c                      | (a or (b and c))
            a and b or c                      | ((a and b) or c)
            a or b or c                       | ((a or b) or c)
            not a and b                       | ((not a) and b)
            not a = b                         | (not (a = b))
            not not a                         | (not (not a))
            a + b * c                         | (a + (b * c))
            a * b + c                         | ((a * b) + c)
            a - b - c                         | ((a - b) - c)
            a / b * c % d                     | (((a / b) * c) % d)
            -a * b                            | ((-a) * b)
            - - a                             | (-(-a))
            -2 * 3                            | (-2 * 3)
            a - -2                            | (a - -2)
            a + b < c * d                     | ((a + b) < (c * d))
            a = b and c <> d or e >= f        | (((a = b) and (c <> d)) or (e >= f))
            (a or b) and c                    | ((a or b) and c)
            a * (b + c)                       | (a * (b + c))
            x between 1 + 1 and 2 * 3 and y   | ((x between (1 + 1) and (2 * 3)) and y)
            x not between 1 and 2             | (x not between 1 and 2)
            x not in (1, 2 + 3) or x is not null | ((x not in (1, (2 + 3))) or (x is not null))
            not x in (1) and y is null        | ((not (x in (1))) and (y is null))
            A AND NOT B OR C                  | ((a and (not b)) or c)
            rides.distance_km / nullif(rides.duration_min, 0) | (rides.distance_km / nullif(rides.duration_min, 0))
            ROUND(x, 2) + Day_Of_Week(t)      | (round(x, 2) + day_of_week(t))
            date '2025-03-31' <= cutoff       | (date 2025-03-31 <= cutoff)
            timestamp '2025-03-31 12:00' < t  | (timestamp 2025-03-31T12:00 < t)
            t.in = 1                          | (t.in = 1)
            'it''s' = name                    | ('it''s' = name)
            -9223372036854775808              | -9223372036854775808
            1e3 + 2.5                         | (1000.0 + 2.5)
            """)
    void operatorsGroupByPrecedenceAndToTheLeft(String text, String expected) {
        assertEquals(expected, grouped(text).replace("A", "a").replace("B", "b").replace("C", "c"));
    }

    @Test
    void aMinusBeforeANumberIsPartOfTheNumber() {
        assertEquals(new Syntax.NumberLiteral(-2L, 0, 3), Parser.parse("- 2"));
        assertEquals(new Syntax.NumberLiteral(-0.5, 0, 4), Parser.parse("-0.5"));
    }

    @Test
    void nodesKnowWhereTheyStand() {
        Syntax.Binary or = (Syntax.Binary) Parser.parse("(a + 1) * 2 > 3 or b");
        assertEquals(16, or.at());
        Syntax.Binary greater = (Syntax.Binary) or.left();
        assertEquals(0, greater.start());
        assertEquals(15, greater.end());
        Syntax.Binary times = (Syntax.Binary) greater.left();
        assertEquals(8, times.at());
        assertEquals(new Syntax.Group(times.left().children().get(0), 0, 7), times.left());
    }

    @Test
    void namesAreListedWithTheirPositions() {
        Diagnostics out = new Diagnostics();
        ParsedExpression parsed = Expressions.parse("a + rides.b > coalesce(a, 1)", AT, out).orElseThrow();
        assertEquals(List.of(
                new NameUse(java.util.Optional.empty(), "a", new Position("r.yaml", 3, 10)),
                new NameUse(java.util.Optional.of("rides"), "b", new Position("r.yaml", 3, 14)),
                new NameUse(java.util.Optional.empty(), "a", new Position("r.yaml", 3, 33))), parsed.names());
    }

    @Test
    void anUnexpectedCharacterIsShownWithACaret() {
        assertEquals("""
                r.yaml:3:21: unexpected character ';'
                distance_km; drop table t
                           ^""", error("distance_km; drop table t"));
    }

    @Test
    void doubleQuotesAreRefusedWithTheWayToWriteText() {
        assertEquals("""
                r.yaml:3:17: names are written without quotes, and text in single quotes ('like this'); " is not allowed
                name = "a; drop"
                       ^""", error("name = \"a; drop\""));
    }

    @Test
    void commentsAreRefused() {
        assertEquals("""
                r.yaml:3:12: comments are not allowed in expressions (to subtract a negative value, write '- -')
                a -- drop
                  ^""", error("a -- drop"));
        assertEquals("""
                r.yaml:3:12: comments are not allowed in expressions
                a /* x */
                  ^""", error("a /* x */"));
    }

    @Test
    void unclosedTextPointsAtItsOpeningQuote() {
        assertEquals("""
                r.yaml:3:14: this text has no closing quote (')
                a = 'it''s
                    ^""", error("a = 'it''s"));
    }

    @Test
    void controlCharactersInTextAreRefused() {
        assertEquals("r.yaml:3:12: text cannot hold the control character U+0000\n'a\u0000b'\n  ^",
                error("'a\u0000b'"));
    }

    @Test
    void lookAlikeLettersAreNotNames() {
        assertEquals("""
                r.yaml:3:10: unexpected character 'ｓ' (U+FF53)
                ｓｅｌｅｃｔ = 1
                ^""", error("ｓｅｌｅｃｔ = 1"));
    }

    @Test
    void malformedNumbersAreNamed() {
        assertEquals("""
                r.yaml:3:11: a number needs digits after the decimal point
                1. + 2
                 ^""", error("1. + 2"));
        assertEquals("""
                r.yaml:3:14: '3abc' is neither a number nor a name (names start with a letter or _)
                a + 3abc
                    ^""", error("a + 3abc"));
        assertEquals("""
                r.yaml:3:10: '1e' is neither a number nor a name (names start with a letter or _)
                1e
                ^""", error("1e"));
        assertEquals("""
                r.yaml:3:14: write a digit before the decimal point, like 0.5
                a * .5
                    ^""", error("a * .5"));
        assertEquals("""
                r.yaml:3:10: the number 99999999999999999999 is too large for a whole number (the largest is 9223372036854775807)
                99999999999999999999
                ^""", error("99999999999999999999"));
        assertEquals("""
                r.yaml:3:10: the number 1e999 is too large
                1e999
                ^""", error("1e999"));
    }

    @Test
    void operatorsFromOtherLanguagesAreCorrected() {
        assertEquals("""
                r.yaml:3:12: '==' is not an operator; write '='
                a == b
                  ^""", error("a == b"));
        assertEquals("""
                r.yaml:3:10: '!' is not an operator; write 'not'
                !a
                ^""", error("!a"));
    }

    @Test
    void anEmptyExpressionIsReported() {
        assertEquals("r.yaml:3:10: the expression is empty\n   \n^", error("   "));
    }

    @Test
    void aMissingOperandNamesTheOperatorBeforeIt() {
        assertEquals("""
                r.yaml:3:13: expected a value after '+', but found the end of the expression
                a +
                   ^""", error("a +"));
        assertEquals("""
                r.yaml:3:10: expected a value, but found '*'
                * a
                ^""", error("* a"));
        assertEquals("""
                r.yaml:3:14: expected a value after '=', but found 'not' (put 'not ...' in parentheses)
                a = not b
                    ^""", error("a = not b"));
    }

    @Test
    void parenthesesMustBalance() {
        assertEquals("""
                r.yaml:3:16: expected ')' to close the '(', but found the end of the expression
                (a + b
                      ^""", error("(a + b"));
        assertEquals("""
                r.yaml:3:15: ')' has no matching '('
                a + b)
                     ^""", error("a + b)"));
    }

    @Test
    void twoValuesWithoutAnOperatorAreReported() {
        assertEquals("""
                r.yaml:3:12: expected an operator or the end of the expression, but found 'b'
                a b
                  ^""", error("a b"));
        assertEquals("""
                r.yaml:3:21: expected an operator or the end of the expression, but found 'union'
                name = 'x' union select secret from sentinel
                           ^""", error("name = 'x' union select secret from sentinel"));
    }

    @Test
    void comparisonsDoNotChain() {
        assertEquals("""
                r.yaml:3:16: comparisons cannot be chained; join them with 'and'
                a < b < c
                      ^""", error("a < b < c"));
        assertEquals("""
                r.yaml:3:28: comparisons cannot be chained; join them with 'and'
                a between 1 and 2 = true
                                  ^""", error("a between 1 and 2 = true"));
    }

    @Test
    void isNotAndBetweenAndInSayWhatTheyExpect() {
        assertEquals("""
                r.yaml:3:15: expected 'null' or 'not null' after 'is', but found 'b'
                a is b
                     ^""", error("a is b"));
        assertEquals("""
                r.yaml:3:16: expected 'in' or 'between' after 'not', but found 'b'
                a not b
                      ^""", error("a not b"));
        assertEquals("""
                r.yaml:3:22: expected 'and' between the two bounds of 'between', but found 'or'
                a between 1 or 2
                            ^""", error("a between 1 or 2"));
        assertEquals("""
                r.yaml:3:15: expected '(' after 'in', but found '1'
                a in 1, 2
                     ^""", error("a in 1, 2"));
        assertEquals("""
                r.yaml:3:16: 'in' needs at least one value between the parentheses
                a in ()
                      ^""", error("a in ()"));
        assertEquals("""
                r.yaml:3:18: expected ',' or ')' in the list of 'in', but found '2'
                a in (1 2)
                        ^""", error("a in (1 2)"));
    }

    @Test
    void functionArgumentsNeedCommas() {
        assertEquals("""
                r.yaml:3:18: expected ',' or ')' in the arguments of round, but found '2'
                ROUND(x 2)
                        ^""", error("ROUND(x 2)"));
    }

    @Test
    void qualifiedNamesAreWrittenTogether() {
        assertEquals("""
                r.yaml:3:16: expected a column name after 'rides.', but found the end of the expression
                rides.
                      ^""", error("rides."));
        assertEquals("""
                r.yaml:3:16: write a qualified name without spaces, like rides.x
                rides . x
                      ^""", error("rides . x"));
    }

    @Test
    void dateAndTimestampLiteralsMustBeValid() {
        assertEquals("""
                r.yaml:3:15: '2025-02-30' is not a date; write date 'YYYY-MM-DD'
                date '2025-02-30'
                     ^""", error("date '2025-02-30'"));
        assertEquals("""
                r.yaml:3:20: '2025-03-31' is not a timestamp; write timestamp 'YYYY-MM-DD HH:MM:SS'
                timestamp '2025-03-31'
                          ^""", error("timestamp '2025-03-31'"));
    }

    @Test
    void likeIsRefusedWithTheReason() {
        assertEquals("""
                r.yaml:3:15: 'like' is not supported: engines disagree on whether it tells upper from lower case
                name like 'a%'
                     ^""", error("name like 'a%'"));
    }

    @Test
    void hostileNestingStopsBeforeTheStackDoes() {
        String deep = "(".repeat(101) + "1" + ")".repeat(101);
        assertEquals("r.yaml:3:110: the expression nests too deeply (more than 100 operators inside one another)\n"
                + deep + "\n" + " ".repeat(100) + "^", error(deep));
        String longChain = "1" + " + 1".repeat(150);
        assertEquals("r.yaml:3:412: the expression nests too deeply (more than 100 operators inside one another)",
                error(longChain).lines().findFirst().orElseThrow());
    }

    @Test
    void laterLinesOfAMultiLineExpressionCountTheirOwnLines() {
        assertEquals("""
                r.yaml:4:3: expected a value after '+', but found '*'
                  * b
                  ^""", error("a +\n  * b"));
    }

    @Test
    void withoutAPositionOnlyTheMessageAndCaretAreShown() {
        Diagnostics out = new Diagnostics();
        Expressions.parse("a +", Position.NONE, out);
        assertEquals("expected a value after '+', but found the end of the expression\na +\n   ^",
                out.all().get(0).render());
    }

    @Test
    void tabsStayTabsInTheCaretLine() {
        assertEquals("r.yaml:3:12: unexpected character ';'\na\t;\n \t^", error("a\t;"));
    }
}
