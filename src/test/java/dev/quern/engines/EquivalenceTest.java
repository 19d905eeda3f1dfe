package dev.quern.engines;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.quern.Failure;
import dev.quern.QuernException;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.extension.ExtendWith;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The same recipe gives the same matrix on every engine: every recipe in {@code recipes/} (the demo, and
 * the demo with encodings) and every recipe fixture that builds on the shipped sample, on PostgreSQL, MariaDB and DuckDB, each compared with SQLite's matrix:
 * integers, text and dates exactly, floating values to 1e-9 relative (standard deviations 1e-8).
 */
@ExtendWith(Databases.Extension.class)
class EquivalenceTest {

    static Stream<Arguments> recipesOnEngines() throws IOException {
        List<Path> recipes = new ArrayList<>();
        for (Path folder : List.of(Path.of("recipes"), Path.of("src", "test", "resources", "recipes"))) {
            try (Stream<Path> files = Files.list(folder)) {
                files.filter(f -> f.toString().endsWith(".yaml")).sorted().forEach(recipes::add);
            }
        }
        return recipes.stream().flatMap(r -> Stream.of(Target.POSTGRES, Target.MARIADB, Target.DUCKDB)
                .map(t -> Arguments.of(r, t)));
    }

    @ParameterizedTest(name = "{0} on {1}")
    @MethodSource("recipesOnEngines")
    void recipeGivesSqlitesMatrix(Path recipe, Target target, Databases db) {
        Built reference;
        try {
            reference = db.built(recipe, Target.SQLITE);
        } catch (QuernException e) {
            Assumptions.assumeFalse(e.failure() == Failure.RECIPE,
                    recipe + " does not build on the sample on SQLite either: " + e.getMessage());
            throw e;
        }
        Built built = db.built(recipe, target);

        reference.assertSameMatrix(built, recipe + " on " + target);
        assertEquals(reference.summary().compilation().plan().columns(), built.summary().compilation().plan().columns(),
                "the data dictionary's columns");
    }
}
