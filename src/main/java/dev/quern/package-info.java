/**
 * Quern compiles a feature recipe into SQL, runs it read-only against the user's database and writes a
 * point-in-time modelling table with its data dictionary and provenance.
 *
 * <p>{@link dev.quern.Quern} is the API; each stage is a package of its own and hands immutable values to
 * the next: {@code recipe} (YAML to a {@code Recipe}), {@code schema} (the recipe against the source's
 * catalogue), {@code plan} (the logical plan), {@code sql} (the plan rendered for an engine), {@code run}
 * (the query executed and streamed to files) and {@code report} (dictionary and provenance). Failures the
 * user can act on are {@link dev.quern.QuernException}s carrying every {@link dev.quern.Diagnostic} of the
 * stage that found them.
 */
package dev.quern;
