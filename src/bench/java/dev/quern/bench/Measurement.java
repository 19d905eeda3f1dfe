package dev.quern.bench;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * What one quern variant measured at one scale on one engine, beside the hand-written query and the floor:
 * the median of each program's runs, and every run's time.
 */
record Measurement(
        Dataset data,
        Dataset.Engine engine,
        String variant,
        long cohortRows,
        double quernSeconds,
        double handwrittenSeconds,
        double floorSeconds,
        double peakHeapMb,
        boolean quernFinished,
        boolean equal,
        List<String> differences,
        Map<String, Object> quernTimings,
        List<Double> quernRuns,
        List<Double> handwrittenRuns,
        List<Double> floorRuns) {

    /** The heap limit every timed child JVM runs under. */
    static final int HEAP_LIMIT_MB = 256;

    Measurement {
        differences = List.copyOf(differences);
        quernRuns = List.copyOf(quernRuns);
        handwrittenRuns = List.copyOf(handwrittenRuns);
        floorRuns = List.copyOf(floorRuns);
        // In provenance's order (schema, compile, rules, audit, query, write): the order a build runs them.
        quernTimings = Collections.unmodifiableMap(new LinkedHashMap<>(quernTimings));
    }

    double ridesPerSecond() {
        return data.rides() / quernSeconds;
    }

    double ratioHandwritten() {
        return quernSeconds / handwrittenSeconds;
    }

    double ratioFloor() {
        return quernSeconds / floorSeconds;
    }

    boolean underHeapLimit() {
        return quernFinished && peakHeapMb < HEAP_LIMIT_MB;
    }
}
