package dev.quern.bench;

import dev.quern.run.MatrixWriter;
import java.io.IOException;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

/**
 * Whether quern's matrix holds the same answer as the hand-written query, so that speed never comes from
 * a wrong one. Both files are ordered by cutoff, then key, and are merged on (key, cutoff) as they stream:
 * memory stays flat however many rows there are. A row on one side only is a difference.
 *
 * <p>Text cells must be equal. Numbers are equal within a relative tolerance of {@value #RELATIVE}:
 * the engines sum in whatever order their join produced rows. Two numbers both within {@value #ABSOLUTE}
 * of zero are equal too: the sum-of-squares standard deviation of equal values, which quern gives as 0,
 * comes out of the hand-written SQLite query as the square root of a rounding residue (about 1e-7).
 */
final class MatrixComparison {

    static final double RELATIVE = 1e-9;
    static final double ABSOLUTE = 1e-6;
    private static final int DIFFERENCES_KEPT = 5;

    private MatrixComparison() {
    }

    record Result(long rows, List<String> differences, long differenceCount) {
        boolean equal() {
            return differenceCount == 0;
        }
    }

    static Result compare(Path quern, Path handwritten) {
        try (Reader a = Files.newBufferedReader(quern, StandardCharsets.UTF_8);
             Reader b = Files.newBufferedReader(handwritten, StandardCharsets.UTF_8);
             CSVParser left = MatrixWriter.FORMAT.parse(a);
             CSVParser right = MatrixWriter.FORMAT.parse(b)) {
            return compare(left.iterator(), right.iterator());
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static Result compare(Iterator<CSVRecord> left, Iterator<CSVRecord> right) {
        List<String> differences = new ArrayList<>();
        long[] count = {0};
        CSVRecord header = left.next();
        CSVRecord otherHeader = right.next();
        if (!header.toList().equals(otherHeader.toList())) {
            return new Result(0, List.of("columns differ: quern " + header.toList() + ", hand-written "
                    + otherHeader.toList()), 1);
        }
        CSVRecord l = next(left);
        CSVRecord r = next(right);
        long rows = 0;
        while (l != null || r != null) {
            int order = l == null ? 1 : r == null ? -1 : compareRowKeys(l, r);
            if (order < 0) {
                note(differences, count, "row " + key(l) + " only in quern's matrix");
                l = next(left);
            } else if (order > 0) {
                note(differences, count, "row " + key(r) + " only in the hand-written result");
                r = next(right);
            } else {
                rows++;
                for (int i = 2; i < header.size(); i++) {
                    if (!sameCell(l.get(i), r.get(i))) {
                        note(differences, count, key(l) + " " + header.get(i) + ": quern '" + l.get(i)
                                + "', hand-written '" + r.get(i) + "'");
                    }
                }
                l = next(left);
                r = next(right);
            }
        }
        return new Result(rows, differences, count[0]);
    }

    static boolean sameCell(String a, String b) {
        if (a.equals(b)) {
            return true;
        }
        try {
            double x = Double.parseDouble(a);
            double y = Double.parseDouble(b);
            return Math.abs(x - y) <= RELATIVE * Math.max(Math.abs(x), Math.abs(y))
                    || (Math.abs(x) <= ABSOLUTE && Math.abs(y) <= ABSOLUTE);
        } catch (NumberFormatException e) {
            return false;
        }
    }

    /** Matrices are ordered by cutoff (ISO text) and then by key, which is numeric here. */
    private static int compareRowKeys(CSVRecord l, CSVRecord r) {
        int byCutoff = l.get(1).compareTo(r.get(1));
        return byCutoff != 0 ? byCutoff : Long.compare(Long.parseLong(l.get(0)), Long.parseLong(r.get(0)));
    }

    private static String key(CSVRecord row) {
        return "(" + row.get(0) + ", " + row.get(1) + ")";
    }

    private static void note(List<String> differences, long[] count, String difference) {
        if (differences.size() < DIFFERENCES_KEPT) {
            differences.add(difference);
        }
        count[0]++;
    }

    private static CSVRecord next(Iterator<CSVRecord> records) {
        return records.hasNext() ? records.next() : null;
    }
}
