package dev.quern.cli;

import dev.quern.Quern;
import java.nio.file.Path;
import dev.quern.sql.BlockShape;
import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.Option;
import picocli.CommandLine.TypeConversionException;
import picocli.CommandLine.Parameters;

/** The recipe argument and the source override that every recipe command takes. */
final class RecipeOptions {

    @Parameters(index = "0", paramLabel = "RECIPE", description = "The recipe file (YAML).")
    Path recipe;

    @Option(names = "--source", paramLabel = "URL",
            description = "Read this JDBC URL instead of the recipe's source; may name $${VARIABLES}.")
    String source;

    @Option(names = "--shape", paramLabel = "SHAPE", converter = ShapeConverter.class,
            description = "Compute every block as range-join or ordered-scan instead of the shape chosen for the"
                    + " engine ('quern sql --explain' says which and why).")
    BlockShape shape;

    Quern load() {
        Quern quern = Quern.load(recipe);
        quern = source == null ? quern : quern.withSource(source);
        return shape == null ? quern : quern.withShape(shape);
    }

    /** Reads a shape as the command line spells it. */
    static final class ShapeConverter implements ITypeConverter<BlockShape> {
        @Override
        public BlockShape convert(String value) {
            return BlockShape.ofSpelling(value).orElseThrow(() -> new TypeConversionException("'" + value
                    + "' is not a shape; use " + java.util.Arrays.stream(BlockShape.values())
                    .map(BlockShape::spelling).collect(java.util.stream.Collectors.joining(" or "))));
        }
    }
}
