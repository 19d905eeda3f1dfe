/**
 * The recipe stage: YAML text in, an immutable {@link dev.quern.recipe.Recipe} out.
 *
 * <p>{@link dev.quern.recipe.RecipeReader} is the one entry. It reads the file through SnakeYAML's node
 * API, so that every value of the model keeps the file, line and column it was written at, and checks what
 * can be checked from the file alone: the keys and shapes of the grammar (docs/recipe.md), spans, dates,
 * measures and paths, plain names for tables and columns, and the recipe's references to its own tables
 * (declared, linked, with a time where one is needed). Every mistake of the file is collected and reported
 * together as one {@link dev.quern.QuernException} of {@link dev.quern.Failure#RECIPE}.
 *
 * <p>Nothing is checked against a database yet: whether the tables and columns exist, and their types, is
 * the schema stage's work. {@code source} is kept as written; environment variables are filled in later,
 * so that no secret is held in the model.
 */
package dev.quern.recipe;
