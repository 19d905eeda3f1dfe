/**
 * The {@code quern} command line: one picocli command per class, each a thin shell over
 * {@link dev.quern.Quern} and the report stage. {@link dev.quern.cli.Main#report} is the one place where
 * failures become messages and exit codes: 0 ok, 2 usage, 65 recipe or schema, 66 source or data, 67 the
 * leakage audit blocked the build, 70 internal, 73 output; {@code quern compare} exits 3 when a change goes
 * beyond its thresholds.
 */
package dev.quern.cli;
