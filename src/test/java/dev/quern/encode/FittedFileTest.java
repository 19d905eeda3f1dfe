package dev.quern.encode;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.quern.Failure;
import dev.quern.QuernException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** fitted.json written and read back to the same values, and files that are not a fit refused plainly. */
class FittedFileTest {

    @TempDir
    Path folder;

    private static final String SHA = "ab".repeat(32);

    static Fitted sample() {
        return new Fitted("club", SHA, "0.1.0", Optional.of("complains_in_30d"),
                List.of(LocalDate.parse("2025-01-31"), LocalDate.parse("2025-02-28")), 12,
                List.of(new FittedColumn("zone", List.of(new FittedStep.OneHot(2, 12,
                                List.of(new FittedStep.Level("A \"north\"\tside", 7, "zone_a_north_side"),
                                        new FittedStep.Level("b", 3, "zone_b")), 1, "zone_other", 1, "zone_missing")),
                                Optional.empty()),
                        new FittedColumn("tier", List.of(new FittedStep.Frequency(12,
                                List.of(new FittedStep.Share("basic", 11, 11.0 / 12)),
                                new FittedStep.Share("", 1, 1.0 / 12))), Optional.of("tier_frequency")),
                        new FittedColumn("city", List.of(new FittedStep.TargetMean(10, 12, 0.1 / 3,
                                List.of(new FittedStep.LevelMean("x", 12, 1.0 / 3, 0.2 / 7)),
                                new FittedStep.LevelMean("", 0, Double.NaN, 0.1 / 3))), Optional.of("city_target_mean")),
                        new FittedColumn("fee", List.of(new FittedStep.Missing("fee_missing"),
                                new FittedStep.Impute("median", 11, 20.5), new FittedStep.Log1p(),
                                new FittedStep.Standardise(12, 1e-7, Double.NaN, 1.0)), Optional.of("fee")),
                        new FittedColumn("km", List.of(new FittedStep.Bins(4, 12, List.of(-0.5, 1.0 / 3, 1e20))),
                                Optional.of("km_bin"))),
                List.of("member_id", "cutoff"));
    }

    @Test
    void everyValueReadsBackTheSame() throws Exception {
        Path file = folder.resolve("fitted.json");
        Files.writeString(file, FittedFile.render(sample()));
        assertEquals(sample(), FittedFile.read(file, SHA));
    }

    @Test
    void aFileThatIsNotAFitIsRefused() throws Exception {
        Path file = folder.resolve("other.json");
        Files.writeString(file, "{\"rows\": 3}\n");
        QuernException e = assertThrows(QuernException.class, () -> FittedFile.read(file, SHA));
        assertEquals(Failure.RECIPE, e.failure());
        assertEquals(file + ": is not a usable fitted file: it has no 'quern_fitted: 1'; it was not written by "
                + "quern build", e.getMessage());
        Files.writeString(file, "{ not json");
        assertEquals(Failure.RECIPE, assertThrows(QuernException.class, () -> FittedFile.read(file, SHA)).failure());
    }

    @Test
    void aMissingFileIsAUsageMistake() {
        QuernException e = assertThrows(QuernException.class, () -> FittedFile.read(folder.resolve("none.json"), SHA));
        assertEquals(Failure.USAGE, e.failure());
        assertEquals("the fitted file " + folder.resolve("none.json") + " does not exist: name the fitted.json an "
                + "earlier build wrote", e.getMessage());
    }
}
