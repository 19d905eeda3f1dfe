package dev.quern.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.cli.Main;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.io.Writer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.OptionalLong;
import java.util.function.IntFunction;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.constructor.SafeConstructor;

/** Two builds side by side: columns, rows per cutoff, empty shares, PSI, provenance, and the exit code. */
class CompareTest {

    @TempDir
    Path folder;

    private final StringWriter out = new StringWriter();
    private final StringWriter err = new StringWriter();

    private int quern(String... args) {
        return Main.run(new PrintWriter(out, true), new PrintWriter(err, true), args);
    }

    /** A build folder written by hand: columns as name:role:type, then rows per cutoff. */
    private Path build(String name, List<String> columns, Map<String, Integer> rowsPerCutoff,
                       IntFunction<List<String>> featureValues, String recipeHash) throws IOException {
        Path dir = folder.resolve(name);
        Files.createDirectories(dir);
        List<String> names = new ArrayList<>(List.of("id", "cutoff"));
        StringBuilder dictionary = new StringBuilder("column,role,type,meaning\n")
                .append("id,key,integer,k\ncutoff,cutoff,date,c\n");
        for (String c : columns) {
            String[] p = c.split(":");
            names.add(p[0]);
            dictionary.append(p[0]).append(',').append(p[1]).append(',').append(p[2]).append(",m\n");
        }
        Files.writeString(dir.resolve("dictionary.csv"), dictionary);
        try (Writer w = Files.newBufferedWriter(dir.resolve("matrix.csv"))) {
            w.write(String.join(",", names) + "\n");
            int row = 0;
            for (Map.Entry<String, Integer> e : rowsPerCutoff.entrySet()) {
                for (int i = 0; i < e.getValue(); i++, row++) {
                    w.write(i + "," + e.getKey() + "," + String.join(",", featureValues.apply(row)) + "\n");
                }
            }
        }
        Files.writeString(dir.resolve("provenance.json"), """
                {
                  "quern_version": "0.1.0",
                  "built_at": "%s",
                  "recipe": {"name": "r", "file": "r.yaml", "sha256": "%s"},
                  "source": {
                    "url": "jdbc:sqlite:club.sqlite",
                    "time_columns": [
                      {"column": "rides.started_at", "rows": 10, "latest": "%s"}
                    ]
                  },
                  "timings": {"query_ms": %d}
                }
                """.formatted(name.hashCode() % 2 == 0 ? "2026-01-01T00:00:00Z" : "2026-02-01T00:00:00Z",
                recipeHash, recipeHash.equals("aaa") ? "2025-12-31" : "2026-01-31", name.length()));
        return dir;
    }

    private static Map<String, Integer> cutoffs(int... rows) {
        Map<String, Integer> m = new java.util.LinkedHashMap<>();
        for (int i = 0; i < rows.length; i++) {
            m.put("2025-0" + (i + 1) + "-28", rows[i]);
        }
        return m;
    }

    @Test
    void aBuildComparedWithItselfHasNothingToReport() throws IOException {
        Path a = build("a", List.of("x:feature:integer", "plan:feature:text", "y:label:integer"), cutoffs(500, 500),
                row -> List.of(Integer.toString(row % 37), row % 3 == 0 ? "basic" : "plus", Integer.toString(row % 2)),
                "aaa");

        assertEquals(0, quern("compare", a.toString(), a.toString()), err.toString());

        assertTrue(out.toString().contains("""
                Provenance
                  recipe and source fingerprints are the same

                Columns
                  the same columns with the same types

                Rows per cutoff
                  2 cutoffs have the same rows in both builds
                """), out.toString());
        assertTrue(out.toString().endsWith("Nothing goes beyond the thresholds.\n"), out.toString());
        Comparison c = Compare.folders(a, a);
        assertEquals(List.of("x", "plan", "y"), c.drift().stream().map(Comparison.ColumnDrift::column).toList());
        c.drift().forEach(d -> assertEquals(0.0, d.psi(), 0.0, d.column()));
    }

