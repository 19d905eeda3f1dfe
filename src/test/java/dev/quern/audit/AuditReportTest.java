package dev.quern.audit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Position;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** audit.json and audit.md, whole text: the schema docs/audit.md documents and the report people read. */
class AuditReportTest {

    private static final Position HOME_ZONE = new Position("churn.yaml", 40, 5);

    private static AuditReport report() {
        Finding homeZone = Finding.of(Check.CURRENT_STATE, Severity.BLOCKING, List.of("home_zone"),
                "home_zone reads members.home_zone, and members keeps no time or history.",
                Map.of("rows_read", 10L), List.of("member_id 1 at cutoff 2025-03-31: updated_at 2025-05-01 10:00:00"),
                "Read it from a history table, or acknowledge it.", HOME_ZONE)
                .acknowledge(new Finding.Acknowledged("Set at sign-up, never changed.", new Position("churn.yaml", 50, 7)));
        Finding copy = Finding.of(Check.SINGLE_FEATURE, Severity.WARNING, List.of("notices_count_60d"),
                "notices_count_60d alone predicts the label almost perfectly: AUC 1.000.", Map.of("auc", 1.0),
                List.of(), "Find out why.", Position.NONE);
        return new AuditReport("churn", 0.95, 0.9, List.of(
                new CheckResult(Check.TIME_ORDER, true, "0 of 12 rows are dated after their cutoff."),
                new CheckResult(Check.CURRENT_STATE, true, "1 of 2 features read members."),
                new CheckResult(Check.SINGLE_FEATURE, true, "2 columns screened."),
                new CheckResult(Check.TIME_SPLIT, false, "The recipe has no split.")),
                List.of(homeZone, copy));
    }

    @Test
    void auditJsonHasTheDocumentedSchema() {
        assertEquals("""
                {
                  "format": "quern-audit/1",
                  "recipe": "churn",
                  "outcome": "passed",
                  "summary": {
                    "blocking": 0,
                    "warnings": 1,
                    "notes": 0,
                    "acknowledged": 1
                  },
                  "thresholds": {
                    "auc": 0.95,
                    "rho": 0.9
                  },
                  "checks": [
                    {
                      "check": "time-order",
                      "title": "every source row that fed a row is dated on or before its cutoff",
                      "result": "pass",
                      "evidence": "0 of 12 rows are dated after their cutoff."
                    },
                    {
                      "check": "current-state",
                      "title": "no feature reads a table that keeps no time or history",
                      "result": "acknowledged",
                      "evidence": "1 of 2 features read members."
                    },
                    {
                      "check": "single-feature",
                      "title": "no column alone predicts the label almost perfectly",
                      "result": "warning",
                      "evidence": "2 columns screened."
                    },
                    {
                      "check": "time-split",
                      "title": "no training label is observed in a later part of the split",
                      "result": "not applicable",
                      "evidence": "The recipe has no split."
                    }
                  ],
                  "findings": [
                    {
                      "check": "current-state",
                      "severity": "blocking",
                      "columns": ["home_zone"],
                      "summary": "home_zone reads members.home_zone, and members keeps no time or history.",
                      "counts": {
                        "rows_read": 10
                      },
                      "examples": ["member_id 1 at cutoff 2025-03-31: updated_at 2025-05-01 10:00:00"],
                      "fix": "Read it from a history table, or acknowledge it.",
                      "defined_at": "churn.yaml:40:5",
                      "acknowledged": {
                        "reason": "Set at sign-up, never changed.",
                        "at": "churn.yaml:50:7"
                      }
                    },
                    {
                      "check": "single-feature",
                      "severity": "warning",
                      "columns": ["notices_count_60d"],
                      "summary": "notices_count_60d alone predicts the label almost perfectly: AUC 1.000.",
                      "counts": {
                        "auc": 1
                      },
                      "examples": [],
                      "fix": "Find out why.",
                      "defined_at": null,
                      "acknowledged": null
                    }
                  ]
                }
                """, report().json());
    }

    @Test
    void auditMarkdownHasATableOfChecksThenTheFindings() {
        assertEquals("""
                # Leakage audit: churn

                **Passed.** No blocking finding is open; 1 warning to read below.

                Open: 0 blocking, 1 warning(s), 0 note(s); 1 finding(s) acknowledged in the recipe.

                | check | result | evidence |
                | --- | --- | --- |
                | time-order | pass | 0 of 12 rows are dated after their cutoff. |
                | current-state | acknowledged | 1 of 2 features read members. |
                | single-feature | warning | 2 columns screened. |
                | time-split | not applicable | The recipe has no split. |

                Each check in one line:

                - `time-order`: every source row that fed a row is dated on or before its cutoff.
                - `current-state`: no feature reads a table that keeps no time or history.
                - `single-feature`: no column alone predicts the label almost perfectly.
                - `time-split`: no training label is observed in a later part of the split.

                ## Findings

                ### current-state: home_zone (blocking, acknowledged)

                home_zone reads members.home_zone, and members keeps no time or history.

                - defined at: churn.yaml:40:5
                - counts: rows_read 10
                - examples:
                  - member_id 1 at cutoff 2025-03-31: updated_at 2025-05-01 10:00:00
                - fix: Read it from a history table, or acknowledge it.
                - acknowledged at churn.yaml:50:7: Set at sign-up, never changed.

                ### single-feature: notices_count_60d (warning)

                notices_count_60d alone predicts the label almost perfectly: AUC 1.000.

                - counts: auc 1.0
                - fix: Find out why.
                """, report().markdown());
    }

    @Test
    void anOpenBlockingFindingBlocksAndBecomesADiagnosticAtItsRecipeLine() {
        Finding open = Finding.of(Check.FILLED_LATER, Severity.BLOCKING, List.of("satisfaction_mean_90d"),
                "3 of 9 rows had satisfaction filled in after their cutoff.", Map.of(), List.of(), "Filter.", HOME_ZONE);
        AuditReport blocked = new AuditReport("churn", 0.95, 0.95, List.of(), List.of(open));
        assertTrue(blocked.blocked());
        assertEquals("blocked: 1 blocking, 0 warning(s), 0 note(s)", blocked.summary());
        assertEquals("churn.yaml:40:5: leakage audit, filled-later: 3 of 9 rows had satisfaction filled in after"
                + " their cutoff.", blocked.blocking().get(0).render());
        assertFalse(report().blocked(), "an acknowledged blocking finding does not block");
    }
}
