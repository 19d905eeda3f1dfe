package dev.quern.audit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.run.MatrixWriter;
import java.io.IOException;
import java.io.StringReader;
import java.io.StringWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVPrinter;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;

/** The audit's column reader against commons-csv's parser, on files written as the matrix is written. */
class CsvColumnsTest {

    @Test
    void readsTheAskedColumnsAsCommonsCsvDoesOnAwkwardValues() throws IOException {
        // Quotes, delimiters and line ends inside values, empty first and last fields, and values long enough
        // that the reader's buffer ends inside them.
        String alphabet = "ab9.-, \"\n\r#é日";
        SplittableRandom random = new SplittableRandom(7);
        List<String[]> records = new ArrayList<>();
        for (int r = 0; r < 5_000; r++) {
            String[] record = new String[6];
            for (int i = 0; i < record.length; i++) {
                StringBuilder v = new StringBuilder();
                int length = random.nextInt(10) == 0 ? random.nextInt(3_000) : random.nextInt(6);
                for (int k = 0; k < length; k++) {
                    v.append(alphabet.charAt(random.nextInt(alphabet.length())));
                }
                record[i] = v.toString();
            }
            records.add(record);
        }
        String text = csv(records);

        for (int[] asked : new int[][] {{0}, {5}, {1, 3}, {0, 1, 2, 3, 4, 5}, {4, 2}}) {
            assertSameAsCommonsCsv(text, asked);
        }
    }

    @Test
    void readsCrLfLineEndsAndAFileWithoutAFinalLineEnd() throws IOException {
        assertSameAsCommonsCsv("a,b\r\n1,\"x\r\ny\"\r\n\"\",2\r\n3,4", 0, 1);
        assertSameAsCommonsCsv("a,b\n\"q\"\"\",\"\"\"\"\n", 0, 1);
    }

    @Test
    void anEmptyFileHasNoRecords() throws IOException {
        try (CsvColumns csv = new CsvColumns(new StringReader(""), 0)) {
            assertFalse(csv.next());
        }
    }

    @Test
    void aRecordWithTooFewFieldsIsAnErrorNotEmptyValues() throws IOException {
        try (CsvColumns csv = new CsvColumns(new StringReader("a,b,c\n1,2\n"), 0, 2)) {
            assertTrue(csv.next());
            IOException e = assertThrows(IOException.class, csv::next);
            assertEquals("record 2 has 2 fields, fewer than the 3 needed", e.getMessage());
        }
    }

    @Test
    void aQuotedFieldThatNeverEndsIsAnError() throws IOException {
        try (CsvColumns csv = new CsvColumns(new StringReader("a,\"b\n1,2\n"), 1)) {
            IOException e = assertThrows(IOException.class, csv::next);
            assertEquals("the file ends inside a quoted field of record 1", e.getMessage());
        }
    }

    @Test
    void onlyTheAskedColumnsCanBeRead() throws IOException {
        try (CsvColumns csv = new CsvColumns(new StringReader("a,b\n"), 1)) {
            assertTrue(csv.next());
            assertEquals("b", csv.get(1));
            assertThrows(IllegalArgumentException.class, () -> csv.get(0));
        }
    }

    private static String csv(List<String[]> records) throws IOException {
        StringWriter out = new StringWriter();
        try (CSVPrinter printer = new CSVPrinter(out, MatrixWriter.FORMAT)) {
            for (String[] r : records) {
                printer.printRecord((Object[]) r);
            }
        }
        return out.toString();
    }

    private static void assertSameAsCommonsCsv(String text, int... asked) throws IOException {
        List<List<String>> expected = new ArrayList<>();
        try (CSVParser parser = MatrixWriter.FORMAT.parse(new StringReader(text))) {
            for (CSVRecord r : parser) {
                List<String> fields = new ArrayList<>();
                for (int c : asked) {
                    fields.add(r.get(c));
                }
                expected.add(fields);
            }
        }
        List<List<String>> actual = new ArrayList<>();
        try (CsvColumns csv = new CsvColumns(new StringReader(text), asked)) {
            while (csv.next()) {
                List<String> fields = new ArrayList<>();
                for (int c : asked) {
                    fields.add(csv.get(c));
                }
                actual.add(fields);
            }
        }

        assertEquals(expected, actual);
    }
}
