package dev.quern.audit;

import dev.quern.Position;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * One thing the audit found: the check, how much it matters, the output columns involved, a sentence that
 * says what was found, the counts behind it, a few example rows, and the fix in one sentence. A finding the
 * recipe acknowledges carries the recipe's reason and no longer blocks.
 *
 * @param at where the recipe defines the columns involved, for messages; {@link Position#NONE} when none
 */
public record Finding(Check check, Severity severity, List<String> columns, String summary,
                      Map<String, Object> counts, List<String> examples, String fix, Position at,
                      Optional<Acknowledged> acknowledged) {

    /** The recipe's acknowledgement of a finding: why the columns are safe all the same, and where it says so. */
    public record Acknowledged(String reason, Position at) {
        public Acknowledged {
            Objects.requireNonNull(reason, "reason");
            Objects.requireNonNull(at, "at");
        }
    }

    public Finding {
        Objects.requireNonNull(check, "check");
        Objects.requireNonNull(severity, "severity");
        columns = List.copyOf(columns);
        Objects.requireNonNull(summary, "summary");
        counts = Collections.unmodifiableMap(new LinkedHashMap<>(counts));
        examples = List.copyOf(examples);
        Objects.requireNonNull(fix, "fix");
        Objects.requireNonNull(at, "at");
        Objects.requireNonNull(acknowledged, "acknowledged");
    }

    /** A finding not yet acknowledged. */
    static Finding of(Check check, Severity severity, List<String> columns, String summary, Map<String, Object> counts,
                      List<String> examples, String fix, Position at) {
        return new Finding(check, severity, columns, summary, counts, examples, fix, at, Optional.empty());
    }

    /** True when the finding counts against the build: it is not acknowledged. */
    public boolean isOpen() {
        return acknowledged.isEmpty();
    }

    /** True when the finding stops the build. */
    public boolean blocks() {
        return severity == Severity.BLOCKING && isOpen();
    }

    Finding acknowledge(Acknowledged by) {
        return new Finding(check, severity, columns, summary, counts, examples, fix, at, Optional.of(by));
    }
}
