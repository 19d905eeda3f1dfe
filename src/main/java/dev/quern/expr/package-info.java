/**
 * Quern's own expression language, for filters, data-quality rules and derived columns: text in, checked
 * tree out, then jOOQ for an engine or a value computed in memory. User text never reaches SQL as text.
 *
 * <p>Stages, each stopping the next when it finds a mistake:
 * <ol>
 *   <li>{@link dev.quern.expr.Expressions#parse}: a hand-written lexer and a recursive-descent parser build a
 *   syntax tree whose nodes know their place in the text. Outside single-quoted text only ASCII letters,
 *   digits, {@code _}, operators and white space are accepted, so quotes, semicolons, comments and
 *   look-alike characters stop here. The first lexical or syntax error is reported.</li>
 *   <li>{@link dev.quern.expr.Expressions#check}: names resolve in a {@link dev.quern.expr.Scope} the caller
 *   builds (columns with their {@link dev.quern.schema.ValueType} and an opaque handle, and the row's
 *   cutoff), and every node gets a type. Every type error is reported, each once. The result is a
 *   {@link dev.quern.expr.CheckedExpression}; nothing else can be rendered or evaluated.</li>
 *   <li>{@link dev.quern.expr.ExprRenderer}: a jOOQ field or condition for one
 *   {@link dev.quern.schema.Engine}. Literals are inlined by jOOQ, names become the fields the caller's
 *   function returns for their bindings. One small class per engine holds what differs.</li>
 *   <li>{@link dev.quern.expr.Evaluator}: the same value in memory, for a row of values.</li>
 * </ol>
 *
 * <p>Every diagnostic is at the recipe position of the offending token (the caller gives the position of
 * the expression's first character) and its message ends with the expression's line and a caret under
 * that token.
 *
 * <p>The language: numbers (whole and decimal), text, booleans, dates and timestamps; {@code or < and <
 * not < comparison, between, in, is null < + - < * / % < unary minus}; the functions abs, round, ln,
 * log10, exp, sqrt, coalesce, nullif, least, greatest, lower, upper, length, year, month, day_of_week
 * (ISO, Monday 1), hour and days_between. Its rules hold on every engine and in the evaluator:
 * <ul>
 *   <li>SQL's three-valued logic; every operator and function but {@code is null}, coalesce and nullif's
 *   second argument gives null for a null argument (least and greatest too, unlike PostgreSQL's).</li>
 *   <li>Division is never integer division; division and modulo by zero give null; ln, log10 of a
 *   non-positive number, sqrt of a negative one and exp of 709.78 or more give null, never an error.</li>
 *   <li>{@code %} takes whole numbers only; round's digits are a literal from 0 to 15 and it rounds half
 *   away from zero.</li>
 *   <li>A date stands for its whole day: compared with a timestamp, the timestamp's date is compared, so
 *   {@code closed_at <= cutoff} keeps everything up to the end of the cutoff day.</li>
 *   <li>Text compares by Unicode code point (SQLite's BINARY collation). On PostgreSQL and MySQL text
 *   comparisons follow the column's collation instead, and lower/upper fold only ASCII letters on SQLite.
 *   {@code like} is left out because engines disagree on letter case in it.</li>
 * </ul>
 */
package dev.quern.expr;
