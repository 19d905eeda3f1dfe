/**
 * The plan stage: resolves a recipe against the checked schema into a {@link dev.quern.plan.Plan}.
 *
 * <p>Paths become joins, measures become {@link dev.quern.plan.Aggregate}s grouped into one
 * {@link dev.quern.plan.Block} per path (one scan serves every window), lookups are grouped per table, and
 * every output column gets its name, type and data dictionary entry. Time boundaries are
 * {@link dev.quern.plan.Boundary} values computed per cutoff in Java, so calendar arithmetic is the same on
 * every engine. Mistakes that need the catalogue (unknown measure columns, wrong types, keys used as
 * features, a name defined twice) are reported here with their recipe positions. The plan holds no SQL.
 */
package dev.quern.plan;
