package dev.quern.encode;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** The smoothed target mean's formula against a published worked value. */
class MEstimateTest {

    @Test
    void threePositivesOfFourRowsWithPriorPointTwoAndMTenGiveTheWorkedValue() {
        // Cestnik (1990), "Estimating probabilities: a crucial task in machine learning", ECAI 90, pp. 147-149:
        // (r + m * prior) / (n + m) with r = 3 of n = 4, prior 0.2, m = 10 is 0.357142857142857
        // (check value as given in /work/shared/REFERENCE-VALUES.md).
        assertEquals(0.357142857142857, TargetStatistics.mEstimate(4, 3, 0.2, 10), 1e-15);
    }

    @Test
    void theTwoFormsOfTheMEstimateAgree() {
        // (n * mean + m * prior) / (n + m) with mean = r / n is the same number.
        double n = 4;
        double mean = 3.0 / 4.0;
        assertEquals((n * mean + 10 * 0.2) / (n + 10), TargetStatistics.mEstimate(n, 3, 0.2, 10), 1e-15);
    }

    @Test
    void aLevelWithoutRowsIsThePriorAndMZeroIsThePlainMean() {
        assertEquals(0.2, TargetStatistics.mEstimate(0, 0, 0.2, 10), 0.0);
        assertEquals(0.75, TargetStatistics.mEstimate(4, 3, 0.2, 0), 0.0);
        assertEquals(0.2, TargetStatistics.mEstimate(0, 0, 0.2, 0), 0.0, "no rows and no weight: the prior");
    }
}