    @Test
    void psiUsesTheDecilesOfTheOldValuesAndCountsEveryRowExactly() throws IOException {
        // Old values 1..1000, new values 301..1300: old deciles 100, 200, ..., 900.
        Path old = build("old", List.of("x:feature:decimal"), cutoffs(1000),
                row -> List.of(Integer.toString(row + 1)), "aaa");
        Path now = build("new", List.of("x:feature:decimal"), cutoffs(1000),
                row -> List.of(Integer.toString(row + 301)), "aaa");

        Comparison.ColumnDrift x = Compare.folders(old, now).drift().get(0);

        assertEquals(List.of(
                new Comparison.Bin("(empty)", 0, 0), new Comparison.Bin("<= 100", 100, 0),
                new Comparison.Bin("(100, 200]", 100, 0), new Comparison.Bin("(200, 300]", 100, 0),
                new Comparison.Bin("(300, 400]", 100, 100), new Comparison.Bin("(400, 500]", 100, 100),
                new Comparison.Bin("(500, 600]", 100, 100), new Comparison.Bin("(600, 700]", 100, 100),
                new Comparison.Bin("(700, 800]", 100, 100), new Comparison.Bin("(800, 900]", 100, 100),
                new Comparison.Bin("> 900", 100, 400)), x.bins());
        // By the formula, with the empty-bin rule: three bins emptied (share 0.0001 each) and the top bin
        // holds 0.4 instead of 0.1.
        double expected = 3 * (0.0001 - 0.1) * Math.log(0.0001 / 0.1) + (0.4 - 0.1) * Math.log(0.4 / 0.1);
        assertEquals(expected, x.psi(), 1e-12);
        assertEquals(Psi.Reading.LARGE, x.reading());
    }

    @Test
    void textLevelsKeepTheirBinsAndNewLevelsGoToTheRareBin() throws IOException {
        Path old = build("old", List.of("plan:feature:text"), cutoffs(1000),
                row -> List.of(row < 600 ? "basic" : row < 995 ? "plus" : "trial"), "aaa");
        Path now = build("new", List.of("plan:feature:text"), cutoffs(1000),
                row -> List.of(row < 500 ? "basic" : row < 900 ? "plus" : "family"), "aaa");

        Comparison.ColumnDrift plan = Compare.folders(old, now).drift().get(0);

        assertEquals(List.of(new Comparison.Bin("(empty)", 0, 0), new Comparison.Bin("basic", 600, 500),
                new Comparison.Bin("plus", 395, 400), new Comparison.Bin("(rare or new levels)", 5, 100)), plan.bins());
        double expected = (0.5 - 0.6) * Math.log(0.5 / 0.6) + (0.4 - 0.395) * Math.log(0.4 / 0.395)
                + (0.1 - 0.005) * Math.log(0.1 / 0.005);
        assertEquals(expected, plan.psi(), 1e-12);
    }

    @Test
    void columnsAddedRemovedOrRetypedAreFindingsUnlessAllowed() throws IOException {
        Path old = build("old", List.of("x:feature:integer", "gone:feature:text", "z:feature:integer"), cutoffs(10),
                row -> List.of("1", "a", "2"), "aaa");
        Path now = build("new", List.of("x:feature:decimal", "z:feature:integer", "fresh:feature:text"), cutoffs(10),
                row -> List.of("1.5", "2", "b"), "aaa");

        Comparison c = Compare.folders(old, now);

        assertEquals(List.of(
                new Comparison.ColumnChange("x", Comparison.Change.RETYPED, "integer", "decimal"),
                new Comparison.ColumnChange("gone", Comparison.Change.REMOVED, "text", ""),
                new Comparison.ColumnChange("fresh", Comparison.Change.ADDED, "", "text")), c.columnChanges());
        assertEquals(List.of("x", "z"), c.drift().stream().map(Comparison.ColumnDrift::column).toList(),
                "PSI for columns both builds have, numbers against numbers");
        Thresholds lenient = new Thresholds(100, 1, 1, false);
        assertEquals(List.of("x: retyped from integer to decimal", "gone: removed (was text)"), c.findings(lenient));
        assertEquals(List.of(), c.findings(new Thresholds(100, 1, 1, true)));
    }

