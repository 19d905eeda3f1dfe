/**
 * The leakage audit: the checks that no column of a modelling table can see past its cutoff.
 *
 * <p>{@link dev.quern.audit.Audit} is the entry. It runs after the matrix is written to its temporary file
 * and before the build commits any output, reading the source with queries of its own (never the compiled
 * feature query) and the matrix back from disk, and returns an {@link dev.quern.audit.AuditReport}: one
 * result per {@link dev.quern.audit.Check}, with its evidence, and the {@link dev.quern.audit.Finding}s, each
 * {@link dev.quern.audit.Severity#BLOCKING blocking}, a warning or a note. A blocking finding the recipe does
 * not acknowledge stops the build: it writes audit.json and audit.md and no matrix. docs/audit.md says what
 * each check means.
 */
package dev.quern.audit;
