package dev.quern.encode;

import dev.quern.QuernException;
import dev.quern.plan.LabelPlan;
import dev.quern.plan.OutputColumn;
import dev.quern.plan.Role;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.apache.commons.csv.CSVRecord;

/**
 * Fits every encoding on the training rows of the raw matrix, in passes over the file. A pass fits the
 * next unfitted step of each chain, reading values through the steps already fitted before it, so
 * {@code [log1p, standardise]} standardises log1p values. Steps with nothing to fit (missing, log1p, a
 * constant) are fitted without reading. Memory per pass: counts per level for one-hot and frequency, two
 * numbers per level and training cutoff for a target mean, three numbers for a mean and standard deviation,
 * and for exact quantiles (bins, a median) the column's training values as one primitive array; a pass
 * holds at most one such array, so a second one waits for the next pass.
 */
final class Fitter {

    /** More distinct training values than this is not a category but an identifier, and is refused. */
    static final int MAX_LEVELS = 100_000;

    private final EncodePlan plan;
    private final RawMatrix raw;
    private final Set<LocalDate> training;
    private final int cutoffIndex;
    private final int labelIndex;
    private final Map<String, LocalDate> dates = new HashMap<>();

    /** The fitted steps of each encoded column (in plan order, names not yet given), and target statistics. */
    record Result(List<List<FittedStep>> steps, Map<Integer, TargetStatistics> targets) {
    }

    Fitter(EncodePlan plan, RawMatrix raw) {
        this.plan = plan;
        this.raw = raw;
        this.training = new HashSet<>(plan.trainingCutoffs());
        this.cutoffIndex = index(plan, Role.CUTOFF);
        this.labelIndex = index(plan, Role.LABEL);
    }

    Result fit(long trainingRows) {
        List<ColumnEncoding> columns = plan.columns();
        List<List<FittedStep>> done = new ArrayList<>();
        columns.forEach(c -> done.add(new ArrayList<>()));
        Map<Integer, TargetStatistics> targets = new HashMap<>();
        while (true) {
            List<Task> pass = new ArrayList<>();
            boolean holding = false;
            for (int c = 0; c < columns.size(); c++) {
                ColumnEncoding column = columns.get(c);
                List<FittedStep> fitted = done.get(c);
                while (fitted.size() < column.steps().size() && withoutData(column.steps().get(fitted.size()))) {
                    fitted.add(fittedWithoutData(column.steps().get(fitted.size())));
                }
                if (fitted.size() == column.steps().size()) {
                    continue;
                }
                Step next = column.steps().get(fitted.size());
                boolean holds = next instanceof Step.Bins
                        || next instanceof Step.Impute i && i.method() == Step.Impute.Method.MEDIAN;
                if (holds && holding) {
                    continue;
                }
                holding |= holds;
                pass.add(new Task(c, column, List.copyOf(fitted), accumulator(next, column)));
            }
            if (pass.isEmpty()) {
                return new Result(done.stream().map(List::copyOf).toList(), targets);
            }
            if (trainingRows == 0) {
                throw QuernException.data("nothing to fit the encodings on: no row of the build is at a training "
                        + "cutoff (" + plan.trainingRule() + ")");
            }
            stream(pass);
            for (Task task : pass) {
                done.get(task.column).add(task.accumulator.finish());
                if (task.accumulator instanceof Target t) {
                    targets.put(task.column, t.statistics);
                }
            }
        }
    }

    private void stream(List<Task> pass) {
        raw.forEachRow(row -> {
            LocalDate cutoff = date(row.get(cutoffIndex));
            if (!training.contains(cutoff)) {
                return;
            }
            Double label = labelIndex < 0 ? null : number(row.get(labelIndex), plan.plan().columns().get(labelIndex),
                    cutoff);
            for (Task task : pass) {
                String text = row.get(task.encoding.index());
                if (task.accumulator instanceof Levels || task.accumulator instanceof Target) {
                    task.accumulator.add(text, null, cutoff, label);
                } else {
                    Double v = number(text, task.encoding.source(), cutoff);
                    for (FittedStep step : task.before) {
                        v = Chain.apply(step, v);
                    }
                    task.accumulator.add(text, v, cutoff, label);
                }
            }
        });
    }