    @Test
    void rowsAreComparedAtTheCutoffsBothBuildsHave() throws IOException {
        Path old = build("old", List.of("x:feature:integer"), cutoffs(100, 100), row -> List.of("1"), "aaa");
        Path now = build("new", List.of("x:feature:integer"), cutoffs(100, 80, 50), row -> List.of("1"), "aaa");

        Comparison c = Compare.folders(old, now);

        assertEquals(List.of(
                new Comparison.CutoffRows("2025-01-28", OptionalLong.of(100), OptionalLong.of(100)),
                new Comparison.CutoffRows("2025-02-28", OptionalLong.of(100), OptionalLong.of(80)),
                new Comparison.CutoffRows("2025-03-28", OptionalLong.empty(), OptionalLong.of(50))), c.rows());
        assertEquals(List.of("cutoff 2025-02-28: 100 -> 80 rows (-20.0%, beyond 10.0%)"),
                c.findings(Thresholds.DEFAULT));
        assertEquals(List.of(), c.findings(new Thresholds(0.25, 0.1, 0.25, false)));
    }

    @Test
    void aChangeInTheShareOfEmptyValuesIsAFindingAndDrift() throws IOException {
        Path old = build("old", List.of("x:feature:integer"), cutoffs(100),
                row -> List.of(Integer.toString(row % 5)), "aaa");
        Path now = build("new", List.of("x:feature:integer"), cutoffs(100),
                row -> List.of(row % 5 == 0 ? "" : Integer.toString(row % 5)), "aaa");

        Comparison.ColumnDrift x = Compare.folders(old, now).drift().get(0);

        assertEquals(0.0, x.oldEmptyShare());
        assertEquals(0.2, x.newEmptyShare(), 1e-12);
        assertEquals(new Comparison.Bin("(empty)", 0, 20), x.bins().get(0));
        // The value 0 became empty: its share moved from the "<= 0" bin to the empty bin.
        double expected = 2 * (0.2 - 0.0001) * Math.log(0.2 / 0.0001);
        assertEquals(expected, x.psi(), 1e-12);
        assertEquals(List.of("x: PSI 3.0388 above 0.2500 (large shift)",
                "x: empty share 0.0000 -> 0.2000 (change 0.2000 above 0.1000)"),
                Compare.folders(old, now).findings(Thresholds.DEFAULT));
    }

    @Test
    void provenanceDifferencesLeaveOutBuildTimesAndTimings() throws IOException {
        Path old = build("old", List.of("x:feature:integer"), cutoffs(10), row -> List.of("1"), "aaa");
        Path now = build("newer", List.of("x:feature:integer"), cutoffs(10), row -> List.of("1"), "bbb");

        assertEquals(List.of(new Comparison.ProvenanceChange("recipe.sha256", "aaa", "bbb"),
                new Comparison.ProvenanceChange("source.time_columns[rides.started_at].latest", "2025-12-31",
                        "2026-01-31")),
                Compare.folders(old, now).provenance());
    }

    @Test
    @SuppressWarnings("unchecked")
    void theCommandExitsThreeBeyondTheThresholdsAndTheFlagsMoveThem() throws IOException {
        Path old = build("old", List.of("x:feature:decimal"), cutoffs(1000),
                row -> List.of(Integer.toString(row + 1)), "aaa");
        Path now = build("new", List.of("x:feature:decimal"), cutoffs(1000),
                row -> List.of(Integer.toString(row + 301)), "aaa");

        assertEquals(3, quern("compare", old.toString(), now.toString()));
        assertTrue(out.toString().contains("1 finding goes beyond the thresholds:\n  x: PSI 2.4861 above 0.2500"
                + " (large shift)\n"), out.toString());
        assertEquals(0, quern("compare", old.toString(), now.toString(), "--max-psi", "3"));

        out.getBuffer().setLength(0);
        assertEquals(3, quern("compare", old.toString(), now.toString(), "--json"));
        Map<String, Object> json = (Map<String, Object>) new Yaml(new SafeConstructor(new LoaderOptions()))
                .load(out.toString());
        List<Map<String, Object>> drift = (List<Map<String, Object>>) json.get("drift");
        assertEquals("x", drift.get(0).get("column"));
        assertEquals("deciles", drift.get(0).get("bins_from"));
        double expected = 3 * (0.0001 - 0.1) * Math.log(0.0001 / 0.1) + (0.4 - 0.1) * Math.log(0.4 / 0.1);
        assertEquals(expected, ((Number) drift.get(0).get("psi")).doubleValue(), 1e-9);
        assertEquals("large shift", drift.get(0).get("reading"));
        assertEquals(List.of("x: PSI 2.4861 above 0.2500 (large shift)"), json.get("findings"));
    }

