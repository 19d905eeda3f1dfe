package dev.quern.encode;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.apache.commons.math3.stat.descriptive.moment.Mean;
import org.apache.commons.math3.stat.descriptive.moment.StandardDeviation;
import org.junit.jupiter.api.Test;

/**
 * The mean and sample standard deviation standardisation divides by, against Apache Commons Math 3.6.1
 * ({@code Mean}, and {@code StandardDeviation}, which is bias-corrected, n - 1, by default) and against the
 * certified values of NIST StRD univariate summary statistics (NumAcc3 and NumAcc4; tolerances as in
 * REFERENCE-VALUES.md).
 */
class RunningMomentsTest {

    @Test
    void meanAndSampleSdAgreeWithCommonsMath() {
        Random random = new Random(7);
        for (int trial = 0; trial < 50; trial++) {
            int n = 2 + random.nextInt(2000);
            double[] values = new double[n];
            RunningMoments moments = new RunningMoments();
            for (int i = 0; i < n; i++) {
                values[i] = 1000 + random.nextGaussian() * (1 + trial);
                moments.add(values[i]);
            }
            double mean = new Mean().evaluate(values);
            double sd = new StandardDeviation().evaluate(values);
            assertEquals(mean, moments.mean(), 1e-12 * Math.abs(mean), "mean, trial " + trial);
            assertEquals(sd, moments.sampleSd(), 1e-9 * sd, "sd, trial " + trial);
        }
    }

    @Test
    void certifiedValuesOfNistNumAcc3AndNumAcc4() {
        // NIST StRD NumAcc3: 1000000.2, then 500 times 1000000.1, 1000000.3; certified mean 1000000.2, sd 0.1.
        // NumAcc4: the same about 10000000.2. Relative tolerances 1e-9 and 1e-8 (REFERENCE-VALUES.md).
        RunningMoments three = pairs(1000000.2, 1000000.1, 1000000.3);
        assertEquals(1000000.2, three.mean(), 1e-9 * 1000000.2);
        assertEquals(0.1, three.sampleSd(), 1e-9 * 0.1);
        RunningMoments four = pairs(10000000.2, 10000000.1, 10000000.3);
        assertEquals(10000000.2, four.mean(), 1e-9 * 10000000.2);
        assertEquals(0.1, four.sampleSd(), 1e-8 * 0.1);
    }

    @Test
    void oneValueHasNoSampleSd() {
        RunningMoments one = new RunningMoments();
        one.add(5);
        assertEquals(5.0, one.mean(), 0.0);
        assertTrue(Double.isNaN(one.sampleSd()));
        assertTrue(Double.isNaN(new RunningMoments().mean()));
    }

    private static RunningMoments pairs(double first, double a, double b) {
        RunningMoments m = new RunningMoments();
        m.add(first);
        for (int i = 0; i < 500; i++) {
            m.add(a);
            m.add(b);
        }
        return m;
    }
}
