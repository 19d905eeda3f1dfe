package dev.quern.bench;

import dev.quern.report.Json;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The benchmark's results as {@code results.json} (one object per scale, engine and quern variant) and as
 * a Markdown table for the terminal and the README. Scaling compares each scale with the one before on
 * the same engine: doubling the rides should at most double the time, with 15% to spare.
 */
final class Report {

    static final double SCALING_ALLOWANCE = 1.15;

    private final List<Measurement> results;
    private final Map<Measurement, Measurement> previous = new HashMap<>();

    Report(List<Measurement> results) {
        this.results = List.copyOf(results);
        Map<String, Measurement> last = new HashMap<>();
        for (Measurement m : results) {
            String series = m.engine() + "/" + m.variant();
            Measurement before = last.put(series, m);
            if (before != null) {
                previous.put(m, before);
            }
        }
    }

    String json() {
        List<Object> objects = new ArrayList<>();
        for (Measurement m : results) {
            Map<String, Object> o = new LinkedHashMap<>();
            o.put("scale", m.data().scale());
            o.put("engine", m.engine().label);
            o.put("variant", m.variant());
            o.put("seed", m.data().seed());
            o.put("members", m.data().members());
            o.put("rides", m.data().rides());
            o.put("payments", m.data().payments());
            o.put("cohort_rows", m.cohortRows());
            o.put("quern_s", round(m.quernSeconds()));
            o.put("handwritten_s", round(m.handwrittenSeconds()));
            o.put("floor_s", round(m.floorSeconds()));
            o.put("peak_heap_mb", round(m.peakHeapMb()));
            o.put("under_heap_limit", m.underHeapLimit());
            o.put("rows_per_s", Math.round(m.ridesPerSecond()));
            o.put("ratio_handwritten", round(m.ratioHandwritten()));
            o.put("ratio_floor", round(m.ratioFloor()));
            o.put("equal", m.equal());
            if (!m.differences().isEmpty()) {
                o.put("differences", m.differences());
            }
            Measurement before = previous.get(m);
            if (before != null) {
                o.put("time_ratio_to_previous", round(m.quernSeconds() / before.quernSeconds()));
                o.put("rides_ratio_to_previous", round((double) m.data().rides() / before.data().rides()));
            }
            o.put("quern_timings_ms", m.quernTimings());
            if (m.quernRuns().size() > 1) {
                o.put("quern_runs_s", m.quernRuns().stream().map(Report::round).toList());
                o.put("handwritten_runs_s", m.handwrittenRuns().stream().map(Report::round).toList());
                o.put("floor_runs_s", m.floorRuns().stream().map(Report::round).toList());
            }
            objects.add(o);
        }
        return Json.write(objects);
    }

    String table() {
        StringBuilder out = new StringBuilder();
        out.append("| rides | engine | run | cohort rows | quern s | hand-written s | floor s | quern/hand | quern/floor"
                + " | rides/s | peak heap MB | < 256 MB | equal | time vs previous scale |\n");
        out.append("| ---: | --- | --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | --- | --- | --- |\n");
        for (Measurement m : results) {
            out.append(String.format(Locale.ROOT,
                    "| %,d | %s | %s | %,d | %.2f | %.2f | %.2f | %.2f | %.1f | %,.0f | %.0f | %s | %s | %s |%n",
                    m.data().rides(), m.engine().label, m.variant(), m.cohortRows(), m.quernSeconds(),
                    m.handwrittenSeconds(), m.floorSeconds(), m.ratioHandwritten(), m.ratioFloor(),
                    m.ridesPerSecond(), m.peakHeapMb(), m.underHeapLimit() ? "yes" : "NO",
                    m.equal() ? "yes" : "NO", scaling(m)));
        }
        return out.toString();
    }

    private String scaling(Measurement m) {
        Measurement before = previous.get(m);
        if (before == null) {
            return "";
        }
        double time = m.quernSeconds() / before.quernSeconds();
        double rides = (double) m.data().rides() / before.data().rides();
        return String.format(Locale.ROOT, "x%.2f for x%.2f rides%s", time, rides,
                time <= rides * SCALING_ALLOWANCE ? "" : " (worse than linear)");
    }

    private static Object round(double value) {
        return Double.isFinite(value) ? Math.round(value * 1000) / 1000.0 : null;
    }
}
