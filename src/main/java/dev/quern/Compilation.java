package dev.quern;

import dev.quern.plan.Plan;
import dev.quern.recipe.Recipe;
import dev.quern.schema.Source;
import dev.quern.schema.SourceSchema;
import dev.quern.sql.CompiledQuery;
import java.util.Objects;

/** A recipe carried through every stage up to SQL: what {@code quern check} and {@code quern sql} show. */
public record Compilation(Recipe recipe, Source source, SourceSchema schema, Plan plan, CompiledQuery query) {
    public Compilation {
        Objects.requireNonNull(recipe, "recipe");
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(schema, "schema");
        Objects.requireNonNull(plan, "plan");
        Objects.requireNonNull(query, "query");
    }
}
