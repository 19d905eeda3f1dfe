package dev.quern.recipe;

import java.util.List;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * The recipe's settings for the leakage audit: the findings it acknowledges and the thresholds of the
 * single-feature screen (AUC at or beyond {@code auc} or at or below {@code 1 - auc}; |Spearman rho| at or
 * beyond {@code rho}). Empty thresholds take the audit's defaults.
 */
public record AuditSpec(List<Acknowledgement> acknowledgements, OptionalDouble auc, OptionalDouble rho) {

    public static final AuditSpec DEFAULT = new AuditSpec(List.of(), OptionalDouble.empty(), OptionalDouble.empty());

    public AuditSpec {
        acknowledgements = List.copyOf(acknowledgements);
        Objects.requireNonNull(auc, "auc");
        Objects.requireNonNull(rho, "rho");
    }
}
