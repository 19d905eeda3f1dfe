package dev.quern.run;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.apache.commons.csv.CSVPrinter;
import org.junit.jupiter.api.Test;

/** The matrix's own CSV writer against commons-csv's {@code CSVPrinter}: the same characters, always. */
class CsvRecordsTest {

    /** Values at the edges of commons-csv's minimal quoting, and plain ones beside them. */
    private static final List<String> AWKWARD = List.of("", " ", "  ", " a", "a ", "a b", "a  b", "#", "#a", "a#",
            "!a", "\"", "\"a\"", "a\"b", "a,b", ",", "a\nb", "\n", "a\rb", "a\r\n", "\t", "a\t", "\ta", "a\tb",
            "é", "日本", "naïve", "-", "--", "-1", "-1.5", "+3", "1e-5", "0", "12.25", "NaN", "-Infinity", "$1",
            "%", "&", "'", "'a'", "(", "a;b", "2024-01-31", "2024-01-31 10:00:00", "a/b", "_x", ":x", "x:",
            "A_b-9.0+z", "\u0000", "a\u0000", "\u001fa", "~", "{}", "\\", "a\\b", "\u00a0", "a\u00a0", "\uD83D\uDEB2", "a \uD83D\uDEB2");

    @Test
    void writesEveryAwkwardValueAsCsvPrinterDoesFirstInsideAndLast() throws IOException {
        List<String[]> records = new ArrayList<>();
        for (String v : AWKWARD) {
            records.add(new String[] {v});
            records.add(new String[] {v, "x"});
            records.add(new String[] {"x", v});
            records.add(new String[] {"x", v, "y"});
            records.add(new String[] {v, v, v});
        }

        assertSameAsCsvPrinter(records);
    }

    @Test
    void writesEmptyValuesAndEmptyRecordsAsCsvPrinterDoes() throws IOException {
        assertSameAsCsvPrinter(List.of(new String[] {""}, new String[] {"", ""}, new String[] {"", "", "a"},
                new String[] {"a", "", ""}, new String[] {null, "a", null}));
    }

    @Test
    void writesRandomValuesAsCsvPrinterDoes() throws IOException {
        // Mostly the plain characters, with a sprinkle of each kind that can force quotes, at every position.
        String alphabet = "abcXYZ0189.-+_:/ #!\"',\n\r\t;é$";
        SplittableRandom random = new SplittableRandom(20250131);
        List<String[]> records = new ArrayList<>();
        for (int r = 0; r < 20_000; r++) {
            String[] record = new String[1 + random.nextInt(6)];
            for (int i = 0; i < record.length; i++) {
                StringBuilder v = new StringBuilder();
                int length = random.nextInt(5);
                for (int k = 0; k < length; k++) {
                    v.append(alphabet.charAt(random.nextInt(alphabet.length())));
                }
                record[i] = v.toString();
            }
            records.add(record);
        }

        // 20,000 records are far more than one buffered chunk, so chunk boundaries are crossed too.
        assertSameAsCsvPrinter(records);
    }

    @Test
    void callsPlainOnlyWhatNeedsNoQuotes() {
        assertTrue(CsvRecords.plain("-12.5"));
        assertTrue(CsvRecords.plain("2024-01-31 10:00:00"));
        assertFalse(CsvRecords.plain(""), "empty, which is quoted first in a record");
        assertFalse(CsvRecords.plain(" a"), "a leading space is at or below '#'");
        assertFalse(CsvRecords.plain("a "), "a trailing space is trimmable");
        assertFalse(CsvRecords.plain("#a"), "'#' is the comment marker's bound");
        assertFalse(CsvRecords.plain("é"), "outside the plain set, left to commons-csv");
    }

    @Test
    void everyNumberInANumberColumnIsWrittenAsPlainText() {
        // The writer takes the text of a Number in a number column as plain without looking at it.
        List<Number> numbers = List.of(0L, -0.0, 0.0, 7, (short) -3, (byte) 9, Long.MIN_VALUE, Long.MAX_VALUE,
                Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.MIN_VALUE, -Double.MAX_VALUE,
                1e-300, 123456789.125, 0.1f, new java.math.BigDecimal("-1234567890123456789012.50"),
                new java.math.BigInteger("99999999999999999999999"), 1e22, -2.5e-7);
        for (Number n : numbers) {
            for (dev.quern.schema.ValueType type : List.of(dev.quern.schema.ValueType.INTEGER,
                    dev.quern.schema.ValueType.DECIMAL)) {
                String text = ValueFormat.format(n, type);
                assertTrue(CsvRecords.plain(text), type + " " + n + " is written as '" + text + "'");
            }
        }
    }

    @Test
    void numbersMarkedAsSuchAreWrittenAsTheyAre() throws IOException {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        CsvRecords csv = new CsvRecords(out);
        csv.write(new String[] {"12.5", "", "a b", "-3"}, new boolean[] {true, false, false, true});
        csv.flush();

        assertEquals("12.5,,a b,-3\n", out.toString(StandardCharsets.UTF_8));
    }

    private static void assertSameAsCsvPrinter(List<String[]> records) throws IOException {
        StringWriter expected = new StringWriter();
        try (CSVPrinter printer = new CSVPrinter(expected, MatrixWriter.FORMAT)) {
            for (String[] r : records) {
                printer.printRecord((Object[]) r);
            }
        }
        ByteArrayOutputStream actual = new ByteArrayOutputStream();
        CsvRecords csv = new CsvRecords(actual);
        for (String[] r : records) {
            csv.write(r);
        }
        csv.flush();

        // The bytes of the file: commons-csv's characters in UTF-8.
        assertArrayEquals(expected.toString().getBytes(StandardCharsets.UTF_8), actual.toByteArray());
    }
}
