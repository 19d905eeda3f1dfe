package dev.quern.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The facts of two provenance.json files that differ: recipe hash, tool version, source and its
 * fingerprint, each time column's rows and date range, cutoffs, row and column counts. Build times and
 * timings always differ and are left out; rows per cutoff are compared from the matrices instead.
 */
final class ProvenanceDiff {

    private static final Set<String> SKIPPED = Set.of("built_at", "timings", "rows_per_cutoff");

    private ProvenanceDiff() {
    }

    static List<Comparison.ProvenanceChange> between(BuildFiles old, BuildFiles now) {
        Map<String, String> o = flat(old.provenance());
        Map<String, String> n = flat(now.provenance());
        Set<String> keys = new LinkedHashSet<>(o.keySet());
        keys.addAll(n.keySet());
        List<Comparison.ProvenanceChange> out = new ArrayList<>();
        for (String k : keys) {
            String a = o.getOrDefault(k, "(absent)");
            String b = n.getOrDefault(k, "(absent)");
            if (!a.equals(b)) {
                out.add(new Comparison.ProvenanceChange(k, a, b));
            }
        }
        return out;
    }

    /**
     * Nested maps as dotted keys; a list of objects with a {@code column} is keyed by it
     * ({@code source.time_columns[rides.started_at].rows}); the cutoff list is summarised.
     */
    static Map<String, String> flat(Map<String, Object> provenance) {
        Map<String, String> out = new LinkedHashMap<>();
        flatten("", provenance, out);
        return out;
    }

    private static void flatten(String prefix, Object value, Map<String, String> out) {
        if (value instanceof Map<?, ?> map) {
            for (Map.Entry<?, ?> e : map.entrySet()) {
                String key = String.valueOf(e.getKey());
                if (prefix.isEmpty() && SKIPPED.contains(key)) {
                    continue;
                }
                flatten(prefix.isEmpty() ? key : prefix + "." + key, e.getValue(), out);
            }
        } else if (value instanceof List<?> list && !list.isEmpty() && list.stream().allMatch(
                v -> v instanceof Map<?, ?> m && m.get("column") != null)) {
            for (Object v : list) {
                Map<?, ?> m = (Map<?, ?>) v;
                String at = prefix + "[" + m.get("column") + "]";
                for (Map.Entry<?, ?> e : m.entrySet()) {
                    if (!"column".equals(e.getKey())) {
                        flatten(at + "." + e.getKey(), e.getValue(), out);
                    }
                }
            }
        } else if (value instanceof List<?> list && prefix.equals("cutoffs")) {
            out.put(prefix, list.isEmpty() ? "none" : list.size() + " from " + list.get(0) + " to "
                    + list.get(list.size() - 1));
        } else if (value instanceof List<?> list) {
            out.put(prefix, String.join(", ", list.stream().map(String::valueOf).toList()));
        } else {
            out.put(prefix, String.valueOf(value));
        }
    }
}
