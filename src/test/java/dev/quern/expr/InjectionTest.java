package dev.quern.expr;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Diagnostic;
import dev.quern.Diagnostics;
import dev.quern.Position;
import dev.quern.schema.Engine;
import dev.quern.schema.ValueType;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import org.jooq.Field;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * Hostile expressions against a real SQLite database that holds a sentinel table: what the lexer lets
 * through stays data, what it refuses never becomes SQL, and after every query the sentinel is intact and
 * the rows returned are exactly those the literal describes.
 */
class InjectionTest {

    /** A column whose catalogue name is itself hostile; the recipe calls it {@code weird}. */
    private static final String WEIRD = "weird\"; drop table sentinel; --";

    private static final String DROP = "x'; drop table sentinel; --";
    private static final String UNION = "a' union select secret from sentinel --";
    private static final String BACKSLASH = "back\\' or 1=1 --";

    private static final Scope SCOPE = Scope.builder()
            .column("t", "id", ValueType.INTEGER, "id")
            .column("t", "name", ValueType.TEXT, "name")
            .column("t", "weird", ValueType.TEXT, WEIRD)
            .build();

    private InMemorySqlite db;

    @BeforeEach
    void fill() {
        db = InMemorySqlite.open().execute(
                "create table sentinel (secret text)",
                "insert into sentinel values ('untouched')",
                "create table t (id integer primary key, name text, \"weird\"\"; drop table sentinel; --\" text)");
        db.insert("t", List.of(
                Arrays.asList(1, "alice", "w1"),
                Arrays.asList(2, DROP, "w2"),
                Arrays.asList(3, UNION, "w3"),
                Arrays.asList(4, "ｓｅｌｅｃｔ", "w4"),
                Arrays.asList(5, BACKSLASH, "w5"),
                Arrays.asList(6, "bob", null)));
    }

    @AfterEach
    void sentinelIsUntouched() {
        assertEquals(List.of("sentinel", "t"), db.sql().fetchValues(
                "select name from sqlite_master where type = 'table' order by name"));
        assertEquals(List.of("untouched"), db.sql().fetchValues("select secret from sentinel"));
        assertEquals(6, db.sql().fetchValue("select count(*) from t", Integer.class));
        db.close();
    }

    private static Field<?> column(Binding binding) {
        return DSL.field(DSL.name("t", (String) binding.handle()));
    }

    private static CheckedExpression compile(String text, Expect expect) {
        Diagnostics out = new Diagnostics();
        return Expressions.compile(text, Position.NONE, SCOPE, expect, out)
                .orElseThrow(() -> new AssertionError(out.all()));
    }

    private List<Integer> idsWhere(String condition) {
        var where = ExprRenderer.forEngine(Engine.SQLITE).condition(compile(condition, Expect.CONDITION),
                InjectionTest::column);
        return db.sql().select(DSL.field(DSL.name("t", "id"), Integer.class)).from(DSL.table(DSL.name("t")))
                .where(where).orderBy(DSL.field(DSL.name("t", "id"))).fetch().getValues(0, Integer.class);
    }

    private Object valueOnFirstRow(String expression) {
        Field<Object> value = ExprRenderer.forEngine(Engine.SQLITE).field(compile(expression, Expect.VALUE),
                InjectionTest::column);
        return db.sql().select(value).from(DSL.table(DSL.name("t")))
                .where(DSL.field(DSL.name("t", "id")).eq(DSL.inline(1))).fetchOne(0);
    }

    @Test
    void aQuoteInATextLiteralIsData() {
        assertEquals(List.of(2), idsWhere("name = 'x''; drop table sentinel; --'"));
        assertEquals(DROP, valueOnFirstRow("'x''; drop table sentinel; --'"));
    }

    @Test
    void unionSelectInATextLiteralIsData() {
        assertEquals(List.of(3), idsWhere("name = 'a'' union select secret from sentinel --'"));
        assertEquals(List.of(6), idsWhere("name in ('x''); delete from sentinel; --', 'bob')"));
        assertEquals("A' UNION SELECT SECRET FROM SENTINEL --", valueOnFirstRow("upper('a'' union select secret from sentinel --')"));
    }

