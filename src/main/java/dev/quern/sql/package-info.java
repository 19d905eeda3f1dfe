/**
 * The sql stage: renders a plan as one query for its engine through jOOQ.
 *
 * <p>{@link dev.quern.sql.SqlCompiler} is the entry. Identifiers are always jOOQ names (quoted where the
 * engine needs it) and values are inlined literals: recipe text never reaches SQL as text. What jOOQ cannot
 * decide for an engine lives in one small class per engine ({@code EngineSql} and its subclasses), each
 * choice commented with the engine fact behind it.
 */
package dev.quern.sql;
