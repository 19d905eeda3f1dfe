package dev.quern.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.QuernException;
import java.time.LocalDate;
import java.time.LocalDateTime;
import org.junit.jupiter.api.Test;

/** Every form an engine hands a scanned row's day over in reads as the same yyyymmdd number. */
class DaysTest {

    @Test
    void textDatesTimesAndDayNumbersAgree() {
        int expected = 2025_02_28;
        assertEquals(expected, Days.of("2025-02-28", "rides.started_at"));
        assertEquals(expected, Days.of(LocalDate.of(2025, 2, 28), "rides.started_at"));
        assertEquals(expected, Days.of(java.sql.Date.valueOf("2025-02-28"), "rides.started_at"));
        assertEquals(expected, Days.of(LocalDateTime.of(2025, 2, 28, 23, 59), "rides.started_at"));
        assertEquals(expected, Days.of(2025_02_28, "rides.started_at"));
        assertEquals(expected, Days.of(2025_02_28L, "rides.started_at"));
    }

    @Test
    void aNumberThatIsNoDayNumberSaysWhereItCameFrom() {
        QuernException e = assertThrows(QuernException.class, () -> Days.of(20_250_228_1L, "rides.started_at"));
        assertTrue(e.getMessage().contains("rides.started_at"), e.getMessage());
        assertThrows(QuernException.class, () -> Days.of(-5, "rides.started_at"));
        assertThrows(QuernException.class, () -> Days.of("2025/02/28", "rides.started_at"));
    }

    /**
     * Days.epochDay counts by arithmetic; java.time's calendar is the reference, for every month of years 0 to
     * 9999, days past a month's end (which run on into the next month) and months that do not exist.
     */
    @Test
    void epochDaysCountAsJavaTimeDoes() {
        for (int year = 0; year <= 9999; year++) {
            for (int month = 0; month <= 13; month++) {
                for (int dayOfMonth : new int[] {0, 1, 15, 28, 29, 30, 31, 32, 99}) {
                    int day = year * 10_000 + month * 100 + dayOfMonth;
                    long expected = month < 1 || month > 12 ? Days.NO_DAY
                            : LocalDate.of(year, month, 1).plusDays(dayOfMonth - 1L).toEpochDay();
                    assertEquals(expected, Days.epochDay(day), "day " + day);
                }
            }
        }
    }
}
