package dev.quern.audit;

import dev.quern.QuernException;
import dev.quern.plan.OutputColumn;
import dev.quern.plan.Role;
import dev.quern.schema.ValueType;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.ZoneOffset;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.BitSet;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.function.IntFunction;
import java.util.stream.IntStream;

/**
 * Reads the written matrix back, streaming, for the checks that look at its rows: the cohort (entities
 * before their since date, (key, cutoff) pairs that repeat) and the single-feature screen.
 *
 * <p>Memory: the first pass keeps the label of every row (8 bytes a row), a 64-bit hash of each key of the
 * current cutoff (8 bytes a row of the largest cutoff) and at most {@value #MOST_LEVELS} level counts per
 * text column. The screen keeps the values of numeric columns, 8 bytes a row per column, in batches of at
 * most {@value #BUDGET_BYTES} bytes, reading the file once per batch: the demo's 18,309 rows take every
 * column in one pass; at ten million rows it is one column per pass. Sorting a column for its ranks takes
 * 8 bytes a row more while that column is screened.
 */
final class MatrixScan {

    /** Text columns with more levels than this are not screened: their best ordering would overfit. */
    static final int MOST_LEVELS = 50;
    /** Memory for the numeric values of one screening pass. */
    static final long BUDGET_BYTES = 64L << 20;

    private final Path file;
    private final List<OutputColumn> columns;
    private final EntitySince since;
    private final long budget;

    /** What the cohort part of the scan found. */
    record CohortFacts(long rows, long beforeSince, List<String> beforeSinceExamples, long repeated,
                       List<String> repeatedExamples, Map<String, Long> labelledPerCutoff) {
    }

    /** The screen's verdict on one column. */
    record Screened(String column, String statistic, double value, long rows, long positives) {
    }

    /** What the screen measured: the label's kind, and each screened column's statistic. */
    record Screen(String label, boolean binary, long labelled, long positives, List<Screened> columns,
                  List<String> skipped) {
    }

    MatrixScan(Path file, List<OutputColumn> columns, EntitySince since, long budget) {
        this.file = file;
        this.columns = List.copyOf(columns);
        this.since = since;
        this.budget = budget;
    }

    private static int indexOf(List<OutputColumn> columns, Role role) {
        for (int i = 0; i < columns.size(); i++) {
            if (columns.get(i).role() == role) {
                return i;
            }
        }
        return -1;
    }

    /** The first pass, read from the file: the cohort facts, the labels, and the level counts of text columns. */
    First first() {
        First first = new First(columns, since);
        try (CsvColumns csv = open(first.needed())) {
            while (csv.next()) {
                first.add(csv::get);
            }
        } catch (IOException | UncheckedIOException e) {
            throw unreadable(e);
        }
        return confirmed(first);
    }

    /**
     * A first pass fed its rows as they were written ({@link First#add}) made whole: repeats of a (key,
     * cutoff) pair that its hashes suggest are confirmed against the file.
     */
    First confirmed(First first) {
        first.repeats.endCutoff();
        first.confirmed = first.repeats.candidates.isEmpty() ? new ConfirmedRepeats(0, List.of())
                : confirmRepeats(first.keyAt, first.cutoffAt, first.repeats.candidates);
        return first;
    }

