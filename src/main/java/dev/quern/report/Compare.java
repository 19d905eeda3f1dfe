package dev.quern.report;

import dev.quern.QuernException;
import dev.quern.run.ValueSketch;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalLong;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.function.ToIntFunction;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

/**
 * Compares two builds of a recipe: the monthly rerun against the month before.
 *
 * <p>The matrices are streamed, never held: memory grows with the number of columns and cutoffs, not
 * rows. The old matrix is read twice. The first pass keeps a {@link ValueSketch} per column (exact level
 * counts while a column has few distinct values, and a fixed-size uniform sample of numbers); the PSI
 * bins come from it: deciles of the old values for numbers (exact when the levels were all counted, else
 * from the sample of {@value ValueSketch#SAMPLE_SIZE} values, within about half a percentile), the
 * frequent levels for text. The second pass over the old matrix and one pass over the new count every row
 * exactly into those bins. So the bins are fixed by the old run and only their edges may be estimated;
 * the shares the PSI is computed from are exact.
 */
public final class Compare {

    private Compare() {
    }

    /** Compares two build folders. */
    public static Comparison folders(Path oldFolder, Path newFolder) {
        return of(BuildFiles.read(oldFolder), BuildFiles.read(newFolder));
    }

    public static Comparison of(BuildFiles old, BuildFiles now) {
        List<String> oldHeader = header(old);
        List<String> newHeader = header(now);
        List<Comparison.ColumnChange> changes = new ArrayList<>();
        for (String c : oldHeader) {
            if (!newHeader.contains(c)) {
                changes.add(new Comparison.ColumnChange(c, Comparison.Change.REMOVED, type(old, c), ""));
            } else if (!type(old, c).equals(type(now, c))) {
                changes.add(new Comparison.ColumnChange(c, Comparison.Change.RETYPED, type(old, c), type(now, c)));
            }
        }
        for (String c : newHeader) {
            if (!oldHeader.contains(c)) {
                changes.add(new Comparison.ColumnChange(c, Comparison.Change.ADDED, "", type(now, c)));
            }
        }
        // Features and the label both builds have, binned alike: numbers with numbers, the rest as levels.
        List<String> compared = new ArrayList<>();
        for (String c : newHeader) {
            BuildFiles.Entry o = old.entry(c).orElse(null);
            BuildFiles.Entry n = now.entry(c).orElse(null);
            if (oldHeader.contains(c) && o != null && n != null && compared(o) && compared(n)
                    && o.numeric() == n.numeric()) {
                compared.add(c);
            }
        }
        Map<String, ValueSketch> sketches = sketch(old, oldHeader, compared);
        Map<String, Bins> bins = new LinkedHashMap<>();
        sketches.forEach((c, s) -> bins.put(c, s.numeric() ? Bins.Numeric.of(s) : Bins.Levels.of(s)));
        Tally oldTally = tally(old, oldHeader, bins);
        Tally newTally = tally(now, newHeader, bins);

        List<Comparison.ColumnDrift> drift = new ArrayList<>();
        for (String c : compared) {
            long[] o = oldTally.counts.get(c);
            long[] n = newTally.counts.get(c);
            List<String> labels = bins.get(c).labels();
            List<Comparison.Bin> binList = new ArrayList<>();
            for (int i = 0; i < labels.size(); i++) {
                binList.add(new Comparison.Bin(labels.get(i), o[i], n[i]));
            }
            drift.add(new Comparison.ColumnDrift(c, now.entry(c).orElseThrow().role(),
                    bins.get(c) instanceof Bins.Numeric, binList, Psi.ofCounts(o, n), share(o[0], oldTally.rows),
                    share(n[0], newTally.rows)));
        }
        List<Comparison.CutoffRows> rows = new ArrayList<>();
        TreeSet<String> cutoffs = new TreeSet<>(oldTally.perCutoff.keySet());
        cutoffs.addAll(newTally.perCutoff.keySet());
        for (String cutoff : cutoffs) {
            rows.add(new Comparison.CutoffRows(cutoff, optional(oldTally.perCutoff.get(cutoff)),
                    optional(newTally.perCutoff.get(cutoff))));
        }
        return new Comparison(old.name(), now.name(), changes, rows, drift, ProvenanceDiff.between(old, now));
    }

