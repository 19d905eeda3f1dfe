package dev.quern.report;

import dev.quern.BuildSummary;
import dev.quern.Quern;
import dev.quern.run.Progress;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.Comparator;
import java.util.Optional;
import java.util.stream.Stream;

/**
 * Builds of the demo recipe shared by the report tests, each made once per test run under
 * target/report-tests: two plain builds of the shipped sample, and one of a changed copy of it compared
 * with the first.
 */
final class DemoBuilds {

    static final Path DEMO = Path.of("recipes/member-churn.yaml");
    static final Path ROOT = Path.of("target/report-tests");

    private static Path first;
    private static Path second;
    private static BuildSummary drifted;

    private DemoBuilds() {
    }

    /** The demo built on the shipped sample. */
    static synchronized Path first() {
        if (first == null) {
            first = build("first");
        }
        return first;
    }

    /** The demo built a second time on the same sample, into another folder. */
    static synchronized Path second() {
        if (second == null) {
            second = build("second");
        }
        return second;
    }

    /**
     * The demo built on a copy of the sample where rides from 2025 on are 1.7 times as long and every
     * fourth plan row has become "family", compared with {@link #first()}.
     */
    static synchronized BuildSummary drifted() {
        if (drifted == null) {
            Path base = first();
            Path db = ROOT.resolve("drifted.sqlite");
            try {
                Files.createDirectories(ROOT);
                Files.copy(Path.of("sample-db/cycle-club.sqlite"), db,
                        java.nio.file.StandardCopyOption.REPLACE_EXISTING);
                try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db.toAbsolutePath());
                     Statement s = c.createStatement()) {
                    s.executeUpdate("update rides set distance_km = distance_km * 1.7"
                            + " where started_at >= '2025-01-01'");
                    s.executeUpdate("update plans set plan = 'family' where plan_row_id % 4 = 0");
                }
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            } catch (SQLException e) {
                throw new IllegalStateException(e);
            }
            Path out = clean("drifted");
            drifted = Quern.load(DEMO).withSource("jdbc:sqlite:" + db.toAbsolutePath())
                    .build(out, Progress.SILENT, Optional.of(base));
        }
        return drifted;
    }

    static Path driftedFolder() {
        return drifted().files().get(0).getParent();
    }

    private static Path build(String name) {
        Path out = clean(name);
        Quern.load(DEMO).build(out, Progress.SILENT);
        return out;
    }

    private static Path clean(String name) {
        Path out = ROOT.resolve(name);
        if (Files.exists(out)) {
            try (Stream<Path> files = Files.walk(out)) {
                files.sorted(Comparator.reverseOrder()).forEach(p -> {
                    try {
                        Files.delete(p);
                    } catch (IOException e) {
                        throw new UncheckedIOException(e);
                    }
                });
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }
        return out;
    }
}
