package dev.quern.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.constructor.SafeConstructor;

/** report.html as written by the demo build: self-contained, complete, and with drift when asked. */
class HtmlReportTest {

    private static String report(Path folder) throws IOException {
        return Files.readString(folder.resolve("report.html"));
    }

    @Test
    void everyBuildWritesASelfContainedReport() throws IOException {
        String html = report(DemoBuilds.first());

        assertTrue(html.startsWith("<!DOCTYPE html>\n<html lang=\"en\">"), html.substring(0, 40));
        for (String fetch : List.of("<link", " src=", "@import", "url(", "@font-face", "https:")) {
            assertFalse(html.contains(fetch), "nothing fetched from elsewhere: " + fetch);
        }
        // The only address is the SVG namespace, a name and never fetched.
        assertEquals(count(html, "http://www.w3.org/2000/svg"), count(html, "http:"));
        assertTrue(html.contains("@media print {"), "print styles");
    }

    @Test
    void theDictionaryTableHasEveryColumnWithItsLineage() throws IOException {
        String html = report(DemoBuilds.first());
        List<String> columns = dictionaryColumns(DemoBuilds.first());

        assertEquals(columns, all(html, "<tr data-column=\"([^\"]+)\">"));
        assertTrue(html.contains("<td class=\"lineage\">rides &gt; join rides.member_id = members.member_id &gt; "
                + "where rule: rides rows must meet distance_km / (duration_min / 60.0) &lt;= 45 (faster than any"
                + " e-bike: the bike was on a train or in a car) &gt; window 30d on rides.started_at &gt; count</td>"),
                "lineage, escaped");
        assertTrue(html.contains("<span id=\"shown\">36 of 36 columns</span>"));
    }

    @Test
    void thereIsOneChartPerFeatureAndLabelNumericOrLevels() throws IOException {
        String html = report(DemoBuilds.first());
        List<String[]> entries = dictionary(DemoBuilds.first());
        long numeric = entries.stream().filter(e -> isData(e) && isNumber(e)).count();
        long levels = entries.stream().filter(e -> isData(e) && !isNumber(e)).count();

        assertEquals(32, numeric, "31 numeric features and the label");
        assertEquals(numeric, count(html, "<svg class=\"chart numeric\""));
        assertEquals(levels, count(html, "<svg class=\"chart levels\""));
        assertTrue(html.contains("<figure class=\"chart\" data-column=\"plan\" data-kind=\"levels\">"));
    }

    @Test
    void labelBalanceHasEveryCutoffAndMarksTheUnobservedOnes() throws IOException {
        String html = report(DemoBuilds.first());
        String table = html.substring(html.indexOf("<table id=\"label-table\">"));
        table = table.substring(0, table.indexOf("</table>"));

        assertEquals(19, count(table, "<tr><td>20"));
        assertTrue(table.contains("<tr><td>2024-06-30</td><td class=\"num\">469</td><td class=\"num\">469</td>"
                + "<td class=\"num\">3.2%</td><td></td></tr>"), table);
        assertTrue(table.contains("<tr><td>2025-12-31</td><td class=\"num\">1,350</td><td class=\"num\">0</td>"
                + "<td class=\"num\"></td><td>horizon not yet observed</td></tr>"), table);
    }

    @Test
    void currentStateColumnsAreFlagged() throws IOException {
        assertTrue(report(DemoBuilds.first()).contains("from tables that keep no history: <code>home_zone</code>"
                + " (members.home_zone). Their values may have been written after the cutoff."));
    }

    @Test
    void withCompareToTheReportShowsTheDrift() throws IOException {
        String plain = report(DemoBuilds.first());
        String drifted = report(DemoBuilds.driftedFolder());

        assertFalse(plain.contains("<section id=\"drift\">"));
        assertTrue(drifted.contains("<section id=\"drift\">"));
        assertTrue(drifted.contains("<p class=\"warn\">3 findings go beyond the thresholds:</p>"), drifted);
        assertTrue(drifted.contains("<tr><td><code>plan</code></td><td class=\"num\">0.2454</td><td><span class=\"badge"
                + " moderate\">moderate shift</span></td>"));
        assertEquals(4, count(drifted, "<svg class=\"drift-chart\""), "three distance columns and plan moved");
        assertTrue(DemoBuilds.drifted().drift().isPresent());
    }

