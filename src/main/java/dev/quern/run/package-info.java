/**
 * The run stage: executes a compiled query on a read-only connection and streams its rows to files.
 *
 * <p>{@link dev.quern.run.MatrixWriter} writes rows as they arrive, keeping only running
 * {@link dev.quern.run.ColumnStats}, so memory stays flat whatever the row count.
 * {@link dev.quern.run.OutputFolder} writes every output to a temporary file and renames them into place
 * only when all are complete: a failed build leaves no half-written output.
 */
package dev.quern.run;
