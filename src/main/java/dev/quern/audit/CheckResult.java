package dev.quern.audit;

import java.util.Objects;

/**
 * How one check came out, with the evidence in a sentence or two: what was examined and what was counted,
 * also when nothing was found, so that a pass says why it is one.
 */
public record CheckResult(Check check, boolean applicable, String evidence) {
    public CheckResult {
        Objects.requireNonNull(check, "check");
        Objects.requireNonNull(evidence, "evidence");
    }
}
