/**
 * The report stage: the data dictionary (CSV and Markdown), provenance.json, each column's lineage
 * ({@link dev.quern.report.Lineage}) and report.html ({@link dev.quern.report.HtmlReport}), rendered as text
 * from the plan, the schema facts and the run's statistics; and the comparison of two builds
 * ({@link dev.quern.report.Compare}) with the Population Stability Index per column. Rendering touches no
 * file; the build writes the text through the run stage's output folder. Compare reads build folders and
 * streams their matrices.
 */
package dev.quern.report;
