package dev.quern.recipe;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Diagnostic;
import dev.quern.Failure;
import dev.quern.QuernException;
import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestFactory;

/**
 * Runs every broken recipe in {@code recipes/broken/}: each {@code name.yaml} must fail as a recipe error
 * (exit code 65) with exactly the diagnostics written in {@code name.expected}, one rendered line each, in
 * order.
 */
class RecipeFixturesTest {

    private static Path folder() throws URISyntaxException {
        return Path.of(RecipeFixturesTest.class.getResource("/recipes/broken").toURI());
    }

    private static List<Path> fixtures() throws IOException, URISyntaxException {
        try (Stream<Path> files = Files.list(folder())) {
            return files.filter(f -> f.getFileName().toString().endsWith(".yaml")).sorted().toList();
        }
    }

    private static Path expectedFor(Path fixture) {
        String name = fixture.getFileName().toString();
        return fixture.resolveSibling(name.substring(0, name.length() - ".yaml".length()) + ".expected");
    }

    @TestFactory
    Stream<DynamicTest> eachBrokenRecipeReportsItsExpectedDiagnostics() throws IOException, URISyntaxException {
        return fixtures().stream().map(fixture -> DynamicTest.dynamicTest(fixture.getFileName().toString(), () -> {
            String label = fixture.getFileName().toString();
            String text = Files.readString(fixture, StandardCharsets.UTF_8);
            List<String> expected = Files.readAllLines(expectedFor(fixture), StandardCharsets.UTF_8).stream()
                    .filter(line -> !line.isBlank()).toList();

            QuernException e = assertThrows(QuernException.class, () -> RecipeReader.parse(label, text));

            assertEquals(Failure.RECIPE, e.failure());
            assertEquals(65, e.failure().exitCode());
            assertEquals(String.join("\n", expected),
                    String.join("\n", e.diagnostics().stream().map(Diagnostic::render).toList()));
        }));
    }

    @Test
    void everyFixtureHasItsExpectedFileAndNoExpectedFileIsOrphaned() throws IOException, URISyntaxException {
        List<Path> fixtures = fixtures();
        assertFalse(fixtures.isEmpty());
        for (Path fixture : fixtures) {
            assertTrue(Files.exists(expectedFor(fixture)), "no expected file beside " + fixture.getFileName());
        }
        try (Stream<Path> files = Files.list(folder())) {
            files.filter(f -> f.getFileName().toString().endsWith(".expected")).forEach(expected -> {
                String name = expected.getFileName().toString().replace(".expected", ".yaml");
                assertTrue(Files.exists(expected.resolveSibling(name)), "no fixture for " + expected.getFileName());
            });
        }
    }
}
