package dev.quern.build;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.quern.cli.Main;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.TestFactory;

/**
 * Recipes that are wrong for the shipped sample database, each checked through the command line with
 * its expected exit code and error text written beside it ({@code name.expected}: the exit code on the
 * first line, then standard error; {@code {file}} stands for the recipe's path, {@code {root}} for the
 * project folder). Mistakes found against the catalogue exit 65, unusable data 66.
 */
class CommandLineFixturesTest {

    private static final Path FIXTURES = Path.of("src/test/resources/recipes/against-sample");

    @TestFactory
    Stream<DynamicTest> everyFixtureFailsAsWrittenBesideIt() throws IOException {
        List<Path> recipes;
        try (Stream<Path> files = Files.list(FIXTURES)) {
            recipes = files.filter(p -> p.toString().endsWith(".yaml")).sorted().toList();
        }
        return recipes.stream().map(recipe -> DynamicTest.dynamicTest(recipe.getFileName().toString(), () -> {
            Path expectedFile = Path.of(recipe.toString().replace(".yaml", ".expected"));
            List<String> expected = Files.readAllLines(expectedFile, StandardCharsets.UTF_8);
            StringWriter out = new StringWriter();
            StringWriter err = new StringWriter();
            int exit = Main.run(new PrintWriter(out, true), new PrintWriter(err, true), "check", recipe.toString());
            String stderr = err.toString().replace(Path.of("").toAbsolutePath().toString(), "{root}")
                    .replace(recipe.toString(), "{file}");
            assertEquals(expected.get(0), "exit " + exit, "exit code of " + recipe);
            assertEquals(String.join("\n", expected.subList(1, expected.size())), stderr.strip(),
                    "standard error of " + recipe);
            assertEquals("", out.toString(), "nothing on standard output when the check fails");
        }));
    }
}
