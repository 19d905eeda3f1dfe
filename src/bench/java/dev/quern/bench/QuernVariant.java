package dev.quern.bench;

import java.util.List;

/**
 * One way of running {@code quern build} that the benchmark times: a name for the results and the extra
 * command-line options that select it (none for the default build).
 */
record QuernVariant(String name, List<String> options) {

    QuernVariant {
        options = List.copyOf(options);
    }

    static final QuernVariant DEFAULT = new QuernVariant("quern", List.of());
}
