/**
 * The encode stage: turns the run stage's raw matrix into model-ready numbers, between the run and the
 * reports.
 *
 * <p>{@link dev.quern.encode.Encoder#plan} checks the recipe's {@code encode} and {@code split} against the
 * plan's output columns (kinds, options, chains, types, no key, cutoff or label, a gap of at least the label
 * horizon between training and test). {@link dev.quern.encode.Encoder#build} has the raw matrix written to a
 * scratch file, fits every encoding on the training cutoffs' rows in streaming passes over it (or takes the
 * frozen {@link dev.quern.encode.Fitted} of an earlier build), then writes {@code matrix.csv} in one more
 * streaming pass, and {@code fitted.json}. Target means are fitted out of time: a row is encoded only from
 * training rows whose label horizon had ended by its cutoff. Column names of encoded columns are given
 * once, when fitted, and read back from {@code fitted.json} by scoring runs, so their columns never change.
 */
package dev.quern.encode;
