package dev.quern.audit;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Set;
import org.junit.jupiter.api.Test;

/** The audit's first look for keys repeated within a cutoff: every repeat becomes a candidate, nothing else. */
class KeyRepeatsTest {

    @Test
    void aKeyRepeatedWithinACutoffIsACandidateAndOneRepeatedAcrossCutoffsIsNot() {
        MatrixScan.KeyRepeats repeats = new MatrixScan.KeyRepeats();
        // Far more keys than the set first holds, so it grows while it counts.
        for (int key = 0; key < 100_000; key++) {
            repeats.add(Integer.toString(key), "2025-01-31");
        }
        repeats.add("77", "2025-01-31");
        repeats.add("99999", "2025-01-31");
        for (int key = 0; key < 100_000; key += 2) {
            repeats.add(Integer.toString(key), "2025-02-28");
        }
        repeats.add("4", "2025-02-28");
        repeats.add("4", "2025-02-28");
        repeats.endCutoff();

        assertEquals(Set.of(MatrixScan.cutoffHash("77", "2025-01-31"), MatrixScan.cutoffHash("99999", "2025-01-31"),
                MatrixScan.cutoffHash("4", "2025-02-28")), repeats.candidates);
    }
}
