package dev.quern.build;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.cli.Main;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.Statement;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The build command end to end on the shipped sample: outputs, exit codes, and the source left alone. */
class BuildCommandTest {

    private static final Path SAMPLE = Path.of("sample-db/cycle-club.sqlite");
    private static final String DEMO = "recipes/member-churn.yaml";

    @TempDir
    Path folder;

    private final StringWriter out = new StringWriter();
    private final StringWriter err = new StringWriter();

    private int quern(String... args) {
        return Main.run(new PrintWriter(out, true), new PrintWriter(err, true), args);
    }

    @Test
    void buildsTheDemoAndLeavesTheSourceUnchanged() throws Exception {
        byte[] before = sha256(SAMPLE);
        long modified = Files.getLastModifiedTime(SAMPLE).toMillis();
        Path target = folder.resolve("demo");

        assertEquals(0, quern("build", DEMO, "--out", target.toString()), err.toString());

        assertArrayEquals(before, sha256(SAMPLE), "the source's bytes");
        assertEquals(modified, Files.getLastModifiedTime(SAMPLE).toMillis(), "the source's modification time");
        assertEquals(List.of("audit.json", "audit.md", "dictionary.csv", "dictionary.md", "matrix.csv",
                "provenance.json", "report.html", "rules.md"), names(target));
        List<String> matrix = Files.readAllLines(target.resolve("matrix.csv"));
        assertTrue(matrix.get(0).startsWith("member_id,cutoff,rides_count_30d,"), matrix.get(0));
        assertTrue(matrix.get(0).endsWith(",cancels_in_60d"), matrix.get(0));
        assertTrue(out.toString().contains((matrix.size() - 1) + " rows x 36 columns (19 cutoffs)"), out.toString());
        assertEquals("", err.toString(), "no progress noise when standard error is not a terminal");
    }

    @Test
    void aMissingSourceFileIsAnErrorAndIsNotCreated() throws IOException {
        Path recipe = folder.resolve("missing.yaml");
        Files.writeString(recipe, Files.readString(Path.of(DEMO))
                .replace("../sample-db/cycle-club.sqlite", "nowhere.sqlite"));

        assertEquals(66, quern("build", recipe.toString(), "--out", folder.resolve("out").toString()));

        assertFalse(Files.exists(folder.resolve("nowhere.sqlite")), "no empty database is created");
        assertTrue(err.toString().contains("nowhere.sqlite does not exist"), err.toString());
        assertFalse(err.toString().contains("\tat "), "no stack trace");
        assertFalse(Files.exists(folder.resolve("out/matrix.csv")));
    }

    @Test
    void aFailedBuildLeavesTheEarlierOutputsAsTheyWere() throws IOException {
        Path target = folder.resolve("out");
        Files.createDirectories(target);
        Files.writeString(target.resolve("matrix.csv"), "an earlier build\n");
        Path recipe = folder.resolve("broken.yaml");
        Files.writeString(recipe, Files.readString(Path.of(DEMO))
                .replace("../sample-db/cycle-club.sqlite", Path.of("sample-db/cycle-club.sqlite").toAbsolutePath().toString())
                .replace("sum(distance_km)", "sum(distnce_km)"));

        assertEquals(65, quern("build", recipe.toString(), "--out", target.toString()));

        assertEquals("an earlier build\n", Files.readString(target.resolve("matrix.csv")));
        assertEquals(List.of("matrix.csv"), names(target), "no temporary files left behind");
        assertTrue(err.toString().contains("'distnce_km' (did you mean distance_km?)"), err.toString());
    }

    @Test
    void usageMistakesExitWithTwo() {
        assertEquals(2, quern("build", DEMO));
        assertTrue(err.toString().contains("Missing required option: '--out=DIR'"), err.toString());
        assertEquals(2, quern("biuld", DEMO));
        assertTrue(err.toString().contains("build"), "suggests the command meant: " + err);
    }