    /** The audit and the rules as audit.json and provenance.json hold them: every check and rule, in order. */
    @Test
    @SuppressWarnings("unchecked")
    void theLeakageAuditAndTheDataRulesAreReportedAsTheirFilesHaveThem() throws IOException {
        Path build = DemoBuilds.first();
        String html = report(build);
        Map<String, Object> audit = json(build.resolve("audit.json"));
        List<Map<String, Object>> checks = (List<Map<String, Object>>) audit.get("checks");
        String auditSection = section(html, "audit");

        assertTrue(auditSection.startsWith("<section id=\"audit\">\n<h2>Leakage audit</h2>\n<p><strong class=\"ok\">"
                + "Passed</strong>: "), auditSection);
        assertFalse(checks.isEmpty());
        List<String> rows = all(auditSection, "(<tr><td><code>.*</td></tr>)");
        assertEquals(checks.size(), rows.size());
        for (int i = 0; i < checks.size(); i++) {
            Map<String, Object> c = checks.get(i);
            String result = (String) c.get("result");
            assertTrue(rows.get(i).startsWith("<tr><td><code>" + c.get("check") + "</code><div class=\"where\">"
                    + Html.escape((String) c.get("title")) + "</div></td><td"), rows.get(i));
            assertTrue(rows.get(i).contains(">" + result + "</td><td>" + Html.escape((String) c.get("evidence"))
                    + "</td></tr>"), rows.get(i));
        }
        List<Map<String, Object>> findings = (List<Map<String, Object>>) audit.get("findings");
        assertEquals(findings.size(), count(auditSection, "<li"));
        for (Map<String, Object> f : findings) {
            assertTrue(auditSection.contains(Html.escape((String) f.get("summary"))), (String) f.get("summary"));
        }

        List<Map<String, Object>> rules = (List<Map<String, Object>>) json(build.resolve("provenance.json")).get("rules");
        String rulesSection = section(html, "rules");
        assertFalse(rules.isEmpty(), "the demo recipe has rules");
        List<String> ruleRows = all(rulesSection, "(<tr><td><code>.*</td></tr>)");
        assertEquals(rules.size(), ruleRows.size());
        for (int i = 0; i < rules.size(); i++) {
            Map<String, Object> r = rules.get(i);
            assertTrue(ruleRows.get(i).startsWith("<tr><td><code>" + r.get("table") + "</code></td><td>"
                    + Html.escape((String) r.get("rule")) + "</td><td class=\"num\">"
                    + Charts.count(((Number) r.get("rows_checked")).longValue()) + "</td><td class=\"num\">"
                    + Charts.count(((Number) r.get("rows_failing")).longValue()) + "</td>"), ruleRows.get(i));
            assertTrue(ruleRows.get(i).contains(">" + r.get("action") + "</td>"), ruleRows.get(i));
        }
    }

    private static String section(String html, String id) {
        String from = html.substring(html.indexOf("<section id=\"" + id + "\">"));
        return from.substring(0, from.indexOf("</section>") + "</section>".length());
    }

    @SuppressWarnings("unchecked")
    private static Map<String, Object> json(Path file) throws IOException {
        return (Map<String, Object>) new Yaml(new SafeConstructor(new LoaderOptions())).load(Files.readString(file));
    }

    @Test
    void textIsEscaped() {
        assertEquals("&lt;b title=&quot;a&#39;s&quot;&gt;x &amp; y&lt;/b&gt;",
                Html.escape("<b title=\"a's\">x & y</b>"));
    }

    private static boolean isNumber(String[] entry) {
        return entry[2].equals("integer") || entry[2].equals("decimal");
    }

    private static boolean isData(String[] entry) {
        return entry[1].equals("feature") || entry[1].equals("label");
    }

    static List<String[]> dictionary(Path folder) throws IOException {
        try (var parser = org.apache.commons.csv.CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true)
                .get().parse(Files.newBufferedReader(folder.resolve("dictionary.csv")))) {
            return parser.stream().map(r -> new String[] {r.get("column"), r.get("role"), r.get("type")}).toList();
        }
    }

    private static List<String> dictionaryColumns(Path folder) throws IOException {
        return dictionary(folder).stream().map(e -> e[0]).toList();
    }

    static long count(String text, String part) {
        long n = 0;
        for (int i = text.indexOf(part); i >= 0; i = text.indexOf(part, i + 1)) {
            n++;
        }
        return n;
    }

    private static List<String> all(String text, String regex) {
        Matcher m = Pattern.compile(regex).matcher(text);
        List<String> out = new java.util.ArrayList<>();
        while (m.find()) {
            out.add(m.group(1));
        }
        return out;
    }
}