    private LocalDate date(String text) {
        return dates.computeIfAbsent(text, LocalDate::parse);
    }

    /** The number in a raw cell, null when it is empty. */
    static Double number(String text, OutputColumn column, LocalDate cutoff) {
        if (text.isEmpty()) {
            return null;
        }
        try {
            return Double.parseDouble(text);
        } catch (NumberFormatException e) {
            throw QuernException.data(column.name() + " holds '" + text + "' at cutoff " + cutoff
                    + ", which is not a number: the source stores text in a number column");
        }
    }

    static QuernException tooManyLevels(String column, String kind) {
        return QuernException.data(column + " has more than " + MAX_LEVELS + " distinct values in the training rows: "
                + "too many levels for " + kind + " (it looks like an identifier, not a category)");
    }

    private static boolean withoutData(Step step) {
        return step instanceof Step.Missing || step instanceof Step.Log1p
                || step instanceof Step.Impute i && i.method() == Step.Impute.Method.CONSTANT;
    }

    /** Steps with nothing to learn; the missing column's name is given later, with every other name. */
    private static FittedStep fittedWithoutData(Step step) {
        if (step instanceof Step.Missing) {
            return new FittedStep.Missing("");
        }
        if (step instanceof Step.Log1p) {
            return new FittedStep.Log1p();
        }
        Step.Impute impute = (Step.Impute) step;
        return new FittedStep.Impute(impute.method().spelling(), 0, impute.constant());
    }

    private Accumulator accumulator(Step step, ColumnEncoding column) {
        String name = column.source().name();
        if (step instanceof Step.OneHot h) {
            return new Levels(name, h.spelling(), h.top(), true);
        }
        if (step instanceof Step.Frequency f) {
            return new Levels(name, f.spelling(), 0, false);
        }
        if (step instanceof Step.TargetMean t) {
            LabelPlan label = plan.plan().label().orElseThrow();
            return new Target(new TargetStatistics(plan.trainingCutoffs(), label, t.m(), name));
        }
        if (step instanceof Step.Standardise) {
            return new Moments(name, "standardise");
        }
        if (step instanceof Step.Impute i && i.method() == Step.Impute.Method.MEAN) {
            return new Moments(name, "impute");
        }
        if (step instanceof Step.Impute) {
            return new Values(name, 0);
        }
        if (step instanceof Step.Bins b) {
            return new Values(name, b.count());
        }
        throw new IllegalArgumentException("no accumulator for " + step);
    }

    private static int index(EncodePlan plan, Role role) {
        List<OutputColumn> columns = plan.plan().columns();
        for (int i = 0; i < columns.size(); i++) {
            if (columns.get(i).role() == role) {
                return i;
            }
        }
        return -1;
    }

    /** One step being fitted in a pass: the column, the fitted steps before it, and what it collects. */
    private record Task(int column, ColumnEncoding encoding, List<FittedStep> before, Accumulator accumulator) {
    }

    /** Collects what one step needs from the training rows. */
    private interface Accumulator {
        void add(String text, Double number, LocalDate cutoff, Double label);

        FittedStep finish();
    }

    /** Rows per level: one-hot keeps the top levels, frequency all of them. */
    private static final class Levels implements Accumulator {
        private final String column;
        private final String kind;
        private final int top;
        private final boolean oneHot;
        private final Map<String, long[]> counts = new HashMap<>();
        private long rows;
        private long empty;

        Levels(String column, String kind, int top, boolean oneHot) {
            this.column = column;
            this.kind = kind;
            this.top = top;
            this.oneHot = oneHot;
        }

        @Override
        public void add(String text, Double number, LocalDate cutoff, Double label) {
            rows++;
            if (text.isEmpty()) {
                empty++;
                return;
            }
            counts.computeIfAbsent(text, t -> new long[1])[0]++;
            if (counts.size() > MAX_LEVELS) {
                throw tooManyLevels(column, kind);
            }
        }

