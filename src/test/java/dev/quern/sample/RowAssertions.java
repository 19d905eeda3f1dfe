package dev.quern.sample;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;

/** Table comparisons that name the first differing row instead of printing whole tables. */
final class RowAssertions {

    private RowAssertions() {
    }

    static void assertSameRows(String table, List<List<Object>> expected, List<List<Object>> actual) {
        int shared = Math.min(expected.size(), actual.size());
        for (int i = 0; i < shared; i++) {
            assertEquals(expected.get(i), actual.get(i), table + " row " + (i + 1));
        }
        assertEquals(expected.size(), actual.size(), table + " row count");
    }
}
