/**
 * The report stage: the data dictionary (CSV and Markdown) and provenance.json, rendered as text from the
 * plan, the schema facts and the run's statistics. Rendering touches no file; the build writes the text
 * through the run stage's output folder.
 */
package dev.quern.report;
