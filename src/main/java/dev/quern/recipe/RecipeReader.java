package dev.quern.recipe;

import dev.quern.Diagnostic;
import dev.quern.Diagnostics;
import dev.quern.Failure;
import dev.quern.Position;
import dev.quern.QuernException;
import java.io.IOException;
import java.io.StringReader;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.error.MarkedYAMLException;
import org.yaml.snakeyaml.error.YAMLException;
import org.yaml.snakeyaml.nodes.Node;

/**
 * Reads a recipe file into the recipe model, reporting every mistake of the file at once with its line
 * and column.
 */
public final class RecipeReader {

    private RecipeReader() {
    }

    /**
     * Reads the UTF-8 file at {@code file}; positions name it as given.
     *
     * @throws QuernException {@link Failure#USAGE} when the file cannot be read, {@link Failure#RECIPE} with
     *                        every diagnostic when the recipe is wrong
     */
    public static Recipe read(Path file) {
        String label = file.toString();
        if (Files.isDirectory(file)) {
            throw usage("cannot read recipe " + label + ": it is a folder; name the recipe file");
        }
        String text;
        try {
            text = Files.readString(file, StandardCharsets.UTF_8);
        } catch (NoSuchFileException e) {
            throw usage("no recipe file " + label + ": check the path");
        } catch (CharacterCodingException e) {
            throw QuernException.recipe(new Position(label, 0, 0), "the file is not UTF-8 text: save it as UTF-8");
        } catch (IOException e) {
            throw usage("cannot read recipe " + label + ": " + e.getMessage());
        }
        return parse(label, text);
    }

    /**
     * Reads recipe text; {@code fileLabel} is what positions print as the file, e.g. {@code recipes/churn.yaml}.
     *
     * @throws QuernException {@link Failure#RECIPE} with every diagnostic when the recipe is wrong
     */
    public static Recipe parse(String fileLabel, String text) {
        Diagnostics diagnostics = new Diagnostics();
        Node root = compose(fileLabel, text, diagnostics);
        Optional<Recipe> recipe = Optional.empty();
        if (root == null && diagnostics.isEmpty()) {
            diagnostics.error(new Position(fileLabel, 1, 1), "the recipe is empty: write recipe, source, entity,"
                    + " cutoffs, tables and features");
        } else if (root != null) {
            recipe = new DocumentReader(fileLabel, diagnostics).read(root, text);
        }
        diagnostics.throwIfAny(Failure.RECIPE);
        return recipe.orElseThrow(() -> new IllegalStateException("recipe not built, yet no error reported"));
    }

    /** The YAML tree with positions, or null with a diagnostic when the text is not YAML (or empty). */
    private static Node compose(String file, String text, Diagnostics diagnostics) {
        LoaderOptions options = new LoaderOptions();
        options.setAllowDuplicateKeys(true); // the tree keeps both; DocumentReader reports them with positions
        options.setMaxAliasesForCollections(50);
        try {
            return new Yaml(options).compose(new StringReader(text));
        } catch (MarkedYAMLException e) {
            Mark mark = e.getProblemMark() != null ? e.getProblemMark() : e.getContextMark();
            Position at = YamlNodes.position(file, mark);
            diagnostics.error(at, YamlErrors.message(e));
        } catch (YAMLException e) {
            diagnostics.error(new Position(file, 0, 0), "invalid YAML: " + e.getMessage());
        }
        return null;
    }

    private static QuernException usage(String message) {
        return new QuernException(Failure.USAGE, List.of(Diagnostic.at(Position.NONE, message)));
    }
}
