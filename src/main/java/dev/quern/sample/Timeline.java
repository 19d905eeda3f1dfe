package dev.quern.sample;

import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.LocalTime;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;

/**
 * The span the sample covers and the text forms its times are stored in. Instants are whole seconds on
 * a zone-less local clock, so that arithmetic is plain {@code long} arithmetic and nothing depends on the
 * machine's time zone.
 */
final class Timeline {

    static final LocalDate FIRST_DAY = LocalDate.of(2024, 1, 1);
    static final LocalDate LAST_DAY = LocalDate.of(2025, 12, 31);
    /** Early enough that even the last joiners have a month of history before the data ends. */
    static final LocalDate LAST_JOIN_DAY = LocalDate.of(2025, 11, 30);

    static final long MINUTE = 60;
    static final long HOUR = 60 * MINUTE;
    static final long DAY = 24 * HOUR;

    /** Every event happens strictly before this instant, so the last one possible is 2025-12-31 23:59:59. */
    static final long END = secondOf(LAST_DAY.plusDays(1));

    private static final DateTimeFormatter TIMESTAMP = DateTimeFormatter.ofPattern("uuuu-MM-dd HH:mm:ss");

    private Timeline() {
    }

    static long secondOf(LocalDate day) {
        return day.toEpochSecond(LocalTime.MIDNIGHT, ZoneOffset.UTC);
    }

    static LocalDate dayOf(long second) {
        return LocalDate.ofEpochDay(Math.floorDiv(second, DAY));
    }

    static String timestamp(long second) {
        return LocalDateTime.ofEpochSecond(second, 0, ZoneOffset.UTC).format(TIMESTAMP);
    }

    static String date(LocalDate day) {
        return day.toString();
    }
}
