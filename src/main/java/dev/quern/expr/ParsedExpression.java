package dev.quern.expr;

import dev.quern.Position;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/** An expression that is well formed but not yet checked against any scope. Immutable. */
public final class ParsedExpression {

    private final SourceText source;
    private final Syntax root;

    ParsedExpression(SourceText source, Syntax root) {
        this.source = Objects.requireNonNull(source, "source");
        this.root = Objects.requireNonNull(root, "root");
    }

    public String text() {
        return source.text();
    }

    /** Where the expression's first character is in the recipe. */
    public Position start() {
        return source.start();
    }

    /**
     * Every name the expression uses as a column (not function names or literals), in order of appearance,
     * with repeats: so that a caller can order derived columns that use each other before building scopes.
     */
    public List<NameUse> names() {
        List<NameUse> found = new ArrayList<>();
        collect(root, found);
        return List.copyOf(found);
    }

    private void collect(Syntax node, List<NameUse> found) {
        if (node instanceof Syntax.Name n) {
            found.add(new NameUse(n.qualifier(), n.name(), source.positionAt(n.start())));
        }
        node.children().forEach(child -> collect(child, found));
    }

    SourceText source() {
        return source;
    }

    Syntax root() {
        return root;
    }

    @Override
    public String toString() {
        return source.text();
    }
}
