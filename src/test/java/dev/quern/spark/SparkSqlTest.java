package dev.quern.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Quern;
import dev.quern.cli.Main;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import scala.jdk.javaapi.CollectionConverters;

/** {@code quern sql --engine spark}, and the Spark connection's refusal to write. */
class SparkSqlTest {

    /**
     * The demo recipe's source is the SQLite sample; rendered for Spark, Spark's analyser accepts the query
     * over the Parquet export (names, types, functions) and gives the matrix's columns.
     */
    @Test
    void sqlForSparkIsAcceptedBySparksAnalyser() throws SQLException {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(new PrintWriter(out, true), new PrintWriter(err, true),
                "sql", SparkSample.DEMO.toString(), "--engine", "spark");
        assertEquals(0, code, err.toString());
        String sql = out.toString().strip();
        sql = sql.substring(0, sql.length() - 1);
        StringWriter forSqlite = new StringWriter();
        Main.run(new PrintWriter(forSqlite, true), new PrintWriter(new StringWriter(), true),
                "sql", SparkSample.DEMO.toString());
        assertNotEquals(forSqlite.toString(), out.toString(), "--engine renders for Spark, not for the source");

        List<String> expected = Quern.load(SparkSample.DEMO).compile().plan().columns().stream()
                .map(dev.quern.plan.OutputColumn::name).toList();
        try (Connection c = Quern.load(SparkSample.DEMO).withSource(SparkSample.source()).source().open()) {
            var analysed = SparkConnection.session(c).sql(sql).queryExecution().analyzed();
            List<String> columns = CollectionConverters.asJava(analysed.output()).stream().map(a -> a.name()).toList();
            assertEquals(expected, columns);
        }
    }

    @Test
    void connectionRunsQueriesAndRefusesEveryWrite() throws SQLException, IOException {
        Path folder = SparkSample.parquetFolder();
        Map<String, String> before = fingerprints(folder);
        try (Connection c = Quern.load(SparkSample.DEMO).withSource(SparkSample.source()).source().open();
             Statement s = c.createStatement()) {
            try (ResultSet rs = s.executeQuery("select count(*) from \"rides\"")) {
                assertTrue(rs.next());
                assertTrue(rs.getLong(1) > 0, "the rides view reads the Parquet file");
            }
            for (String write : List.of(
                    "insert into \"rides\" select * from \"rides\"",
                    "insert overwrite directory '" + folder.resolve("rides.parquet") + "' using parquet select 1",
                    "create table \"t\" using parquet location '" + folder + "' as select 1 as \"x\"",
                    "drop view \"rides\"",
                    "create or replace temporary view \"rides\" as select 1",
                    "cache table \"rides\"",
                    "set spark.sql.ansi.doubleQuotedIdentifiers=false",
                    "with \"x\" as (select 1) insert into \"rides\" select * from \"rides\"",
                    "execute immediate 'drop view rides'")) {
                SQLException refused = assertThrows(SQLException.class, () -> s.executeQuery(write), write);
                assertTrue(String.valueOf(refused.getMessage()).contains("read-only")
                        || refused.getMessage().contains("PARSE_SYNTAX_ERROR"), write + ": " + refused.getMessage());
            }
            assertThrows(SQLException.class, () -> s.executeUpdate("select 1"));
            try (ResultSet rs = s.executeQuery("select count(*) from \"rides\"")) {
                assertTrue(rs.next(), "the view is still there");
            }
        }
        assertEquals(before, fingerprints(folder), "no file of the source changed");
    }

    /** Spark is only ever read: {@code quern load} refuses it as a target before touching anything. */
    @Test
    void loadRefusesSparkAsATarget() throws IOException {
        Path target = Files.createTempDirectory(Files.createDirectories(Path.of("target", "spark-tests")), "load-");
        StringWriter err = new StringWriter();
        int code = Main.run(new PrintWriter(new StringWriter(), true), new PrintWriter(err, true),
                "load", SparkSample.SAMPLE.toString(), "--to", "spark:parquet:" + target);
        assertEquals(2, code, err.toString());
        assertTrue(err.toString().contains("Spark, which Quern only reads"), err.toString());
        try (Stream<Path> files = Files.list(target)) {
            assertEquals(List.of(), files.toList(), "nothing was written");
        }
    }

    private static Map<String, String> fingerprints(Path folder) throws IOException {
        Map<String, String> sums = new TreeMap<>();
        try (Stream<Path> files = Files.walk(folder)) {
            for (Path f : files.filter(Files::isRegularFile).toList()) {
                sums.put(folder.relativize(f).toString(), sha256(Files.readAllBytes(f)));
            }
        }
        return sums;
    }

    private static String sha256(byte[] bytes) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }
}
