package dev.quern.encode;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.quern.Failure;
import dev.quern.QuernException;
import java.nio.file.Path;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Mistakes in {@code encode} and {@code split}, found when the recipe is checked against its source (before
 * any data is read), each with its position in the recipe and every one of them at once.
 */
class EncodeRecipeErrorsTest {

    @TempDir
    static Path folder;

    @BeforeAll
    static void database() {
        new Club().member(1, "2024-06-01", "A", "basic", 10.0).ride(1, "2025-06-10 08:00:00", 2.0).writeTo(folder);
    }

    private static String errors(String tail) {
        QuernException e = assertThrows(QuernException.class, () -> Club.recipe(folder, Club.RECIPE + tail).compile());
        assertEquals(Failure.RECIPE, e.failure());
        return e.getMessage();
    }

    @Test
    void unknownKindsAndOptionsSuggestTheClosest() {
        // Options are placed at their value: the parser keeps the value's position, not the key's.
        assertEquals("""
                club.yaml:25:9: unknown encoding 'one_hot' (did you mean one-hot?); the encodings are one-hot, \
                frequency, target-mean, bins, log1p, standardise, missing, impute
                club.yaml:26:27: one-hot has no option 'tpo' (did you mean top?); its options: top
                club.yaml:27:9: unknown encoding 'standardize' (did you mean standardise?); the encodings are \
                one-hot, frequency, target-mean, bins, log1p, standardise, missing, impute
                club.yaml:28:29: log1p takes no options
                club.yaml:29:31: impute with 'medain': write mean, median or a number (did you mean median?)""",
                errors("""
                        encode:
                          zone: one_hot
                          tier: { one-hot: { tpo: 3 } }
                          fee: [standardize]
                          rides_count_30d: { log1p: 2 }
                          rides_sum_km_30d: { impute: medain }
                        """));
    }

    @Test
    void optionValuesAreChecked() {
        assertEquals("""
                club.yaml:25:20: top must be a whole number of at least 1, not '0'
                club.yaml:26:29: m must be a number of at least 0 (the weight of the prior, in rows), not '-1'
                club.yaml:27:16: count must be a whole number of at least 2, not 'many'
                club.yaml:28:30: impute needs a value to fill with: {impute: median}, {impute: mean} or {impute: 0}""",
                errors("""
                        encode:
                          zone: { one-hot: 0 }
                          tier: { target-mean: { m: -1 } }
                          fee: { bins: many }
                          rides_count_30d: [missing, impute]
                        """));
    }

    @Test
    void keysTheCutoffTheLabelAndUnknownColumnsAreNotEncoded() {
        assertEquals("""
                club.yaml:25:3: member_id is the entity key: keys identify rows and are never encoded
                club.yaml:26:3: the cutoff dates rows and is never encoded
                club.yaml:27:3: complains_in_30d is the label: encoding it would hand the model its answer
                club.yaml:28:3: there is no output column 'zones' to encode (did you mean zone?)""",
                errors("""
                        encode:
                          member_id: one-hot
                          cutoff: one-hot
                          complains_in_30d: target-mean
                          zones: one-hot
                        """));
    }

    @Test
    void numberStepsNeedNumbersAndChainsMustMakeSense() {
        assertEquals("""
                club.yaml:25:10: standardise needs a number column, but zone holds text
                club.yaml:26:10: one-hot reads the value as a level and must be the only encoding of tier (it has a \
                missing column of its own)
                club.yaml:27:11: bins must be the last step: it turns the value into a bin number
                club.yaml:28:36: missing after impute would always be 0: put missing before impute
                club.yaml:29:35: log1p after standardise: standardised values are often below -1, where log1p is \
                undefined; put log1p first
                club.yaml:29:42: log1p appears twice in the encoding of rides_sum_km_30d
                club.yaml:29:42: log1p after standardise: standardised values are often below -1, where log1p is \
                undefined; put log1p first""",
                errors("""
                        encode:
                          zone: [standardise]
                          tier: [one-hot, missing]
                          fee: [{ bins: 3 }, log1p]
                          rides_count_30d: [{ impute: 0 }, missing]
                          rides_sum_km_30d: [standardise, log1p, log1p]
                        """));
    }

    @Test
    void aTargetMeanNeedsALabel() {
        String withoutLabel = Club.RECIPE.replace(
                "label: { name: complains_in_30d, from: complaints, horizon: 30d, value: exists }\n", "");
        QuernException e = assertThrows(QuernException.class, () -> Club.recipe(folder, withoutLabel
                + "encode:\n  zone: target-mean\n").compile());
        assertEquals("club.yaml:24:9: target-mean needs a label: the recipe has none", e.getMessage());
    }

    @Test
    void theTestPartMustStartAtLeastAHorizonAfterTheLastTrainingCutoff() {
        // With a 60-day horizon the labels of 2025-03-31 run to 2025-05-30, past the test cutoff 2025-04-30;
        // those of 2025-02-28 run to 2025-04-29 and would leave the test period alone.
        QuernException e = assertThrows(QuernException.class, () -> Club.recipe(folder, Club.RECIPE
                .replace("horizon: 30d", "horizon: 60d") + """
                split:
                  train: { to: 2025-03-31 }
                  test: { from: 2025-04-30 }
                """).compile());
        assertEquals("club.yaml:26:9: the test part starts at cutoff 2025-04-30, but the labels of the training "
                + "cutoff 2025-03-31 run to 2025-05-30: leave at least the label's 60d horizon between the last "
                + "training cutoff and the first test cutoff (end train by 2025-02-28, or start test later)",
                e.getMessage());
    }

    @Test
    void aTestPartExactlyOneHorizonLaterIsAccepted() {
        // 2025-03-31 to 2025-04-30 is 30 days: the training labels end with the test cutoff's day.
        Club.recipe(folder, Club.RECIPE + """
                split:
                  train: { to: 2025-03-31 }
                  test: { from: 2025-04-30 }
                """).compile();
    }

    @Test
    void splitPartsMustHoldCutoffsAndNotOverlap() {
        assertEquals("""
                club.yaml:26:15: no cutoff of the recipe falls in the validation part (2026-01-01 to the last cutoff)
                club.yaml:27:9: cutoff 2025-02-28 falls in both the train and the test part: parts must not overlap""",
                errors("""
                        split:
                          train: { to: 2025-02-28 }
                          validation: { from: 2026-01-01 }
                          test: { from: 2025-02-28 }
                        """));
    }
}
