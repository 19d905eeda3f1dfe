package dev.quern.sample;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The committed sample database is exactly what the generator makes from the shipped constants. When the
 * generator changes on purpose, regenerate the file as {@code sample-db/README.md} says and commit both.
 */
class ShippedSampleTest {

    static final Path SHIPPED = Path.of("sample-db", "cycle-club.sqlite");

    @Test
    void regeneratingTheShippedSampleGivesTheSameRowsInEveryTable(@TempDir Path dir) throws Exception {
        Path fresh = dir.resolve("cycle-club.sqlite");
        new CycleClubGenerator(CycleClubGenerator.SHIPPED_MEMBERS, CycleClubGenerator.SHIPPED_SEED).writeTo(fresh);

        try (SampleDb shipped = SampleDb.open(SHIPPED); SampleDb regenerated = SampleDb.open(fresh)) {
            String catalogue = "SELECT type, name, tbl_name, sql FROM sqlite_master ORDER BY type, name";
            assertEquals(shipped.rows(catalogue), regenerated.rows(catalogue), "tables and indexes");
            for (String[] table : SampleDb.TABLES) {
                RowAssertions.assertSameRows(table[0], shipped.table(table), regenerated.table(table));
            }
        }
    }

    @Test
    void theShippedFileStaysSmallEnoughToKeepInTheRepository() throws Exception {
        long bytes = Files.size(SHIPPED);
        assertTrue(bytes <= 10L * 1024 * 1024, "sample-db/cycle-club.sqlite is " + bytes + " bytes");
    }
}
