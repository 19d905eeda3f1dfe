package dev.quern.encode;

import java.util.Arrays;
import java.util.List;
import java.util.Optional;

/**
 * The encoding steps a recipe can name: the spelling, the option a single value stands for
 * ({@code {bins: 4}} is {@code {bins: {count: 4}}}) and every option the step takes.
 */
enum Kind {
    ONE_HOT("one-hot", "top", List.of("top")),
    FREQUENCY("frequency", "", List.of()),
    TARGET_MEAN("target-mean", "m", List.of("m")),
    BINS("bins", "count", List.of("count")),
    LOG1P("log1p", "", List.of()),
    STANDARDISE("standardise", "", List.of()),
    MISSING("missing", "", List.of()),
    IMPUTE("impute", "with", List.of("with"));

    private final String spelling;
    private final String mainOption;
    private final List<String> options;

    Kind(String spelling, String mainOption, List<String> options) {
        this.spelling = spelling;
        this.mainOption = mainOption;
        this.options = options;
    }

    String spelling() {
        return spelling;
    }

    /** The option a single value stands for; empty when the step takes none. */
    String mainOption() {
        return mainOption;
    }

    List<String> options() {
        return options;
    }

    /** Reads a value as a level of a category: must be the only step of its column. */
    boolean categorical() {
        return this == ONE_HOT || this == FREQUENCY || this == TARGET_MEAN;
    }

    /** Reads and writes numbers. */
    boolean numeric() {
        return this == BINS || this == LOG1P || this == STANDARDISE || this == IMPUTE;
    }

    static Optional<Kind> of(String spelling) {
        return Arrays.stream(values()).filter(k -> k.spelling.equals(spelling)).findFirst();
    }

    static List<String> spellings() {
        return Arrays.stream(values()).map(Kind::spelling).toList();
    }
}
