package dev.quern.sample;

import java.time.LocalDate;
import java.util.Arrays;
import java.util.SplittableRandom;

/** When members join: any day up to {@link Timeline#LAST_JOIN_DAY}, more of them in spring and summer. */
final class JoinCalendar {

    private JoinCalendar() {
    }

    /** Join instants in ascending order, so that member ids follow the order of joining. */
    static long[] draw(int members, SplittableRandom random) {
        int days = (int) (Timeline.LAST_JOIN_DAY.toEpochDay() - Timeline.FIRST_DAY.toEpochDay()) + 1;
        double[] cumulative = new double[days];
        double total = 0;
        for (int i = 0; i < days; i++) {
            total += Seasons.joining(Timeline.FIRST_DAY.plusDays(i));
            cumulative[i] = total;
        }
        long[] joins = new long[members];
        for (int m = 0; m < members; m++) {
            int found = Arrays.binarySearch(cumulative, random.nextDouble() * total);
            int day = found >= 0 ? found : -found - 1;
            LocalDate joinedOn = Timeline.FIRST_DAY.plusDays(Math.min(day, days - 1));
            // Sign-ups come in while people are awake.
            joins[m] = Timeline.secondOf(joinedOn) + Draws.uniform(random, 7 * Timeline.HOUR, 22 * Timeline.HOUR);
        }
        Arrays.sort(joins);
        return joins;
    }
}