    /**
     * The single-feature screen: each numeric, date and low-cardinality text feature against the label, AUC
     * for a binary label, Spearman's rho for a numeric one. Rows with an empty label are left out.
     */
    Screen screen(First first) {
        String label = columns.get(first.labelAt).name();
        List<Screened> screened = new ArrayList<>();
        List<String> skipped = new ArrayList<>();
        double[] labels = first.labelValues();
        boolean binary = first.binary;
        long positives = binary ? Arrays.stream(labels).filter(v -> v == 1.0).count() : 0;
        if (labels.length < 2 || (binary && (positives == 0 || positives == labels.length))) {
            return new Screen(label, binary, labels.length, positives, List.of(), List.of());
        }
        List<Integer> numeric = new ArrayList<>();
        for (int i = 0; i < columns.size(); i++) {
            OutputColumn c = columns.get(i);
            if (c.role() != Role.FEATURE) {
                continue;
            }
            Kind kind = kindOf(c.type());
            if (kind == Kind.TEXT) {
                Map<String, long[]> levels = first.levels.get(i);
                if (!binary || levels == null) {
                    skipped.add(c.name() + (binary ? " (more than " + MOST_LEVELS + " levels)" : " (text)"));
                } else {
                    screened.add(new Screened(c.name(), "auc", levelAuc(levels), labels.length, positives));
                }
            } else if (kind == Kind.OTHER) {
                skipped.add(c.name() + " (" + c.type().label() + ")");
            } else {
                numeric.add(i);
            }
        }
        int batch = (int) Math.max(1, Math.min(numeric.size(), budget / Math.max(1, 8 * first.rows)));
        for (int from = 0; from < numeric.size(); from += batch) {
            List<Integer> part = numeric.subList(from, Math.min(numeric.size(), from + batch));
            double[][] values = read(part, first);
            for (int j = 0; j < part.size(); j++) {
                String name = columns.get(part.get(j)).name();
                if (binary) {
                    screened.add(new Screened(name, "auc", aucOf(values[j], labels), labels.length, positives));
                } else {
                    screened.add(new Screened(name, "rho", RankStatistics.spearman(values[j], labels),
                            labels.length, 0));
                }
            }
        }
        screened.sort((a, b) -> Integer.compare(indexOfName(a.column()), indexOfName(b.column())));
        return new Screen(label, binary, labels.length, positives, screened, skipped);
    }

    private int indexOfName(String name) {
        for (int i = 0; i < columns.size(); i++) {
            if (columns.get(i).name().equals(name)) {
                return i;
            }
        }
        return -1;
    }

    /** The values of some columns at the labelled rows, in row order; an empty value is negative infinity. */
    private double[][] read(List<Integer> part, First first) {
        int n = first.labelled.cardinality();
        double[][] values = new double[part.size()][n];
        long row = 0;
        int at = 0;
        try (CsvColumns csv = open(part.stream().mapToInt(Integer::intValue).toArray())) {
            while (csv.next()) {
                if (first.labelled.get((int) row)) {
                    for (int j = 0; j < part.size(); j++) {
                        int c = part.get(j);
                        values[j][at] = number(csv.get(c), columns.get(c).type());
                    }
                    at++;
                }
                row++;
            }
        } catch (IOException | UncheckedIOException e) {
            throw unreadable(e);
        }
        return values;
    }

    private static double aucOf(double[] values, double[] labels) {
        int n1 = 0;
        for (double l : labels) {
            if (l == 1.0) {
                n1++;
            }
        }
        double[] pos = new double[n1];
        double[] neg = new double[labels.length - n1];
        int p = 0;
        int q = 0;
        for (int i = 0; i < labels.length; i++) {
            if (labels[i] == 1.0) {
                pos[p++] = values[i];
            } else {
                neg[q++] = values[i];
            }
        }
        return RankStatistics.auc(pos, neg);
    }

    /**
     * The AUC of a text column scored by its levels' share of positives: the best any ordering of its levels
     * reaches, fitted on the same rows, which is why columns with many levels are left out.
     */
    static double levelAuc(Map<String, long[]> levels) {
        TreeMap<Double, long[]> byShare = new TreeMap<>();
        long positives = 0;
        long negatives = 0;
        for (long[] counts : levels.values()) {
            double share = (double) counts[1] / (counts[0] + counts[1]);
            long[] merged = byShare.computeIfAbsent(share, s -> new long[2]);
            merged[0] += counts[0];
            merged[1] += counts[1];
            negatives += counts[0];
            positives += counts[1];
        }
        if (positives == 0 || negatives == 0) {
            return Double.NaN;
        }
        double u = 0;
        long negativesBelow = 0;
        for (long[] counts : byShare.values()) {
            u += counts[1] * (negativesBelow + 0.5 * counts[0]);
            negativesBelow += counts[0];
        }
        return u / ((double) positives * negatives);
    }

