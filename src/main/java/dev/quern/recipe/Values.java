package dev.quern.recipe;

import dev.quern.Diagnostics;
import dev.quern.Position;
import java.time.LocalDate;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.time.format.ResolverStyle;
import java.util.List;
import java.util.Optional;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;

/**
 * Reads single values of the expected shape from nodes of one file, reporting a wrong shape or spelling to
 * the stage's diagnostics and giving an empty result, so that the caller skips the piece and goes on.
 * {@code where} phrases say which value is meant: {@code for 'windows'}, {@code in 'windows'}.
 */
final class Values {

    private static final DateTimeFormatter DATE = DateTimeFormatter.ofPattern("uuuu-MM-dd")
            .withResolverStyle(ResolverStyle.STRICT);

    private final String file;
    private final Diagnostics diagnostics;

    Values(String file, Diagnostics diagnostics) {
        this.file = file;
        this.diagnostics = diagnostics;
    }

    static String forKey(String key) {
        return "for '" + key + "'";
    }

    static String in(String key) {
        return "in '" + key + "'";
    }

    String file() {
        return file;
    }

    Diagnostics diagnostics() {
        return diagnostics;
    }

    Position at(Node node) {
        return YamlNodes.position(file, node);
    }

    /** Where the text of a scalar begins: inside the quotes of a quoted value written as it reads. */
    Position start(ScalarNode scalar) {
        return locator(scalar).at(0);
    }

    void error(Node node, String message) {
        diagnostics.error(at(node), message);
    }

    int errorCount() {
        return diagnostics.all().size();
    }

    Optional<MappingReader> mapping(Node node, String where, String owner, List<String> allowed) {
        if (node instanceof MappingNode mapping) {
            return Optional.of(new MappingReader(file, diagnostics, mapping, owner, allowed));
        }
        wrongShape(node, "a mapping", where);
        return Optional.empty();
    }

    /** The items of a list; a single value where a list belongs gets the hint to bracket it. */
    Optional<List<Node>> list(Node node, String expected, String where) {
        if (node instanceof SequenceNode sequence) {
            return Optional.of(sequence.getValue());
        }
        if (node instanceof ScalarNode scalar && !YamlNodes.isNull(node)) {
            error(node, "expected " + expected + " " + where + ", found " + YamlNodes.describe(node)
                    + ": write [" + scalar.getValue() + "]");
        } else {
            wrongShape(node, expected, where);
        }
        return Optional.empty();
    }

    /** A scalar with a value; {@code expected} says what it should hold: "a column name", "a span". */
    Optional<ScalarNode> scalar(Node node, String expected, String where) {
        if (node instanceof ScalarNode scalar && !YamlNodes.isNull(node)) {
            return Optional.of(scalar);
        }
        wrongShape(node, expected, where);
        return Optional.empty();
    }

    Optional<String> text(Node node, String expected, String where) {
        return scalar(node, expected, where).map(ScalarNode::getValue);
    }

    /** A plain name of a table or column; {@code role} is "table", "column", "link column", "output". */
    Optional<Name> name(Node node, String role, String where) {
        return scalar(node, "a " + role + " name", where)
                .flatMap(s -> Names.plain(s.getValue(), start(s), role, diagnostics));
    }

    Optional<Span> span(Node node, String where) {
        return scalar(node, "a span such as 30d", where)
                .flatMap(s -> SpanParser.parse(s.getValue(), start(s), diagnostics));
    }

    /** An expression's text and where its first character stands; empty text is a mistake. */
    Optional<Expression> expression(Node node, String where) {
        return scalar(node, "an expression in quotes, e.g. \"amount > 0\"", where).flatMap(s -> {
            if (s.getValue().isBlank()) {
                error(s, "the expression " + where + " is empty: write a condition or a formula");
                return Optional.empty();
            }
            return Optional.of(new Expression(s.getValue(), start(s)));
        });
    }

    Optional<LocalDate> date(Node node, String where) {
        return scalar(node, "a date (YYYY-MM-DD)", where).flatMap(s -> {
            try {
                return Optional.of(LocalDate.parse(s.getValue(), DATE));
            } catch (DateTimeParseException e) {
                diagnostics.error(start(s), Names.quote(s.getValue()) + " is not a date: write YYYY-MM-DD");
                return Optional.empty();
            }
        });
    }

    Locator locator(ScalarNode scalar) {
        return YamlNodes.locator(file, scalar);
    }

    void wrongShape(Node node, String expected, String where) {
        error(node, "expected " + expected + " " + where + ", found " + YamlNodes.describe(node));
    }
}
