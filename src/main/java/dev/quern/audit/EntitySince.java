package dev.quern.audit;

import dev.quern.QuernException;
import dev.quern.plan.Cohort;
import dev.quern.plan.TimeRef;
import dev.quern.run.ValueFormat;
import dev.quern.schema.Engine;
import dev.quern.schema.ValueType;
import java.sql.Connection;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import org.jooq.DSLContext;
import org.jooq.Record2;
import org.jooq.exception.DataAccessException;
import org.jooq.impl.DSL;

/**
 * Each entity's since date, read from the source apart from the compiled query, to check the matrix's rows
 * against: an entity is in a cutoff's cohort only from its since date on. Kept as sorted 64-bit hashes of the
 * key's text (as the matrix writes it) with the day: 12 bytes an entity. Two keys with the same text keep the
 * earlier day, so a collision can hide a finding but never make one up.
 */
final class EntitySince {

    private final String keyName;
    private final String sinceName;
    private final long[] hashes;
    private final int[] days;
    private long violations;
    private String lastCutoff;
    private long lastDay;
    private final List<String> examples = new ArrayList<>();

    private EntitySince(String keyName, String sinceName, long[] hashes, int[] days) {
        this.keyName = keyName;
        this.sinceName = sinceName;
        this.hashes = hashes;
        this.days = days;
    }

    /** For a cohort without a since date: every entity is taken to exist at every cutoff. */
    static EntitySince none() {
        return new EntitySince("", "", new long[0], new int[0]);
    }

    static EntitySince read(Cohort cohort, Connection connection, Engine engine) {
        if (cohort.since().isEmpty()) {
            return none();
        }
        TimeRef since = cohort.since().get();
        DSLContext sql = engine.sql(connection);
        long[] hashes = new long[1024];
        int[] days = new int[1024];
        int n = 0;
        try (var cursor = sql.select(DSL.field(DSL.name(cohort.key().column())),
                        DSL.field(DSL.name(since.column().column())))
                .from(DSL.table(DSL.name(cohort.table()))).fetchSize(2_000).fetchLazy()) {
            for (Record2<Object, Object> r : cursor) {
                Optional<LocalDate> day = day(r.value2());
                if (r.value1() == null || day.isEmpty()) {
                    continue;
                }
                if (n == hashes.length) {
                    hashes = Arrays.copyOf(hashes, n * 2);
                    days = Arrays.copyOf(days, n * 2);
                }
                hashes[n] = hash(ValueFormat.format(r.value1(), cohort.keyType()));
                days[n] = (int) day.get().toEpochDay();
                n++;
            }
        } catch (DataAccessException e) {
            throw QuernException.data("the leakage audit could not read " + cohort.table() + ": " + e.getMessage(), e);
        }
        // The distinct hashes in order, each with the earliest day of the keys that have it.
        long[] sorted = Arrays.copyOf(hashes, n);
        Arrays.sort(sorted);
        int m = 0;
        for (int i = 0; i < n; i++) {
            if (m == 0 || sorted[m - 1] != sorted[i]) {
                sorted[m++] = sorted[i];
            }
        }
        int[] earliest = new int[m];
        Arrays.fill(earliest, Integer.MAX_VALUE);
        for (int i = 0; i < n; i++) {
            int at = Arrays.binarySearch(sorted, 0, m, hashes[i]);
            earliest[at] = Math.min(earliest[at], days[i]);
        }
        return new EntitySince(cohort.key().column(), since.column().column(), Arrays.copyOf(sorted, m), earliest);
    }

    /** Notes the matrix row of {@code key} at {@code cutoff} when the entity's since date is after it. */
    void check(String key, String cutoff) {
        if (hashes.length == 0) {
            return;
        }
        int at = Arrays.binarySearch(hashes, hash(key));
        if (at < 0) {
            return;
        }
        // Rows come cutoff by cutoff: the day is parsed once per run of rows at the same cutoff.
        if (!cutoff.equals(lastCutoff)) {
            lastCutoff = cutoff;
            try {
                lastDay = LocalDate.parse(cutoff.substring(0, Math.min(10, cutoff.length()))).toEpochDay();
            } catch (DateTimeParseException e) {
                lastDay = Long.MAX_VALUE;
            }
        }
        if (days[at] > lastDay) {
            violations++;
            if (examples.size() < SourceRows.EXAMPLES) {
                examples.add(keyName + " " + key + " at cutoff " + cutoff + ": " + sinceName + " "
                        + LocalDate.ofEpochDay(days[at]));
            }
        }
    }

    boolean applies() {
        return hashes.length > 0;
    }

    long violations() {
        return violations;
    }

    List<String> examples() {
        return List.copyOf(examples);
    }

    private static Optional<LocalDate> day(Object value) {
        if (value == null) {
            return Optional.empty();
        }
        if (value instanceof LocalDate date) {
            // What the text of any other value is parsed into; writing it out to parse it back was most of a read.
            return Optional.of(date);
        }
        String text = ValueFormat.format(value, ValueType.DATE);
        try {
            return Optional.of(LocalDate.parse(text.substring(0, Math.min(10, text.length()))));
        } catch (DateTimeParseException e) {
            return Optional.empty();
        }
    }

    private static long hash(String key) {
        return MatrixScan.cutoffHash(key, "");
    }
}
