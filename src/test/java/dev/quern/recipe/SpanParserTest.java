package dev.quern.recipe;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Diagnostic;
import dev.quern.Diagnostics;
import dev.quern.Position;
import java.time.LocalDate;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

class SpanParserTest {

    private static final Position AT = new Position("s.yaml", 3, 7);

    private static Span ok(String text) {
        Diagnostics d = new Diagnostics();
        Optional<Span> span = SpanParser.parse(text, AT, d);
        assertTrue(d.isEmpty(), () -> d.all().toString());
        return span.orElseThrow();
    }

    private static List<String> errors(String text) {
        Diagnostics d = new Diagnostics();
        assertEquals(Optional.empty(), SpanParser.parse(text, AT, d));
        return d.all().stream().map(Diagnostic::render).toList();
    }

    @Test
    void readsEachUnit() {
        assertEquals(new Span(7, WindowUnit.DAY, AT), ok("7d"));
        assertEquals(new Span(12, WindowUnit.WEEK, AT), ok("12w"));
        assertEquals(new Span(6, WindowUnit.MONTH, AT), ok("6m"));
        assertEquals(new Span(1, WindowUnit.YEAR, AT), ok("1y"));
    }

    @Test
    void zeroIsReadAndLeftToTheCallerToJudge() {
        assertEquals(0, ok("0d").amount());
    }

    @Test
    void leadingZerosAreTheSameNumber() {
        assertEquals("30d", ok("030d").label());
    }

    @Test
    void calendarMonthsStepFromTheDayBoundary() {
        // 1m before the boundary after 2025-03-31 is the boundary after 2025-02-28
        assertEquals(LocalDate.of(2025, 3, 1), ok("1m").before(LocalDate.of(2025, 4, 1)));
        assertEquals(LocalDate.of(2025, 3, 4), ok("4w").before(LocalDate.of(2025, 4, 1)));
    }

    @Test
    void rejectsWhatIsNotANumberAndAUnit() {
        for (String text : List.of("30x", "30", "d", "", " 30d", "30d ", "30 d", "-7d", "+7d", "1.5m", "30D", "1e3d",
                "30dd", "٣d")) {
            assertEquals(List.of("s.yaml:3:7: '" + text + "' is not a span: write a whole number and d, w, m or y,"
                    + " e.g. 30d"), errors(text), text);
        }
    }

    @Test
    void rejectsNumbersBeyondTheLongestSpan() {
        assertEquals(100_000, ok("100000d").amount());
        assertEquals(List.of("s.yaml:3:7: '100001d' is too long a span: keep the number at most 100000"),
                errors("100001d"));
        assertEquals(List.of("s.yaml:3:7: '99999999999999999999y' is too long a span: keep the number at most 100000"),
                errors("99999999999999999999y"));
    }
}
