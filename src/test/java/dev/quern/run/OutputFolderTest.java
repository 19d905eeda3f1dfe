package dev.quern.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** A folder output (Spark's Parquet part files) appears whole on commit, or not at all. */
class OutputFolderTest {

    @TempDir
    Path dir;

    @Test
    void reservedFolderIsRemovedWhenTheBuildStopsBeforeCommit() throws IOException {
        try (OutputFolder out = new OutputFolder(dir)) {
            Path pending = out.reserveFolder("matrix.parquet");
            assertFalse(Files.exists(pending), "the writer creates it");
            Files.createDirectories(pending.resolve("cutoff=2025-01-31"));
            Files.writeString(pending.resolve("cutoff=2025-01-31").resolve("part-0.parquet"), "rows");
            out.write("audit.json", "{}");
        }
        assertEquals(List.of(), names(dir), "nothing of an unfinished build is left");
    }

    @Test
    void committedFolderReplacesAnEarlierBuildsFolderWhole() throws IOException {
        Path earlier = Files.createDirectories(dir.resolve("matrix.parquet").resolve("cutoff=2024-12-31"));
        Files.writeString(earlier.resolve("part-0.parquet"), "old rows");
        try (OutputFolder out = new OutputFolder(dir)) {
            Path pending = out.reserveFolder("matrix.parquet");
            Files.createDirectories(pending.resolve("cutoff=2025-01-31"));
            Files.writeString(pending.resolve("cutoff=2025-01-31").resolve("part-0.parquet"), "new rows");
            out.commit();
        }
        assertEquals(List.of("matrix.parquet"), names(dir));
        assertEquals(List.of("cutoff=2025-01-31"), names(dir.resolve("matrix.parquet")));
        assertTrue(Files.isRegularFile(dir.resolve("matrix.parquet/cutoff=2025-01-31/part-0.parquet")));
    }

    @Test
    void discardedFolderIsRemoved() throws IOException {
        try (OutputFolder out = new OutputFolder(dir)) {
            Path pending = out.reserveFolder("matrix.parquet");
            Files.createDirectories(pending.resolve("cutoff=2025-01-31"));
            out.discard("matrix.parquet");
            out.write("matrix.csv", "a\n");
            out.commit();
        }
        assertEquals(List.of("matrix.csv"), names(dir));
    }

    private static List<String> names(Path folder) throws IOException {
        try (Stream<Path> files = Files.list(folder)) {
            return files.map(f -> f.getFileName().toString()).sorted().toList();
        }
    }
}
