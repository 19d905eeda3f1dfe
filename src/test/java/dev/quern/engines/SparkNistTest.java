package dev.quern.engines;

import dev.quern.Quern;
import dev.quern.recipe.RecipeReader;
import dev.quern.run.Progress;
import dev.quern.spark.SparkSample;
import dev.quern.testing.Matrix;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;

/**
 * Spark's mean and stddev_samp against the certified values of the NIST StRD univariate data sets, as
 * {@link NistEnginesTest} checks the other engines (same recipe, same tolerances): NumAcc3 and NumAcc4
 * show that Spark's standard deviation, which Quern trusts ({@code sql.SparkSql#hasStableStddev}), is
 * numerically stable.
 */
@ExtendWith(Databases.Extension.class)
class SparkNistTest {

    @Test
    void certifiedMeansAndStandardDeviations(Databases db) throws IOException {
        SparkSample.spark();
        Path sqlite = NistEnginesTest.database(db);
        Path parquet = SparkSample.parquetCopy(sqlite, List.of("sensors", "readings"),
                Files.createDirectories(db.folder().resolve("nist-spark")));
        Path out = db.folder().resolve("nist-SPARK");
        Quern.of(RecipeReader.parse("nist.yaml", NistEnginesTest.RECIPE), sqlite.getParent())
                .withSource("spark:parquet:" + parquet).build(out, Progress.SILENT);
        Matrix m = Matrix.read(out.resolve(Quern.MATRIX));
        NistEnginesTest.check(m, 1, 3, 10000002.0, 1.0, 1e-9);
        NistEnginesTest.check(m, 2, 1001, 1.2, 0.1, 1e-9);
        NistEnginesTest.check(m, 3, 1001, 1000000.2, 0.1, 1e-9);
        NistEnginesTest.check(m, 4, 1001, 10000000.2, 0.1, 1e-8);
        NistEnginesTest.check(m, 5, 100, 299.852400000000, 0.0790105478190518, 1e-9);
    }
}
