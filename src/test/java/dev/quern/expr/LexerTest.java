package dev.quern.expr;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;

class LexerTest {

    private static String kinds(String text) {
        return Lexer.tokens(text).stream().map(t -> t.kind() + "@" + t.start() + "-" + t.end())
                .collect(Collectors.joining(" "));
    }

    @Test
    void tokensKeepTheirOffsets() {
        assertEquals("NAME@0-5 DOT@5-6 NAME@6-17 GE@18-20 NUMBER@21-26 AND@27-30 NAME@31-35 EQ@36-37 TEXT@38-45 END@45-45",
                kinds("rides.distance_km >= 2.5e1 and name = 'it''s'"));
    }

    @Test
    void keywordsAreReadInAnyCase() {
        assertEquals("NOT@0-3 NAME@4-5 AND@6-9 NAME@10-11 OR@12-14 NAME@15-16 IS@17-19 NULL@20-24 END@24-24",
                kinds("NoT a AND b Or c iS NULL"));
    }

    @Test
    void everyOperatorIsRecognised() {
        assertEquals("PLUS MINUS STAR SLASH PERCENT EQ NE NE LT LE GT GE LPAREN RPAREN COMMA DOT END",
                Lexer.tokens("+ - * / % = != <> < <= > >= ( ) , .").stream().map(t -> t.kind().name())
                        .collect(Collectors.joining(" ")));
    }

    @Test
    void numbersTakeFractionsAndExponents() {
        List<Token> tokens = Lexer.tokens("3 2.5 1e3 1E-2 6.02e+23");
        assertEquals(List.of("3", "2.5", "1e3", "1E-2", "6.02e+23"),
                tokens.subList(0, 5).stream().map(Token::text).toList());
    }

    @Test
    void textLiteralsKeepEverythingBetweenTheirQuotes() {
        List<Token> tokens = Lexer.tokens("'x''; drop table t; --'");
        assertEquals(2, tokens.size());
        assertEquals("'x''; drop table t; --'", tokens.get(0).text());
    }

    @Test
    void lookAlikeLettersAreRefused() {
        SyntaxError e = assertThrows(SyntaxError.class, () -> Lexer.tokens("ｓｅｌｅｃｔ"));
        assertEquals("unexpected character 'ｓ' (U+FF53)", e.getMessage());
        assertEquals(0, e.offset());
    }

    @Test
    void unicodeSpacesAreRefused() {
        SyntaxError e = assertThrows(SyntaxError.class, () -> Lexer.tokens("a\u00A0= 1"));
        assertEquals("unexpected character U+00A0", e.getMessage());
        assertEquals(1, e.offset());
    }
}
