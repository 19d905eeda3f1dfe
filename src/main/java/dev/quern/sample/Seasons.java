package dev.quern.sample;

import java.time.DayOfWeek;
import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.SplittableRandom;

/**
 * The rhythms every member shares: more joining and riding in spring and summer, and a day-by-day
 * weather factor so that a wet day is quiet for the whole club at once, as real ride counts are.
 */
final class Seasons {

    /** Riding by calendar month, January first: winter roughly half of midsummer. */
    private static final double[] RIDING = {0.50, 0.55, 0.75, 0.95, 1.15, 1.30, 1.35, 1.25, 1.10, 0.90, 0.65, 0.50};
    /** Joining by calendar month: sign-ups follow the good weather a little ahead of riding. */
    private static final double[] JOINING = {0.55, 0.65, 1.05, 1.45, 1.60, 1.50, 1.35, 1.15, 1.10, 0.85, 0.65, 0.45};

    private final double[] weather;

    private Seasons(double[] weather) {
        this.weather = weather;
    }

    static Seasons draw(SplittableRandom random) {
        int days = (int) Timeline.FIRST_DAY.until(Timeline.LAST_DAY.plusDays(1), ChronoUnit.DAYS);
        double[] weather = new double[days];
        for (int i = 0; i < days; i++) {
            // About one day in six is wet enough to keep most riders at home.
            weather[i] = random.nextDouble() < 0.16 ? 0.25 + 0.3 * random.nextDouble() : 0.9 + 0.25 * random.nextDouble();
        }
        return new Seasons(weather);
    }

    double riding(LocalDate day) {
        return RIDING[day.getMonthValue() - 1] * weather[(int) (day.toEpochDay() - Timeline.FIRST_DAY.toEpochDay())];
    }

    static double joining(LocalDate day) {
        // The club grows: the second year brings a fifth more sign-ups than the first.
        double growth = day.getYear() == Timeline.FIRST_DAY.getYear() ? 1.0 : 1.2;
        return JOINING[day.getMonthValue() - 1] * growth;
    }

    static boolean isWeekend(LocalDate day) {
        DayOfWeek dow = day.getDayOfWeek();
        return dow == DayOfWeek.SATURDAY || dow == DayOfWeek.SUNDAY;
    }
}
