package dev.quern.report;

import dev.quern.run.ValueSketch;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The bins a column's values are counted in for the PSI, chosen from the reference (old) run. Bin 0 is
 * always "empty" (rows without a value), so a change in the share of empty values is drift too.
 */
sealed interface Bins {

    /** Deciles of the reference values. */
    double[] DECILES = {0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9};
    /** A text level below this share of the reference's values goes to the rare bucket. */
    double RARE_SHARE = 0.01;
    /** At most this many text levels get a bin of their own. */
    int MAX_LEVELS = 20;

    String EMPTY = "(empty)";

    int size();

    /** The bin of one value as the matrix writes it (empty text: no value). */
    int bin(String text);

    List<String> labels();

    /** {@link #bin} as a function, prepared for a long scan. */
    default java.util.function.ToIntFunction<String> binner() {
        return this::bin;
    }

    /**
     * Numbers: bins {@code (-inf, e1], (e1, e2], ..., (ek, inf)} with {@code e1..ek} the distinct deciles
     * of the reference values (ties collapse deciles, so a count column that is mostly 0 has fewer bins).
     * Text that does not read as a number counts as empty.
     */
    record Numeric(double[] edges) implements Bins {
        public Numeric {
            edges = edges.clone();
        }

        static Numeric of(ValueSketch reference) {
            double[] q = reference.quantiles(DECILES);
            return new Numeric(Arrays.stream(q).distinct().sorted().toArray());
        }

        @Override
        public int size() {
            return edges.length + 2;
        }

        @Override
        public int bin(String text) {
            if (text.isEmpty()) {
                return 0;
            }
            double v;
            try {
                v = Double.parseDouble(text);
            } catch (NumberFormatException e) {
                return 0;
            }
            if (Double.isNaN(v)) {
                return 0;
            }
            int i = Arrays.binarySearch(edges, v);
            // (e[i-1], e[i]] holds v: an exact hit on edge i is in bin i + 1 (1-based after "empty").
            return 1 + (i >= 0 ? i : -i - 1);
        }

        @Override
        public List<String> labels() {
            List<String> out = new ArrayList<>();
            out.add(EMPTY);
            if (edges.length == 0) {
                out.add("any value");
                return out;
            }
            out.add("<= " + number(edges[0]));
            for (int i = 1; i < edges.length; i++) {
                out.add("(" + number(edges[i - 1]) + ", " + number(edges[i]) + "]");
            }
            out.add("> " + number(edges[edges.length - 1]));
            return out;
        }
    }

    /**
     * Text: a bin per reference level holding at least {@link #RARE_SHARE} of the reference values (the
     * {@link #MAX_LEVELS} most frequent at most), and one bin for every other level, including levels the
     * reference never saw.
     */
    record Levels(List<String> levels) implements Bins {
        static final String RARE = "(rare or new levels)";

        public Levels {
            levels = List.copyOf(levels);
        }

        static Levels of(ValueSketch reference) {
            List<String> kept = new ArrayList<>();
            for (ValueSketch.Level l : reference.levels()) {
                if (kept.size() < MAX_LEVELS && l.count() >= RARE_SHARE * reference.count()) {
                    kept.add(l.value());
                }
            }
            return new Levels(kept);
        }

        private Map<String, Integer> index() {
            Map<String, Integer> out = new HashMap<>();
            for (int i = 0; i < levels.size(); i++) {
                out.put(levels.get(i), i + 1);
            }
            return out;
        }

        @Override
        public int size() {
            return levels.size() + 2;
        }

        @Override
        public int bin(String text) {
            if (text.isEmpty()) {
                return 0;
            }
            int i = levels.indexOf(text);
            return i >= 0 ? i + 1 : levels.size() + 1;
        }

        @Override
        public java.util.function.ToIntFunction<String> binner() {
            Map<String, Integer> index = index();
            int rare = levels.size() + 1;
            return text -> text.isEmpty() ? 0 : index.getOrDefault(text, rare);
        }

        @Override
        public List<String> labels() {
            List<String> out = new ArrayList<>();
            out.add(EMPTY);
            out.addAll(levels);
            out.add(RARE);
            return out;
        }
    }

    /** A number in few characters: integers without a point, others to six significant digits. */
    static String number(double v) {
        if (v == Math.rint(v) && Math.abs(v) < 1e15) {
            return Long.toString((long) v);
        }
        return new java.math.BigDecimal(v).round(new java.math.MathContext(6)).stripTrailingZeros()
                .toPlainString().toLowerCase(Locale.ROOT);
    }
}
