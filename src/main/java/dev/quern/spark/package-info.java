/**
 * Spark SQL as a source: the one package whose classes touch Spark types. Spark is a provided dependency
 * (the cluster's spark-submit brings it), so nothing outside this package may name a Spark class, and
 * {@code schema.Source} enters here only for a {@code spark:} source, catching the missing class when Spark
 * is not on the class path.
 *
 * <p>{@link dev.quern.spark.SparkSources} registers a recipe's tables as temporary views of a session of its
 * own; {@link dev.quern.spark.SparkConnection} shows that session to the rest of Quern as a read-only
 * {@code java.sql.Connection}, so that the schema, rules, matrix and audit stages run unchanged;
 * {@link dev.quern.spark.SparkMatrix} writes the matrix as Parquet with Spark's own writer.
 */
package dev.quern.spark;
