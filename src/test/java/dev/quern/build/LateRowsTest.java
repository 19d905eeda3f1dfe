package dev.quern.build;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Quern;
import dev.quern.run.Progress;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Rows no cutoff reaches are ignored by construction, and rules.md counts them. */
class LateRowsTest {

    @TempDir
    Path folder;

    @Test
    void rowsAfterTheLastHorizonAreCountedInRulesMd() throws Exception {
        // One cutoff, 2024-06-30: windows end with 2024-06-30, the 60d label horizon with 2024-08-29, so
        // every ride from 2024-08-30 on is read by no row.
        Quern.load(Path.of("recipes/member-churn.yaml")).withCutoffs(List.of(LocalDate.parse("2024-06-30")))
                .build(folder, Progress.SILENT);
        long expected;
        try (Connection c = DriverManager.getConnection("jdbc:sqlite:sample-db/cycle-club.sqlite");
             ResultSet rs = c.createStatement().executeQuery(
                     "select count(*) from rides where started_at >= '2024-08-30'")) {
            rs.next();
            expected = rs.getLong(1);
        }
        String rules = Files.readString(folder.resolve("rules.md"));
        assertTrue(rules.contains("Rows dated on or after 2024-08-30"), rules);
        assertTrue(rules.contains("- rides.started_at: " + expected + " rows\n"), rules);
    }
}
