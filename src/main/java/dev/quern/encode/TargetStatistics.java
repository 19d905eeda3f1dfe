package dev.quern.encode;

import dev.quern.plan.Boundary;
import dev.quern.plan.LabelPlan;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Label counts and sums per level and training cutoff, for a target mean fitted out of time. A row at
 * cutoff c is encoded from the training rows whose label horizon had ended by the end of c's day
 * ({@link LabelPlan#end()} at their cutoff on or before the day after c): never from its own label, whose
 * horizon starts after c, nor from any label not yet known at c. Fitting target statistics on the rows they
 * encode leaks the label (Prokhorenkova et al. 2018, arXiv 1706.09516).
 *
 * <p>Memory: two numbers per level per training cutoff.
 */
final class TargetStatistics {

    private final List<LocalDate> cutoffs;
    private final Map<LocalDate, Integer> slots = new HashMap<>();
    private final LabelPlan label;
    private final double m;
    private final String column;
    private final List<Map<String, double[]>> perCutoff = new ArrayList<>();
    private final Map<String, double[]> all = new HashMap<>();

    /** The running merge of the first {@code mergedCutoffs} cutoffs' statistics. */
    private final Map<String, double[]> merged = new HashMap<>();
    private final double[] mergedTotal = new double[2];
    private int mergedCutoffs;
    private final Map<LocalDate, Integer> eligible = new HashMap<>();

    TargetStatistics(List<LocalDate> trainingCutoffs, LabelPlan label, double m, String column) {
        this.cutoffs = trainingCutoffs.stream().sorted().toList();
        for (int i = 0; i < cutoffs.size(); i++) {
            slots.put(cutoffs.get(i), i);
            perCutoff.add(new HashMap<>());
        }
        this.label = label;
        this.m = m;
        this.column = column;
    }

    /** One labelled training row holding {@code level} ("" for an empty value). */
    void add(LocalDate cutoff, String level, double value) {
        Integer slot = slots.get(cutoff);
        if (slot == null) {
            throw new IllegalArgumentException(cutoff + " is not a training cutoff");
        }
        double[] total = all.computeIfAbsent(level, l -> new double[2]);
        total[0]++;
        total[1] += value;
        if (all.size() > Fitter.MAX_LEVELS) {
            throw Fitter.tooManyLevels(column, "target-mean");
        }
        double[] s = perCutoff.get(slot).computeIfAbsent(level, l -> new double[2]);
        s[0]++;
        s[1] += value;
    }

    /** The m-estimate (n * mean + m * prior) / (n + m) = (sum + m * prior) / (n + m) (Cestnik 1990). */
    static double mEstimate(double n, double sum, double prior, double m) {
        return n + m == 0 ? prior : (sum + m * prior) / (n + m);
    }

    /** The frozen fit over every labelled training row, levels most frequent first (ties by text). */
    FittedStep.TargetMean freeze() {
        double n = 0;
        double sum = 0;
        for (double[] s : all.values()) {
            n += s[0];
            sum += s[1];
        }
        double prior = n == 0 ? Double.NaN : sum / n;
        List<FittedStep.LevelMean> levels = new ArrayList<>();
        for (Map.Entry<String, double[]> e : all.entrySet()) {
            if (!e.getKey().isEmpty()) {
                levels.add(levelMean(e.getKey(), e.getValue(), prior));
            }
        }
        levels.sort(Comparator.comparingLong(FittedStep.LevelMean::rows).reversed()
                .thenComparing(FittedStep.LevelMean::level));
        FittedStep.LevelMean empty = levelMean("", all.getOrDefault("", new double[2]), prior);
        return new FittedStep.TargetMean(m, (long) n, prior, levels, empty);
    }

    private FittedStep.LevelMean levelMean(String level, double[] s, double prior) {
        return new FittedStep.LevelMean(level, (long) s[0], s[0] == 0 ? Double.NaN : s[1] / s[0],
                mEstimate(s[0], s[1], prior, m));
    }

    /**
     * The out-of-time encoding of {@code level} at a training cutoff, or null when no training label was
     * known by then (the first cutoffs of a build). Calls in ascending cutoff order are cheapest.
     */
    Double outOfTime(LocalDate cutoff, String level) {
        int n = eligible.computeIfAbsent(cutoff, this::eligibleCutoffs);
        if (n < mergedCutoffs) {
            merged.clear();
            mergedTotal[0] = 0;
            mergedTotal[1] = 0;
            mergedCutoffs = 0;
        }
        for (; mergedCutoffs < n; mergedCutoffs++) {
            for (Map.Entry<String, double[]> e : perCutoff.get(mergedCutoffs).entrySet()) {
                double[] s = merged.computeIfAbsent(e.getKey(), l -> new double[2]);
                s[0] += e.getValue()[0];
                s[1] += e.getValue()[1];
                mergedTotal[0] += e.getValue()[0];
                mergedTotal[1] += e.getValue()[1];
            }
        }
        if (mergedTotal[0] == 0) {
            return null;
        }
        double prior = mergedTotal[1] / mergedTotal[0];
        double[] s = merged.get(level);
        return s == null ? prior : mEstimate(s[0], s[1], prior, m);
    }

    /** How many training cutoffs (a prefix: horizons end in cutoff order) had their labels known at {@code c}. */
    private int eligibleCutoffs(LocalDate c) {
        LocalDate visibleUntil = new Boundary.CutoffEnd().at(c);
        int n = 0;
        while (n < cutoffs.size() && !label.end().at(cutoffs.get(n)).isAfter(visibleUntil)) {
            n++;
        }
        return n;
    }
}
