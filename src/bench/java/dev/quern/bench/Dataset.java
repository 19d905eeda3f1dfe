package dev.quern.bench;

import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.List;

/**
 * One scale's cycle-club data: a SQLite file written by the seeded generator and the same rows copied
 * into a DuckDB file by quern's loader. Both are kept under {@code target/bench/data}, named by member
 * count and seed, so a rerun finds them instead of generating them again.
 */
record Dataset(double scale, long seed, int members, long rides, long payments, Path sqlite, Path duckdb) {

    /**
     * Rides per member the generator gives over its two years, measured on a club of 28,793 members
     * (980,688 rides with seed 20250131); the shipped sample of 1,800 gives 34.7.
     */
    static final double RIDES_PER_MEMBER = 34.06;

    static Dataset prepare(double millionsOfRides, long seed, Path folder, ChildJvm jvm) {
        int members = (int) Math.round(millionsOfRides * 1_000_000 / RIDES_PER_MEMBER);
        String stem = "cycle-club-m" + members + "-s" + seed;
        Path sqlite = folder.resolve(stem + ".sqlite").toAbsolutePath();
        Path duckdb = folder.resolve(stem + ".duckdb").toAbsolutePath();
        if (!Files.exists(sqlite)) {
            System.out.printf("generating %,d members (seed %d) into %s%n", members, seed, sqlite);
            Path temp = sqlite.resolveSibling(sqlite.getFileName() + ".tmp");
            // The generator holds the whole club in memory before writing it: about 300 MB per million rides.
            String heap = Math.max(1, (int) Math.ceil(millionsOfRides * 0.3) + 1) + "g";
            jvm.require(jvm.run(heap, folder.resolve(stem + ".generate.log"), "dev.quern.cli.Main",
                    List.of("sample", "--out", temp.toString(), "--members", Integer.toString(members),
                            "--seed", Long.toString(seed), "--replace")));
            move(temp, sqlite);
        }
        if (!Files.exists(duckdb)) {
            System.out.printf("loading %s into DuckDB%n", sqlite.getFileName());
            Path temp = duckdb.resolveSibling(duckdb.getFileName() + ".tmp");
            delete(temp);
            jvm.require(jvm.run("1g", folder.resolve(stem + ".load.log"), "dev.quern.cli.Main",
                    List.of("load", sqlite.toString(), "--to", "jdbc:duckdb:" + temp)));
            move(temp, duckdb);
        }
        return new Dataset(millionsOfRides, seed, members, count(sqlite, "rides"), count(sqlite, "payments"),
                sqlite, duckdb);
    }

    String url(Engine engine) {
        return switch (engine) {
            case SQLITE -> "jdbc:sqlite:" + sqlite;
            case DUCKDB -> "jdbc:duckdb:" + duckdb;
        };
    }

    enum Engine {
        SQLITE("sqlite"), DUCKDB("duckdb");

        final String label;

        Engine(String label) {
            this.label = label;
        }
    }

    private static long count(Path sqlite, String table) {
        try (Connection c = DriverManager.getConnection("jdbc:sqlite:file:" + sqlite + "?mode=ro");
             Statement s = c.createStatement();
             ResultSet rs = s.executeQuery("select count(*) from " + table)) {
            rs.next();
            return rs.getLong(1);
        } catch (SQLException e) {
            throw new IllegalStateException("cannot count " + table + " in " + sqlite + ": " + e.getMessage(), e);
        }
    }

    private static void move(Path from, Path to) {
        try {
            Files.move(from, to);
        } catch (java.io.IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }

    private static void delete(Path file) {
        try {
            Files.deleteIfExists(file);
            Files.deleteIfExists(file.resolveSibling(file.getFileName() + ".wal"));
        } catch (java.io.IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }
}