    @Test
    void sqlPrintsOneSelectForTheWholeMatrix() {
        assertEquals(0, quern("sql", DEMO, "--shape", "range-join"), err.toString());
        String sql = out.toString();
        assertTrue(sql.startsWith("with"), sql.substring(0, 40));
        // One grouped scan per block, lookup and label: never one subquery per feature.
        assertEquals(7, count(sql, "group by"), "6 blocks and the label are grouped scans");
        // rides is read by two blocks (its own and the one through stations), each once for all windows,
        // and each time without the rides its plausibility rule excludes.
        assertEquals(2, count(sql, "from rides\n"), sql);
        assertEquals(2, count(sql, "rides.distance_km"), sql);
    }

    @Test
    void sqlOnSqlitePrintsOneOrderedScanPerBlockThatCanBeScannedAndExplainsWhy() {
        assertEquals(0, quern("sql", DEMO, "--explain"), err.toString());
        String sql = out.toString();
        assertTrue(sql.startsWith("-- member-churn on sqlite: 19 cutoffs, 6 blocks\n"), sql.substring(0, 80));
        // The tickets block whose where reads the cutoff cannot be scanned once for every cutoff.
        assertEquals(5, count(sql, ": ordered-scan\n"), sql);
        assertEquals(1, count(sql, ": range-join\n--   the block's where uses the cutoff"), sql);
        assertEquals(5, count(sql, "ordered scan, windows computed as rows stream by"), sql);
        assertEquals(2, count(sql, "group by"), "the block left to a range join and the label");
        // Each scan still reads rides once, without the rides the plausibility rule excludes.
        assertEquals(2, count(sql, "from rides\n"), sql);
        assertEquals(2, count(sql, "rides.distance_km"), sql);
    }

    /**
     * SQLite keeps text in a REAL column. The scan stops at it, the range join stops before it runs (SQLite's
     * sum would count it as 0), and a lookup stops at the matrix column; each names where, and writes nothing.
     */
    @Test
    void textInANumberColumnIsADataErrorInEitherShapeAndInALookup() throws Exception {
        Path source = sampleWith("update rides set distance_km = 'twelve' where ride_id = (select min(ride_id) from rides)");
        Path scanned = folder.resolve("scanned");
        assertEquals(66, quern("build", DEMO, "--source", "jdbc:sqlite:" + source, "--out", scanned.toString(),
                "--shape", "ordered-scan"));
        assertTrue(err.toString().contains("rides.distance_km holds 'twelve' in a row of rides.member_id "),
                err.toString());
        Path joined = folder.resolve("joined");
        assertEquals(66, quern("build", DEMO, "--source", "jdbc:sqlite:" + source, "--out", joined.toString(),
                "--shape", "range-join"));
        assertTrue(err.toString().contains("rides.distance_km holds 'twelve' in some rows, where a number belongs"),
                err.toString());

        Path fee = sampleWith("update plans set monthly_fee = 'free' where rowid = (select min(rowid) from plans)");
        Path looked = folder.resolve("looked-up");
        assertEquals(66, quern("build", DEMO, "--source", "jdbc:sqlite:" + fee, "--out", looked.toString()));
        assertTrue(err.toString().contains("the matrix column monthly_fee came out as 'free'"), err.toString());

        assertFalse(err.toString().contains("internal error"), err.toString());
        for (Path out : List.of(scanned, joined, looked)) {
            assertFalse(Files.exists(out.resolve("matrix.csv")), out.toString());
        }
    }

    /** A copy of the sample with one statement applied. */
    private Path sampleWith(String update) throws Exception {
        Path source = Files.createTempFile(folder, "sample-", ".sqlite");
        Files.copy(SAMPLE, source, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + source);
             Statement s = c.createStatement()) {
            s.executeUpdate(update);
        }
        return source;
    }

    @Test
    void anUnknownShapeIsAUsageErrorThatListsTheShapes() {
        assertEquals(2, quern("sql", DEMO, "--shape", "sideways"));
        assertTrue(err.toString().contains("'sideways' is not a shape; use range-join or ordered-scan"), err.toString());
    }

    private static int count(String text, String part) {
        int n = 0;
        for (int i = text.indexOf(part); i >= 0; i = text.indexOf(part, i + 1)) {
            n++;
        }
        return n;
    }

    private static List<String> names(Path dir) throws IOException {
        try (Stream<Path> files = Files.list(dir)) {
            return files.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    private static byte[] sha256(Path file) throws Exception {
        return MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(file));
    }
}
