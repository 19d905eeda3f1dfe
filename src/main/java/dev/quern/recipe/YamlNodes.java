package dev.quern.recipe;

import dev.quern.Position;
import org.yaml.snakeyaml.DumperOptions.ScalarStyle;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;
import org.yaml.snakeyaml.nodes.Tag;

/** Small facts about SnakeYAML nodes: where they are and how to name their shape in a message. */
final class YamlNodes {

    private YamlNodes() {
    }

    /** SnakeYAML counts lines and columns from 0; positions count from 1. */
    static Position position(String file, Mark mark) {
        return mark == null ? new Position(file, 0, 0) : new Position(file, mark.getLine() + 1, mark.getColumn() + 1);
    }

    static Position position(String file, Node node) {
        return position(file, node.getStartMark());
    }

    /** An empty value: {@code key:} with nothing after it, {@code ~} or {@code null}. */
    static boolean isNull(Node node) {
        return node instanceof ScalarNode && Tag.NULL.equals(node.getTag());
    }

    /**
     * Places inside a scalar. Exact when the scalar sits on one line and reads as written (plain, or quoted
     * without escapes); otherwise every place is the scalar's own start.
     */
    static Locator locator(String file, ScalarNode scalar) {
        Position start = position(file, scalar);
        Mark begin = scalar.getStartMark();
        Mark end = scalar.getEndMark();
        if (begin == null || end == null || begin.getLine() != end.getLine()) {
            return Locator.fixed(start);
        }
        int written = end.getColumn() - begin.getColumn();
        int length = scalar.getValue().length();
        ScalarStyle style = scalar.getScalarStyle();
        if (style == ScalarStyle.PLAIN && written == length) {
            return Locator.from(start);
        }
        if ((style == ScalarStyle.DOUBLE_QUOTED || style == ScalarStyle.SINGLE_QUOTED) && written == length + 2) {
            return Locator.from(start.shifted(1));
        }
        return Locator.fixed(start);
    }

    /** The shape of a node for "expected ..., found ..." messages. */
    static String describe(Node node) {
        if (node instanceof MappingNode) {
            return "a mapping";
        }
        if (node instanceof SequenceNode) {
            return "a list";
        }
        if (isNull(node)) {
            return "nothing";
        }
        return Names.quote(((ScalarNode) node).getValue());
    }
}