        @Override
        public FittedStep finish() {
            List<Map.Entry<String, long[]>> ordered = new ArrayList<>(counts.entrySet());
            ordered.sort(Comparator.comparingLong((Map.Entry<String, long[]> e) -> e.getValue()[0]).reversed()
                    .thenComparing(Map.Entry::getKey));
            if (oneHot) {
                List<FittedStep.Level> levels = new ArrayList<>();
                long kept = 0;
                for (Map.Entry<String, long[]> e : ordered.subList(0, Math.min(top, ordered.size()))) {
                    levels.add(new FittedStep.Level(e.getKey(), e.getValue()[0], ""));
                    kept += e.getValue()[0];
                }
                return new FittedStep.OneHot(top, rows, levels, rows - empty - kept, "", empty, "");
            }
            List<FittedStep.Share> shares = new ArrayList<>();
            for (Map.Entry<String, long[]> e : ordered) {
                shares.add(new FittedStep.Share(e.getKey(), e.getValue()[0], share(e.getValue()[0])));
            }
            return new FittedStep.Frequency(rows, shares, new FittedStep.Share("", empty, share(empty)));
        }

        private double share(long n) {
            return rows == 0 ? 0.0 : (double) n / rows;
        }
    }

    /** Labelled training rows per level and cutoff. */
    private static final class Target implements Accumulator {
        private final TargetStatistics statistics;

        Target(TargetStatistics statistics) {
            this.statistics = statistics;
        }

        @Override
        public void add(String text, Double number, LocalDate cutoff, Double label) {
            if (label != null) {
                statistics.add(cutoff, text, label);
            }
        }

        @Override
        public FittedStep finish() {
            FittedStep.TargetMean fitted = statistics.freeze();
            if (fitted.labelledRows() == 0) {
                throw QuernException.data("cannot fit target-mean: no training row has a label (the training"
                        + " cutoffs' horizons are not yet observed)");
            }
            return fitted;
        }
    }

    /** A running mean and standard deviation of the non-empty values. */
    private static final class Moments implements Accumulator {
        private final String column;
        private final String kind;
        private final RunningMoments moments = new RunningMoments();

        Moments(String column, String kind) {
            this.column = column;
            this.kind = kind;
        }

        @Override
        public void add(String text, Double number, LocalDate cutoff, Double label) {
            if (number != null) {
                moments.add(number);
            }
        }

        @Override
        public FittedStep finish() {
            if (moments.count() == 0) {
                throw noValues(column, kind);
            }
            if (kind.equals("impute")) {
                return new FittedStep.Impute(Step.Impute.Method.MEAN.spelling(), moments.count(), moments.mean());
            }
            double sd = moments.sampleSd();
            // Common practice (as scikit-learn's StandardScaler): a constant column is shifted, not divided by 0.
            double scale = Double.isNaN(sd) || sd == 0.0 ? 1.0 : sd;
            return new FittedStep.Standardise(moments.count(), moments.mean(), sd, scale);
        }
    }

    /** Every non-empty training value of the column, for exact quantiles. */
    private static final class Values implements Accumulator {
        private final String column;
        private final int bins;
        private final DoubleColumn values = new DoubleColumn();

        /** {@code bins} 0 means the median for impute. */
        Values(String column, int bins) {
            this.column = column;
            this.bins = bins;
        }

        @Override
        public void add(String text, Double number, LocalDate cutoff, Double label) {
            if (number != null) {
                values.add(number);
            }
        }

        @Override
        public FittedStep finish() {
            int n = values.size();
            if (n == 0) {
                throw noValues(column, bins == 0 ? "impute" : "bins");
            }
            if (bins == 0) {
                java.util.Arrays.sort(values.array(), 0, n);
                return new FittedStep.Impute(Step.Impute.Method.MEDIAN.spelling(), n,
                        Quantiles.of(values.array(), n, 0.5));
            }
            double[] edges = Quantiles.edges(values.array(), n, bins);
            List<Double> list = new ArrayList<>();
            for (double e : edges) {
                list.add(e);
            }
            return new FittedStep.Bins(bins, n, list);
        }
    }

    private static QuernException noValues(String column, String kind) {
        return QuernException.data("cannot fit " + kind + " for " + column + ": no training row has a value");
    }
}