    private static boolean compared(BuildFiles.Entry e) {
        return e.role().equals("feature") || e.role().equals("label");
    }

    private static String type(BuildFiles build, String column) {
        return build.entry(column).map(BuildFiles.Entry::type).orElse("unknown");
    }

    private static double share(long part, long total) {
        return total == 0 ? 0 : (double) part / total;
    }

    private static OptionalLong optional(Long value) {
        return value == null ? OptionalLong.empty() : OptionalLong.of(value);
    }

    private static List<String> header(BuildFiles build) {
        try (CSVParser parser = build.openMatrix()) {
            List<String> header = parser.getHeaderNames();
            for (String c : header) {
                if (build.entry(c).isEmpty()) {
                    throw QuernException.data(build.name() + ": the matrix has a column '" + c
                            + "' that its data dictionary does not describe");
                }
            }
            return List.copyOf(header);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** First pass over the old matrix: a sketch of each compared column. */
    private static Map<String, ValueSketch> sketch(BuildFiles old, List<String> header, Collection<String> columns) {
        Map<String, ValueSketch> out = new LinkedHashMap<>();
        List<Integer> at = new ArrayList<>();
        List<ValueSketch> sketches = new ArrayList<>();
        for (String c : columns) {
            ValueSketch s = old.entry(c).orElseThrow().numeric() ? ValueSketch.numbers() : ValueSketch.text();
            out.put(c, s);
            at.add(header.indexOf(c));
            sketches.add(s);
        }
        scan(old, record -> {
            for (int i = 0; i < at.size(); i++) {
                String text = record.get(at.get(i));
                if (text.isEmpty()) {
                    continue;
                }
                ValueSketch s = sketches.get(i);
                if (s.numeric()) {
                    try {
                        s.add(text, Double.parseDouble(text));
                    } catch (NumberFormatException e) {
                        // Not a number in a number column: it counts as empty when binned.
                    }
                } else {
                    s.add(text);
                }
            }
        });
        return out;
    }

    /** Rows, rows per cutoff and bin counts of one matrix. */
    private static final class Tally {
        long rows;
        final Map<String, Long> perCutoff = new TreeMap<>();
        final Map<String, long[]> counts = new LinkedHashMap<>();
    }

    private static Tally tally(BuildFiles build, List<String> header, Map<String, Bins> bins) {
        Tally t = new Tally();
        int cutoff = cutoffColumn(build, header);
        List<Integer> at = new ArrayList<>();
        List<long[]> counts = new ArrayList<>();
        List<ToIntFunction<String>> binners = new ArrayList<>();
        bins.forEach((c, b) -> {
            long[] n = new long[b.size()];
            t.counts.put(c, n);
            counts.add(n);
            at.add(header.indexOf(c));
            binners.add(b.binner());
        });
        scan(build, record -> {
            t.rows++;
            if (cutoff >= 0) {
                t.perCutoff.merge(record.get(cutoff), 1L, Long::sum);
            }
            for (int i = 0; i < at.size(); i++) {
                counts.get(i)[binners.get(i).applyAsInt(record.get(at.get(i)))]++;
            }
        });
        return t;
    }

    private static int cutoffColumn(BuildFiles build, List<String> header) {
        for (int i = 0; i < header.size(); i++) {
            if (build.entry(header.get(i)).map(e -> e.role().equals("cutoff")).orElse(false)) {
                return i;
            }
        }
        return -1;
    }

    private static void scan(BuildFiles build, java.util.function.Consumer<CSVRecord> row) {
        try (CSVParser parser = build.openMatrix()) {
            int width = parser.getHeaderNames().size();
            for (CSVRecord record : parser) {
                if (record.size() != width) {
                    throw QuernException.data(build.matrix() + " line " + parser.getCurrentLineNumber() + ": "
                            + record.size() + " values where the header has " + width);
                }
                row.accept(record);
            }
        } catch (IOException | UncheckedIOException e) {
            throw QuernException.data("cannot read " + build.matrix() + ": " + e.getMessage(), e);
        }
    }
}