    private ConfirmedRepeats confirmRepeats(int keyAt, int cutoffAt, Set<Long> candidates) {
        Map<String, Integer> seen = new LinkedHashMap<>();
        List<String> examples = new ArrayList<>();
        long repeated = 0;
        String current = null;
        try (CsvColumns csv = open(keyAt, cutoffAt)) {
            while (csv.next()) {
                String cutoff = csv.get(cutoffAt);
                if (!cutoff.equals(current)) {
                    current = cutoff;
                    seen.clear();
                }
                String key = csv.get(keyAt);
                if (candidates.contains(cutoffHash(key, cutoff))) {
                    int times = seen.merge(key, 1, Integer::sum);
                    if (times > 1) {
                        repeated++;
                        if (times == 2 && examples.size() < SourceRows.EXAMPLES) {
                            examples.add(columns.get(keyAt).name() + " " + key + " at cutoff " + cutoff);
                        }
                    }
                }
            }
        } catch (IOException | UncheckedIOException e) {
            throw unreadable(e);
        }
        return new ConfirmedRepeats(repeated, examples);
    }

    record ConfirmedRepeats(long rows, List<String> examples) {
    }

    /** The matrix's rows after its header, with the fields of {@code columns}. */
    private CsvColumns open(int... columns) throws IOException {
        CsvColumns csv = new CsvColumns(Files.newBufferedReader(file, StandardCharsets.UTF_8), columns);
        try {
            csv.next();
        } catch (IOException e) {
            csv.close();
            throw e;
        }
        return csv;
    }

    private QuernException unreadable(Exception e) {
        return QuernException.output("the leakage audit could not read back the matrix " + file + ": "
                + e.getMessage(), e);
    }

    private enum Kind { NUMBER, TEXT, OTHER }

    private static Kind kindOf(ValueType type) {
        return switch (type) {
            case INTEGER, DECIMAL, BOOLEAN, DATE, TIMESTAMP -> Kind.NUMBER;
            case TEXT -> Kind.TEXT;
            default -> Kind.OTHER;
        };
    }

    /** A cell as a number: dates as days, timestamps as seconds; empty or unreadable ranks lowest. */
    static double number(String text, ValueType type) {
        if (text.isEmpty()) {
            return Double.NEGATIVE_INFINITY;
        }
        try {
            return switch (type) {
                case DATE -> LocalDate.parse(text.substring(0, 10)).toEpochDay();
                case TIMESTAMP -> LocalDateTime.parse(text.replace(' ', 'T')).toEpochSecond(ZoneOffset.UTC);
                case BOOLEAN -> text.equals("1") || text.equalsIgnoreCase("true") ? 1 : 0;
                default -> Double.parseDouble(text);
            };
        } catch (NumberFormatException | DateTimeParseException | StringIndexOutOfBoundsException e) {
            return Double.NEGATIVE_INFINITY;
        }
    }

    /** A 64-bit hash of a key at a cutoff (FNV-1a over both texts): for finding repeats in little memory. */
    static long cutoffHash(String key, String cutoff) {
        // Run once for every matrix row: the texts are hashed in turn rather than joined into a new one.
        return fnv(fnv(fnv(0xcbf29ce484222325L, cutoff), "\u0000"), key);
    }

    private static long fnv(long h, String text) {
        for (int i = 0; i < text.length(); i++) {
            h ^= text.charAt(i);
            h *= 0x100000001b3L;
        }
        return h;
    }

    /**
     * Keys of one cutoff as hashes; at the end of each cutoff, hashes seen twice become candidates, which a
     * second pass confirms by comparing the keys themselves, so a hash collision never reports a repeat.
     */
    static final class KeyRepeats {
        private long[] hashes = new long[1024];
        private int size;
        private String cutoff;
        final Set<Long> candidates = new HashSet<>();

        void add(String key, String at) {
            if (!at.equals(cutoff)) {
                endCutoff();
                cutoff = at;
            }
            if (size == hashes.length) {
                hashes = Arrays.copyOf(hashes, size * 2);
            }
            hashes[size++] = cutoffHash(key, at);
        }

