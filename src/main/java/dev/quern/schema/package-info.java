/**
 * The schema stage: opens the source read-only and checks a recipe against its catalogue.
 *
 * <p>In: a {@code Recipe} and a connection from {@link dev.quern.schema.Source}. Out: a
 * {@link dev.quern.schema.SourceSchema} with the tables the recipe declares, how each time column keeps its
 * values and the dates it spans. Every declared table and column is checked before any feature data is
 * read; all mistakes are reported together (exit 65). Data that cannot be used as it is (times that are not
 * ISO dates, keys that repeat) stops the build with examples (exit 66). Nothing is ever written to the
 * source.
 */
package dev.quern.schema;
