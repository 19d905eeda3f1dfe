package dev.quern.sample;

import static org.junit.jupiter.api.Assertions.assertNotEquals;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The seed alone decides the rows. */
class DeterminismTest {

    @Test
    void theSameSeedGivesTheSameRowsAndAnotherSeedOtherRows(@TempDir Path dir) throws Exception {
        List<List<List<Object>>> first = dump(write(dir.resolve("a.sqlite"), 7L));
        List<List<List<Object>>> again = dump(write(dir.resolve("b.sqlite"), 7L));
        List<List<List<Object>>> other = dump(write(dir.resolve("c.sqlite"), 8L));

        for (int t = 0; t < SampleDb.TABLES.size(); t++) {
            String table = SampleDb.TABLES.get(t)[0];
            RowAssertions.assertSameRows(table, first.get(t), again.get(t));
            assertNotEquals(first.get(t), other.get(t), table + " is the same under another seed");
        }
    }

    private static Path write(Path file, long seed) {
        new CycleClubGenerator(120, seed).writeTo(file);
        return file;
    }

    private static List<List<List<Object>>> dump(Path file) throws Exception {
        List<List<List<Object>>> tables = new ArrayList<>();
        try (SampleDb db = SampleDb.open(file)) {
            for (String[] table : SampleDb.TABLES) {
                tables.add(db.table(table));
            }
        }
        return tables;
    }
}
