package dev.quern.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** The Population Stability Index against its published check value, its empty-bin rule and its reading. */
class PsiTest {

    @Test
    void agreesWithTheWorkedValueOfReferenceValues() {
        // REFERENCE-VALUES.md, "Population Stability Index": reference shares (0.4, 0.3, 0.3) against new
        // shares (0.35, 0.25, 0.4) give 0.0445609, computed from PSI = sum (A - E) ln(A / E); any
        // implementation must agree to 1e-6.
        double psi = Psi.of(new double[] {0.4, 0.3, 0.3}, new double[] {0.35, 0.25, 0.4});

        assertEquals(0.0445609, psi, 1e-6);
    }

    @Test
    void countsGiveTheSameValueAsTheirShares() {
        assertEquals(0.0445609, Psi.ofCounts(new long[] {40, 30, 30}, new long[] {70, 50, 80}), 1e-6);
    }

    @Test
    void identicalRunsHaveNoShift() {
        assertEquals(0.0, Psi.ofCounts(new long[] {5, 0, 17, 3}, new long[] {10, 0, 34, 6}), 0.0);
    }

    @Test
    void aBinWithoutRowsInOneRunCountsAsAShareOfOneInTenThousand() {
        // Old shares (0.5, 0.5, 0), new (0.5, 0.4, 0.1): the empty old bin counts as 0.0001, the other
        // shares are not rescaled. Worked by hand from the formula:
        //   (0.4 - 0.5) ln(0.4 / 0.5) + (0.1 - 0.0001) ln(0.1 / 0.0001) = 0.0223144 + 0.6900848 = 0.7123992
        double expected = (0.4 - 0.5) * Math.log(0.4 / 0.5) + (0.1 - 0.0001) * Math.log(0.1 / 0.0001);

        assertEquals(0.7123992, expected, 1e-7);
        assertEquals(expected, Psi.ofCounts(new long[] {50, 50, 0}, new long[] {50, 40, 10}), 1e-12);
        assertEquals(Psi.Reading.LARGE, Psi.Reading.of(expected), "a level from nowhere in 10% of rows is large");
    }

    @Test
    void theRuleIsSymmetricForABinThatEmptiedAndABinEmptyInBothAddsNothing() {
        double emptied = Psi.ofCounts(new long[] {50, 40, 10, 0}, new long[] {50, 50, 0, 0});
        double expected = (0.5 - 0.4) * Math.log(0.5 / 0.4) + (0.0001 - 0.1) * Math.log(0.0001 / 0.1);

        assertEquals(expected, emptied, 1e-12);
        assertTrue(Double.isFinite(emptied));
    }

    @Test
    void readsTheBandsOfCreditScoring() {
        // Siddiqi 2017, Intelligent Credit Scoring, 2nd ed. (as quoted in REFERENCE-VALUES.md): below
        // 0.10 no significant shift, 0.10-0.25 moderate, above 0.25 significant.
        assertEquals(Psi.Reading.STABLE, Psi.Reading.of(0.0));
        assertEquals(Psi.Reading.STABLE, Psi.Reading.of(0.0999));
        assertEquals(Psi.Reading.MODERATE, Psi.Reading.of(0.10));
        assertEquals(Psi.Reading.MODERATE, Psi.Reading.of(0.25));
        assertEquals(Psi.Reading.LARGE, Psi.Reading.of(0.2501));
        assertEquals("moderate shift", Psi.Reading.MODERATE.label());
    }

    @Test
    void aRunWithoutRowsHasNoIndex() {
        assertTrue(Double.isNaN(Psi.ofCounts(new long[] {1, 2}, new long[] {0, 0})));
    }

    @Test
    void bothRunsNeedTheSameBins() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Psi.of(new double[] {0.5, 0.5}, new double[] {1.0}));
        assertEquals("both runs need the same bins: 2 and 1", e.getMessage());
    }
}