    @Test
    void lookAlikeLettersInATextLiteralAreData() {
        assertEquals(List.of(4), idsWhere("name = 'ｓｅｌｅｃｔ'"));
        assertEquals(List.of(), idsWhere("name = 'select'"));
    }

    /** MySQL reads a backslash as an escape inside literals: jOOQ doubles it there, and nowhere else. */
    @Test
    void aBackslashInATextLiteralIsData() {
        assertEquals(List.of(5), idsWhere("name = 'back\\'' or 1=1 --'"));
        CheckedExpression literal = compile("'back\\'' or 1=1 --'", Expect.VALUE);
        assertEquals("'back\\'' or 1=1 --'", Engine.SQLITE.sql().render(
                ExprRenderer.forEngine(Engine.SQLITE).field(literal, InjectionTest::column)));
        assertEquals("'back\\\\'' or 1=1 --'", Engine.MYSQL.sql().render(
                ExprRenderer.forEngine(Engine.MYSQL).field(literal, InjectionTest::column)));
        assertEquals("'back\\'' or 1=1 --'", Engine.POSTGRES.sql().render(
                ExprRenderer.forEngine(Engine.POSTGRES).field(literal, InjectionTest::column)));
    }

    @Test
    void aHostileColumnNameFromTheCatalogueStaysOneQuotedIdentifier() {
        assertEquals(List.of(2), idsWhere("weird = 'w2'"));
        assertEquals(List.of(6), idsWhere("weird is null"));
    }

    /** As deep as the parser allows, the SQL still renders and runs: no stack or SQLite depth limit is hit. */
    @Test
    void theDeepestAcceptedExpressionRunsOnSqlite() {
        String deep = "ln(".repeat(40) + "(id" + " / 1 * 1".repeat(29) + ")" + ")".repeat(40) + " is null";
        assertEquals(List.of(1, 2, 3, 4, 5, 6), idsWhere(deep));
    }

    /** None of these produce any SQL: each stops at the lexer, the parser or the scope. */
    @Test
    void hostileTextOutsideLiteralsIsRefusedBeforeAnySql() {
        assertRefused("name = \"a; drop\"",
                "names are written without quotes, and text in single quotes ('like this'); \" is not allowed");
        assertRefused("id = 1; drop table sentinel", "unexpected character ';'");
        assertRefused("name = 'x' ; delete from sentinel", "unexpected character ';'");
        assertRefused("id = 1 -- and everything after",
                "comments are not allowed in expressions (to subtract a negative value, write '- -')");
        assertRefused("id = 1 /* c */", "comments are not allowed in expressions");
        assertRefused("id = 1 union select secret from sentinel",
                "expected an operator or the end of the expression, but found 'union'");
        assertRefused("id = 1)) or (1 = 1", "')' has no matching '('");
        assertRefused("id = 1)); drop table sentinel; --", "unexpected character ';'");
        assertRefused("ｓｅｌｅｃｔ = 1", "unexpected character 'ｓ' (U+FF53)");
        assertRefused("id = 1 ； drop table sentinel", "unexpected character '；' (U+FF1B)");
        assertRefused("id = 1 \u037E drop table sentinel", "unexpected character '\u037E' (U+037E)");
        assertRefused("id\u200B= 1", "unexpected character U+200B");
        assertRefused("`id` = 1",
                "names are written without quotes, and text in single quotes ('like this'); ` is not allowed");
        assertRefused("sentinel.secret = 'untouched'", "unknown table 'sentinel'");
        assertRefused("drop = 1", "unknown column 'drop'");
        assertRefused("name = 'x' or exec('drop table sentinel')", "unknown function 'exec'");
    }

    private static void assertRefused(String text, String message) {
        Diagnostics out = new Diagnostics();
        Optional<CheckedExpression> checked = Expressions.compile(text, Position.NONE, SCOPE, Expect.CONDITION, out);
        assertTrue(checked.isEmpty(), text);
        List<String> messages = out.all().stream().map(Diagnostic::message).map(m -> m.lines().findFirst().orElseThrow())
                .toList();
        assertEquals(List.of(message), messages, text);
    }
}
