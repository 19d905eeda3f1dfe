package dev.quern.sample;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.quern.Failure;
import dev.quern.QuernException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** How the generator treats the file it is asked to write. */
class WriteToTest {

    private final CycleClubGenerator generator = new CycleClubGenerator(20, 1L);

    @Test
    void refusesToOverwriteAnExistingFileAndLeavesItAlone(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("club.sqlite");
        byte[] before = "not a database, but mine".getBytes(java.nio.charset.StandardCharsets.UTF_8);
        Files.write(file, before);

        QuernException refused = assertThrows(QuernException.class, () -> generator.writeTo(file));

        assertEquals(Failure.OUTPUT, refused.failure());
        assertArrayEquals(before, Files.readAllBytes(file));
        assertEquals(List.of(file), contents(dir));
    }

    @Test
    void replacesAnExistingFileOnlyWhenAllowed(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("club.sqlite");
        Files.writeString(file, "old");

        generator.writeTo(file, true);

        try (SampleDb db = SampleDb.open(file)) {
            assertEquals(20, db.count("SELECT count(*) FROM members"));
        }
        assertEquals(List.of(file), contents(dir), "no temporary file is left behind");
    }

    @Test
    void aFailedWriteLeavesNoFileBehind(@TempDir Path dir) throws Exception {
        // A non-empty folder where the file should go: the final rename cannot replace it.
        Path occupied = dir.resolve("club.sqlite");
        Files.createDirectory(occupied);
        Files.writeString(occupied.resolve("keep.txt"), "keep");

        assertThrows(QuernException.class, () -> generator.writeTo(occupied, true));

        assertEquals(List.of(occupied), contents(dir));
        assertEquals("keep", Files.readString(occupied.resolve("keep.txt")));
    }

    @Test
    void aMissingFolderIsReportedNotCreated(@TempDir Path dir) {
        Path file = dir.resolve("missing").resolve("club.sqlite");

        QuernException failed = assertThrows(QuernException.class, () -> generator.writeTo(file));

        assertEquals(Failure.OUTPUT, failed.failure());
        assertEquals(false, Files.exists(file.getParent()));
    }

    @Test
    void aClubNeedsMembers() {
        assertThrows(IllegalArgumentException.class, () -> new CycleClubGenerator(0, 1L));
    }

    private static List<Path> contents(Path dir) throws Exception {
        try (Stream<Path> files = Files.list(dir)) {
            return files.sorted().toList();
        }
    }
}
