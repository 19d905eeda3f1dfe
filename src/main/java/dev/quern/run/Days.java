package dev.quern.run;

import dev.quern.QuernException;
import java.time.LocalDate;
import java.time.LocalDateTime;

/**
 * A row's day as the number {@code yyyymmdd}, which orders as the engine orders the day it read: ISO text
 * compares as text, and a date as a date. Reading the digits rather than parsing a date keeps SQLite's
 * text semantics exactly, even for a day such as {@code 2024-02-30} that SQLite would compare all the same.
 */
final class Days {

    private Days() {
    }

    static int of(LocalDate day) {
        return day.getYear() * 10_000 + day.getMonthValue() * 100 + day.getDayOfMonth();
    }

    /**
     * The day an engine returned for a row: ISO text, a date, a time whose date is the day, or the number
     * {@code yyyymmdd} an engine computed for it.
     */
    static int of(Object value, String column) {
        if (value instanceof String s) {
            return ofText(s, column);
        }
        if (value instanceof Integer || value instanceof Long) {
            long day = ((Number) value).longValue();
            if (day < 1_01_01 || day > 9999_12_31L) {
                throw QuernException.data(column + " gave the day number " + value + ", not yyyymmdd;"
                        + " build with --shape range-join to compare it in SQL");
            }
            return (int) day;
        }
        if (value instanceof LocalDate d) {
            return of(d);
        }
        if (value instanceof java.sql.Date d) {
            return of(d.toLocalDate());
        }
        if (value instanceof LocalDateTime t) {
            return of(t.toLocalDate());
        }
        throw QuernException.data(column + " gave the value " + value + " (" + value.getClass().getSimpleName()
                + "), which Quern cannot read as a day; build with --shape range-join to compare it in SQL");
    }

    private static int ofText(String s, String column) {
        if (s.length() != 10 || s.charAt(4) != '-' || s.charAt(7) != '-') {
            throw notIso(s, column);
        }
        int value = 0;
        for (int i = 0; i < 10; i++) {
            if (i == 4 || i == 7) {
                continue;
            }
            char c = s.charAt(i);
            if (c < '0' || c > '9') {
                throw notIso(s, column);
            }
            value = value * 10 + (c - '0');
        }
        return value;
    }

    private static QuernException notIso(String s, String column) {
        return QuernException.data(column + " holds '" + s + "', which does not start with a YYYY-MM-DD date;"
                + " store times as ISO text (2024-03-31 08:15:00), or build with --shape range-join");
    }

    /** What {@link #epochDay} gives for a day whose month does not exist. */
    static final long NO_DAY = Long.MIN_VALUE;

    /**
     * The day as {@code LocalDate.toEpochDay} counts, a day past the month's end counting on into the next
     * month as SQLite's julianday() does; {@link #NO_DAY} for a month that does not exist. The ordered scan
     * takes it once per row, and the days since it at a cutoff are then one subtraction.
     */
    static long epochDay(int day) {
        int month = day / 100 % 100;
        if (month < 1 || month > 12) {
            return NO_DAY;
        }
        return firstOfMonth(day / 10_000, month) + day % 100 - 1;
    }

    /**
     * The epoch day of the first of {@code month} in {@code year} (0 to 9999), as {@code LocalDate.toEpochDay}
     * counts it: this runs once per row of a scan, where building a {@code LocalDate} was a tenth of a scan.
     */
    static long firstOfMonth(int year, int month) {
        long days = 365L * year + (year + 3) / 4 - (year + 99) / 100 + (year + 399) / 400 + (367L * month - 362) / 12;
        if (month > 2) {
            boolean leap = year % 4 == 0 && (year % 100 != 0 || year % 400 == 0);
            days -= leap ? 1 : 2;
        }
        return days - DAYS_0000_TO_1970;
    }

    /** Days from 0000-01-01 to 1970-01-01 in the proleptic Gregorian calendar. */
    private static final long DAYS_0000_TO_1970 = 719_528L;
}