    @Test
    void theCommandTellsMistakesFromFindings() throws IOException {
        Path old = build("old", List.of("x:feature:integer"), cutoffs(10), row -> List.of("1"), "aaa");

        assertEquals(66, quern("compare", old.toString(), folder.resolve("nowhere").toString()));
        assertTrue(err.toString().contains("nowhere is not a folder: name the --out folder of a build"),
                err.toString());
        Files.delete(old.resolve("provenance.json"));
        assertEquals(66, quern("compare", old.toString(), old.toString()));
        assertTrue(err.toString().contains("has no provenance.json"), err.toString());
        assertEquals(2, quern("compare", old.toString(), old.toString(), "--max-psi", "-1"));
        assertTrue(err.toString().contains("maxPsi must be a number of 0 or more: -1.0"), err.toString());
    }

    @Test
    void aLargeMatrixIsStreamedAndEveryRowCounted() throws IOException {
        // 300,000 rows of a column with 300,000 distinct values: the PSI bins come from a sample of the
        // old run, but every row is counted into them, and two identical runs show no drift.
        int rows = 300_000;
        Path old = build("old", List.of("x:feature:decimal"), cutoffs(rows),
                row -> List.of(Double.toString((row * 7919L % rows) / 10.0)), "aaa");

        Comparison.ColumnDrift x = Compare.folders(old, old).drift().get(0);

        assertEquals(rows, x.bins().stream().mapToLong(Comparison.Bin::oldCount).sum());
        assertEquals(0.0, x.psi(), 0.0);
        for (Comparison.Bin b : x.bins().subList(1, x.bins().size())) {
            assertEquals(0.1, (double) b.oldCount() / rows, 0.02, b.label() + ": close to a decile of the rows");
        }
    }

    @Test
    void theDemoBuiltTwiceDoesNotDriftAndTheChangedSourceStopsTheMonth() {
        assertEquals(0, quern("compare", DemoBuilds.first().toString(), DemoBuilds.second().toString()),
                out.toString());

        assertEquals(3, quern("compare", DemoBuilds.first().toString(), DemoBuilds.driftedFolder().toString()));
        String text = out.toString();
        assertTrue(text.contains("  source.file_sha256  "
                + "7946e6db04e17ab21515eed5ff0220eea2a4877ff5e6146837c5d5382c4dcd08 -> "), text);
        assertTrue(text.contains("rides_max_distance_km_90d: PSI "), text);
        assertFalse(text.contains("rides_count_30d: PSI"), "ride counts did not change");
        assertTrue(java.util.regex.Pattern.compile("\n  plan +0\\.2454 +moderate shift +0\\.0000 -> 0\\.0000\n")
                .matcher(text).find(), text);
    }

    @Test
    void aBuildCanCompareWithTheFolderItReplaces() throws IOException {
        Path target = folder.resolve("monthly");
        Files.createDirectories(target);
        for (String f : List.of("matrix.csv", "dictionary.csv", "dictionary.md", "provenance.json", "report.html")) {
            Files.copy(DemoBuilds.first().resolve(f), target.resolve(f));
        }

        assertEquals(0, quern("build", DemoBuilds.DEMO.toString(), "--out", target.toString(), "--compare-to",
                target.toString()), err.toString());

        assertTrue(out.toString().contains("drift against " + target + ": nothing beyond the default thresholds"),
                out.toString());
        String html = Files.readString(target.resolve("report.html"));
        assertTrue(html.contains("<p class=\"ok\">Nothing goes beyond the thresholds.</p>"));
        assertTrue(html.contains("<p>19 cutoffs have the same rows in both builds.</p>"));
        assertEquals(Files.readString(DemoBuilds.first().resolve("matrix.csv")),
                Files.readString(target.resolve("matrix.csv")));
    }
}
