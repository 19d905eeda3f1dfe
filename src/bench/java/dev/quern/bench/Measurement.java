package dev.quern.bench;

import java.util.List;
import java.util.Map;

/** What one quern variant measured at one scale on one engine, beside the hand-written query and the floor. */
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
        Map<String, Object> quernTimings) {

    /** The heap limit every timed child JVM runs under. */
    static final int HEAP_LIMIT_MB = 256;

    Measurement {
        differences = List.copyOf(differences);
        quernTimings = Map.copyOf(quernTimings);
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