        void endCutoff() {
            Arrays.sort(hashes, 0, size);
            for (int i = 1; i < size; i++) {
                if (hashes[i] == hashes[i - 1]) {
                    candidates.add(hashes[i]);
                }
            }
            size = 0;
        }
    }

    /**
     * The first pass over the matrix's rows, one at a time: from the file ({@link #first()}) or from the
     * writer as it writes them. Keeps the labels, which rows have one, per-cutoff counts, text level counts,
     * the key hashes of the current cutoff, and notes entities before their since date.
     */
    static final class First {
        final int keyAt;
        final int cutoffAt;
        final int labelAt;
        private final EntitySince since;
        final BitSet labelled = new BitSet();
        final Map<String, Long> labelledPerCutoff = new LinkedHashMap<>();
        final Map<Integer, Map<String, long[]>> levels = new LinkedHashMap<>();
        private final KeyRepeats repeats = new KeyRepeats();
        private double[] labels = new double[1024];
        private int count;
        boolean binary = true;
        long rows;
        private ConfirmedRepeats confirmed;
        private String pendingLabel;

        First(List<OutputColumn> columns, EntitySince since) {
            this.keyAt = indexOf(columns, Role.KEY);
            this.cutoffAt = indexOf(columns, Role.CUTOFF);
            this.labelAt = indexOf(columns, Role.LABEL);
            this.since = since;
            for (int i = 0; i < columns.size(); i++) {
                if (columns.get(i).role() == Role.FEATURE && kindOf(columns.get(i).type()) == Kind.TEXT) {
                    levels.put(i, new HashMap<>());
                }
            }
        }

        /** The columns the pass reads: text levels count only against a label, so without one, key and cutoff. */
        int[] needed() {
            return labelAt < 0 ? new int[] {keyAt, cutoffAt}
                    : IntStream.concat(IntStream.of(keyAt, cutoffAt, labelAt),
                            levels.keySet().stream().mapToInt(Integer::intValue)).toArray();
        }

        /** The next row, each cell as its text in the file, by column index. */
        void add(IntFunction<String> cell) {
            String key = cell.apply(keyAt);
            String cutoff = cell.apply(cutoffAt);
            repeats.add(key, cutoff);
            since.check(key, cutoff);
            if (labelAt >= 0) {
                label(rows, cell.apply(labelAt), cutoff);
                countLevels(cell);
            }
            rows++;
        }

        private void label(long row, String text, String cutoff) {
            pendingLabel = null;
            if (text.isEmpty()) {
                return;
            }
            double v;
            try {
                v = Double.parseDouble(text);
            } catch (NumberFormatException e) {
                return;
            }
            labelled.set((int) row);
            labelledPerCutoff.merge(cutoff, 1L, Long::sum);
            if (count == labels.length) {
                labels = Arrays.copyOf(labels, count * 2);
            }
            labels[count++] = v;
            if (v != 0.0 && v != 1.0) {
                binary = false;
            }
            pendingLabel = v == 1.0 ? "1" : v == 0.0 ? "0" : null;
        }

        /** Counts each text feature's levels by label, while the label could still be binary. */
        private void countLevels(IntFunction<String> cell) {
            if (pendingLabel == null || !binary) {
                return;
            }
            int side = pendingLabel.equals("1") ? 1 : 0;
            for (var e : levels.entrySet()) {
                Map<String, long[]> counts = e.getValue();
                if (counts == null) {
                    continue;
                }
                String level = cell.apply(e.getKey());
                long[] c = counts.get(level);
                if (c == null) {
                    if (counts.size() >= MOST_LEVELS) {
                        e.setValue(null);
                        continue;
                    }
                    c = new long[2];
                    counts.put(level, c);
                }
                c[side]++;
            }
        }

        double[] labelValues() {
            return Arrays.copyOf(labels, count);
        }

        CohortFacts cohort() {
            return new CohortFacts(rows, since.violations(), since.examples(), confirmed.rows(),
                    confirmed.examples(), labelledPerCutoff);
        }
    }
}
