package dev.quern.recipe;

import dev.quern.Diagnostics;
import dev.quern.Position;
import dev.quern.Suggestions;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.Tag;

/**
 * One mapping of the recipe, read once: its keys are checked on construction (a key written twice, a key
 * that is not allowed here) and the errors go to the stage's diagnostics. Later keys of a duplicate are
 * ignored, so that the rest of the mapping is still read.
 */
final class MappingReader {

    private final String file;
    private final Diagnostics diagnostics;
    private final MappingNode node;
    private final String owner;
    private final Map<String, NodeTuple> entries = new LinkedHashMap<>();
    /** Allowed keys that an unknown key was taken for: their absence is already explained. */
    private final Set<String> misspelled = new HashSet<>();

    /**
     * @param owner   what the mapping is, for messages: "entity", "feature block", "table rides"
     * @param allowed the keys allowed here, or an empty list when any key is (tables, links)
     */
    MappingReader(String file, Diagnostics diagnostics, MappingNode node, String owner, List<String> allowed) {
        this.file = file;
        this.diagnostics = diagnostics;
        this.node = node;
        this.owner = owner;
        for (NodeTuple tuple : node.getValue()) {
            Node keyNode = tuple.getKeyNode();
            Position at = YamlNodes.position(file, keyNode);
            if (!(keyNode instanceof ScalarNode scalar) || YamlNodes.isNull(keyNode)) {
                diagnostics.error(at, "expected a key in " + owner + ", found " + YamlNodes.describe(keyNode));
                continue;
            }
            String key = scalar.getValue();
            if (Tag.MERGE.equals(keyNode.getTag())) {
                diagnostics.error(at, "merge keys ('<<') are not read in a recipe: write the keys out");
            } else if (entries.containsKey(key)) {
                diagnostics.error(at, "duplicate key " + Names.quote(key) + " in " + owner + ": write each key once");
            } else if (!allowed.isEmpty() && !allowed.contains(key)) {
                Optional<String> meant = Suggestions.closest(key, allowed);
                meant.ifPresent(misspelled::add);
                diagnostics.error(at, "unknown key " + Names.quote(key) + " in " + owner
                        + meant.map(m -> " (did you mean " + m + "?)")
                                .orElse(": keys here are " + String.join(", ", allowed)));
            } else {
                entries.put(key, tuple);
            }
        }
    }

    Position position() {
        return YamlNodes.position(file, node);
    }

    String owner() {
        return owner;
    }

    boolean has(String key) {
        return entries.containsKey(key);
    }

    Optional<Node> optional(String key) {
        return Optional.ofNullable(entries.get(key)).map(NodeTuple::getValueNode);
    }

    /**
     * The value of a key that must be there; when it is not, an error at the mapping saying what it is for,
     * unless a misspelling of the key was already reported.
     */
    Optional<Node> required(String key, String purpose) {
        Optional<Node> value = optional(key);
        if (value.isEmpty() && !misspelled.contains(key)) {
            diagnostics.error(position(), owner + " needs " + Names.quote(key) + ": " + purpose);
        }
        return value;
    }

    Position keyPosition(String key) {
        NodeTuple tuple = entries.get(key);
        return tuple == null ? position() : YamlNodes.position(file, tuple.getKeyNode());
    }

    /** The entries that survived the key checks, in the order written. */
    List<NodeTuple> entries() {
        return new ArrayList<>(entries.values());
    }
}
