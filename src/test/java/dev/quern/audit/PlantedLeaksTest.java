package dev.quern.audit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.BuildSummary;
import dev.quern.Compilation;
import dev.quern.Quern;
import dev.quern.run.MatrixWriter;
import dev.quern.run.Progress;
import dev.quern.sample.CycleClubGenerator;
import dev.quern.testing.TestDatabase;
import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.function.Consumer;
import java.util.function.UnaryOperator;
import java.util.stream.Collectors;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The planted-leak suite: variants of the sample database (a small one made by the same generator as the
 * shipped sample) and of the demo recipe, each planting exactly one kind of leak. The audit must find every
 * one, with the check expected for it, and no blocking finding of another check; the clean demo recipe, on
 * the small club and on the shipped sample, must give no blocking finding and no warning. The detection table
 * is printed at the end.
 */
class PlantedLeaksTest {

    private static final Path DEMO = Path.of("recipes/member-churn.yaml");

    @TempDir
    static Path folder;

    private static Path club;
    private static String demo;
    private static final List<String> detections = new ArrayList<>();

    @BeforeAll
    static void smallClub() throws IOException {
        club = folder.resolve("club.sqlite");
        new CycleClubGenerator(400, 11).writeTo(club);
        demo = Files.readString(DEMO).replace("../sample-db/cycle-club.sqlite", "club.sqlite");
    }

    @AfterAll
    static void printDetectionTable() {
        StringBuilder table = new StringBuilder("\nPlanted leaks and what the audit found\n\n");
        String row = "| %-62s | %-14s | %-5s |%n";
        table.append(String.format(row, "planted leak", "expected check", "found"));
        table.append(String.format(row, "-".repeat(62), "-".repeat(14), "-".repeat(5)));
        detections.stream().sorted().forEach(table::append);
        System.out.println(table);
    }

    @Test
    void theCleanDemoOnTheShippedSampleHasNoBlockingFindingAndNoWarning() throws IOException {
        Path out = folder.resolve("shipped-demo");
        BuildSummary built = Quern.load(DEMO).build(out, Progress.SILENT);
        AuditReport report = built.audit();
        boolean clean = report.open(Severity.BLOCKING) == 0 && report.open(Severity.WARNING) == 0;
        detections.add(String.format("| %-62s | %-14s | %-5s |%n", "none: the demo recipe on the shipped sample",
                "(none open)", clean ? "clean" : "NOT"));
        assertTrue(clean, report.markdown());
        assertFalse(report.blocked());
        assertEquals(Set.of("home_zone", "start_station_distinct_zone_90d"), report.findings().stream()
                .filter(f -> !f.isOpen()).flatMap(f -> f.columns().stream()).collect(Collectors.toSet()));
        assertTrue(Files.exists(out.resolve("matrix.csv")));
        assertTrue(Files.readString(out.resolve("audit.json")).contains("\"outcome\": \"passed\""));
        assertTrue(Files.readString(out.resolve("dictionary.csv")).contains("Leakage audit, current-state"
                + " acknowledged: Members give their home zone when they join"), "the dictionary records the reason");
        assertEquals("pass", report.result(Check.TIME_ORDER), report.markdown());
        assertEquals("pass", report.result(Check.SINGLE_FEATURE), report.markdown());
        assertEquals("pass", report.result(Check.COHORT), report.markdown());
    }

    @Test
    void theCleanDemoOnTheSmallClubHasNoBlockingFindingAndNoWarning() {
        AuditReport report = build(recipe("clean", demo, club)).audit(a -> a);
        assertEquals(0, report.open(Severity.BLOCKING), report.markdown());
        assertEquals(0, report.open(Severity.WARNING), report.markdown());
        detections.add(String.format("| %-62s | %-14s | %-5s |%n", "none: the demo recipe on the small club",
                "(none open)", "clean"));
    }

    @Test
    void aLookupOfTheMembersCurrentStatusIsCurrentState() {
        String text = withFeature(demo, "  - lookup: members.status\n    name: status\n");
        AuditReport report = build(recipe("status", text, club)).audit(a -> a);
        detect("members.status looked up without acknowledgement", Check.CURRENT_STATE, "status", report,
                Set.of(Check.CURRENT_STATE));
        assertTrue(report.blocked());
        // members declares updated_at: the finding counts the member rows changed after their cutoff.
        Finding status = report.findings(Check.CURRENT_STATE).stream()
                .filter(f -> f.columns().equals(List.of("status"))).findFirst().orElseThrow();
        assertTrue((Long) status.counts().get("rows_updated_after_cutoff") > 0, status.counts().toString());
        for (String example : status.examples()) {
            String cutoff = example.replaceAll(".* at cutoff (\\S+): .*", "$1");
            String updated = example.replaceAll(".*updated_at (\\S+) .*", "$1");
            assertTrue(updated.compareTo(cutoff) > 0, example);
        }
    }

    /**
     * Time order needs a window that is wrong, which a compiled plan cannot have: the test seam restates the
     * windows with an end one day late, as an off-by-one in the window would, and the audit's independent
     * comparison of each row's date with its cutoff finds the rides of the first day after the cutoff.
     */
    @Test
    void aWindowThatEndsADayLateIsCaughtByTheTimeOrderAndHorizonChecks() {
        AuditReport report = build(recipe("late-window", demo, club)).audit(a -> a.withBoundaries(new Boundaries() {
            @Override
            public LocalDate visibleUntil(LocalDate cutoff) {
                return cutoff.plusDays(2);
            }

            @Override
            public LocalDate windowStart(dev.quern.recipe.Span window, LocalDate cutoff) {
                return Boundaries.PLAN.windowStart(window, cutoff);
            }
        }));
        detect("window end a day late (test seam)", Check.TIME_ORDER, "rides_count_30d", report,
                Set.of(Check.TIME_ORDER, Check.HORIZON));
        detect("window end a day late (test seam)", Check.HORIZON, "rides_count_30d", report,
                Set.of(Check.TIME_ORDER, Check.HORIZON));
        Finding rides = report.findings(Check.TIME_ORDER).stream()
                .filter(f -> f.columns().contains("rides_count_30d")).findFirst().orElseThrow();
        assertTrue(rides.examples().get(0).matches("member_id \\d+ at cutoff (\\d{4}-\\d\\d-\\d\\d): rides ride_id"
                + " \\d+, started_at \\d{4}-\\d\\d-\\d\\d .*"), rides.examples().get(0));
        for (String example : rides.examples()) {
            LocalDate cutoff = LocalDate.parse(example.replaceAll(".* at cutoff (\\S+): .*", "$1"));
            LocalDate started = LocalDate.parse(example.replaceAll(".*started_at (\\S+) .*", "$1"));
            assertEquals(cutoff.plusDays(1), started, "each example is a ride of the day after its cutoff");
        }
    }

    @Test
    void aTicketSatisfactionFilledInAtClosingIsFilledLater() {
        String text = withFeature(demo.replace("    time: opened_at\n",
                "    time: opened_at\n    filled: { satisfaction: closed_at }\n"),
                "  - from: tickets\n    windows: [90d]\n    measures: [mean(satisfaction)]\n");
        AuditReport report = build(recipe("satisfaction", text, club)).audit(a -> a);
        detect("mean ticket satisfaction, filled in when a ticket closes", Check.FILLED_LATER,
                "tickets_mean_satisfaction_90d", report, Set.of(Check.FILLED_LATER));
    }

    @Test
    void paymentsRewrittenByALaterRefundAreLateUpdates() {
        Path db = copyOfClub("refunds",
                "alter table payments add column updated_at text",
                "update payments set updated_at = paid_at",
                "update payments set updated_at = datetime(paid_at, '+40 days') where status = 'refunded'");
        String text = withFeature(demo.replace("    time: paid_at\n", "    time: paid_at\n    updated: updated_at\n"),
                "  - lookup: payments.status\n    name: last_payment_status\n");
        AuditReport report = build(recipe("refunds", text, db)).audit(a -> a);
        detect("payments rewritten 40 days later by a refund (updated_at)", Check.LATE_UPDATE, "payments_count_30d",
                report, Set.of());
        assertTrue(report.findings(Check.LATE_UPDATE).stream()
                        .anyMatch(f -> f.columns().equals(List.of("last_payment_status"))),
                "the latest payment, looked up, is checked too:\n" + report.markdown());
    }

    /**
     * Stations keep no history, but when they declare an update time and no station read was updated after
     * its cutoff, every value read is as it was then: the current-state finding is only a note.
     */
    @Test
    void aCurrentStateTableWhoseRowsWereNotUpdatedSinceIsOnlyANote() {
        Path db = copyOfClub("stations-unchanged",
                "alter table stations add column updated_at text",
                "update stations set updated_at = '2023-12-01 09:00:00'");
        String text = demo.replace("  stations:\n    key: station_id\n",
                "  stations:\n    key: station_id\n    updated: updated_at\n");
        AuditReport report = build(recipe("stations-unchanged", text, db)).audit(a -> a);
        Finding zone = report.findings(Check.CURRENT_STATE).stream()
                .filter(f -> f.columns().equals(List.of("start_station_distinct_zone_90d"))).findFirst().orElseThrow();
        assertEquals(Severity.NOTE, zone.severity(), zone.summary());
        assertEquals(0L, zone.counts().get("rows_updated_after_cutoff"));
        assertTrue((Long) zone.counts().get("rows_read") > 1000, zone.counts().toString());
    }

    @Test
    void noticesThatReproduceTheLabelAreCaughtByTheScreen() {
        Path db = copyOfClub("notices",
                "create table notices (notice_id integer primary key, member_id integer, given_at text)",
                "insert into notices select cancellation_id, member_id, datetime(cancelled_at, '-60 days')"
                        + " from cancellations");
        String text = withFeature(demo.replace("tables:\n",
                "tables:\n  notices: { key: notice_id, time: given_at, links: { member_id: members } }\n"),
                "  - from: notices\n    windows: [60d]\n    measures: [count]\n");
        Built built = build(recipe("notices", text, db));
        AuditReport report = built.audit(a -> a);
        detect("notices dated 60 days before each cancellation (label copy)", Check.SINGLE_FEATURE,
                "notices_count_60d", report, Set.of());
        Finding f = report.findings(Check.SINGLE_FEATURE).stream()
                .filter(x -> x.columns().contains("notices_count_60d")).findFirst().orElseThrow();
        assertEquals(1.0, f.counts().get("auc"), "the notices reproduce the label exactly");
        // The screen in one column per pass gives the same statistics as all columns in one pass.
        AuditReport narrow = built.audit(a -> a.withMemory(8));
        assertEquals(evidence(report, Check.SINGLE_FEATURE), evidence(narrow, Check.SINGLE_FEATURE));
    }

    @Test
    void bookingsThatReproduceANumericLabelAreCaughtBySpearmansRho() {
        Path db = copyOfClub("bookings",
                "create table bookings (booking_id integer primary key, member_id integer, booked_at text)",
                "insert into bookings select ride_id, member_id, datetime(started_at, '-30 days') from rides");
        String text = withFeature(demo
                        .replace("  name: cancels_in_60d\n  from: cancellations\n  horizon: 60d\n  value: exists\n",
                                "  name: rides_next_30d\n  from: rides\n  horizon: 30d\n  value: count\n")
                        .replace("tables:\n",
                                "tables:\n  bookings: { key: booking_id, time: booked_at, links: { member_id: members } }\n"),
                "  - from: bookings\n    windows: [30d]\n    measures: [count]\n");
        AuditReport report = build(recipe("bookings", text, db)).audit(a -> a);
        detect("rides booked 30 days ahead (copy of a count label)", Check.SINGLE_FEATURE, "bookings_count_30d",
                report, Set.of());
        Finding f = report.findings(Check.SINGLE_FEATURE).stream()
                .filter(x -> x.columns().contains("bookings_count_30d")).findFirst().orElseThrow();
        // Not exactly 1: the demo's plausibility rule drops a few rides from the label, none from the bookings.
        assertTrue(((Number) f.counts().get("rho")).doubleValue() >= 0.99, "the bookings reproduce the label: " + f);
    }

    /**
     * A view repeats one member with its key stored as text: the key check sees two distinct keys (5 and
     * '5'), SQLite's affinity joins both to the member's rows, and the matrix has the member twice per cutoff.
     */
    @Test
    void aMemberRepeatedThroughAViewIsADuplicateInTheCohort() {
        long member = firstLoyalMember();
        Path db = copyOfClub("repeated",
                "alter table members rename to member_rows",
                "create view members as select * from member_rows union all select cast(member_id as text),"
                        + " joined_on, home_zone, birth_year, referral_channel, status, updated_at from member_rows"
                        + " where member_id = " + member);
        AuditReport report = build(recipe("repeated", demo, db)).audit(a -> a);
        detect("a view repeating member " + member + " with a text key", Check.COHORT, "member_id", report,
                Set.of(Check.COHORT));
        Finding f = report.findings(Check.COHORT).get(0);
        assertEquals("member_id " + member + " at cutoff 2024-06-30", f.examples().get(0));
    }

    /** The compiled cohort cannot hold an entity before its since date, so this leak is planted in the matrix. */
    @Test
    void aRowBeforeTheMembersJoiningDateIsCaught() {
        long member = scalar(club, "select min(member_id) from members where joined_on > '2025-07-15'");
        Built built = build(recipe("before-joining", demo, club));
        AuditReport report = built.withMatrix(matrix -> {
            try {
                List<String> lines = Files.readAllLines(matrix);
                String copy = lines.stream().filter(l -> l.contains(",2025-06-30,")).findFirst().orElseThrow();
                lines.add(member + copy.substring(copy.indexOf(',')));
                Files.write(matrix, lines, StandardCharsets.UTF_8);
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }).audit(a -> a);
        detect("a matrix row at 2025-06-30 for a member who joined later", Check.COHORT, "member_id",
                report, Set.of(Check.COHORT));
        assertTrue(report.findings(Check.COHORT).get(0).examples().get(0)
                .startsWith("member_id " + member + " at cutoff 2025-06-30: joined_on 2025-"));
    }

    @Test
    void aSplitWhoseTrainingLabelsReachIntoTheTestPeriodIsCaught() {
        String text = demo.replace("\naudit:\n",
                "\nsplit:\n  train: { to: 2025-03-31 }\n  validation: { from: 2025-04-30 }\n\naudit:\n");
        AuditReport report = build(recipe("split", text, club)).audit(a -> a);
        // A test part this close is refused when the recipe is compiled (the encode stage's gap rule); the
        // audit is what catches a validation part whose first cutoff lies inside training labels.
        detect("train to 2025-03-31, validation from 2025-04-30, 60d horizon", Check.TIME_SPLIT, "cancels_in_60d", report,
                Set.of(Check.TIME_SPLIT));
        Finding f = report.findings(Check.TIME_SPLIT).get(0);
        assertEquals(1L, f.counts().get("cutoffs"), "only 2025-03-31's horizon (to 2025-05-30) reaches past 2025-04-30");
        assertTrue(f.fix().startsWith("End train at 2025-02-28"), f.fix());
    }

    @Test
    void aFeatureReadFromASensitiveColumnGetsANote() {
        String text = withFeature(demo, "  - lookup: members.birth_year\n    name: birth_year\n")
                .replace("  acknowledge:\n", "  acknowledge:\n    - check: current-state\n      column: birth_year\n"
                        + "      reason: A birth year does not change.\n");
        AuditReport report = build(recipe("birth-year", text, club)).audit(a -> a);
        detect("birth year as a feature, marked sensitive", Check.SENSITIVE, "birth_year", report, Set.of());
        assertFalse(report.blocked(), report.markdown());
        assertTrue(report.findings(Check.SENSITIVE).get(0).summary().contains("regulated in many places"));
    }

    // ---- helpers

    /** Records and asserts one detection: an open finding of the expected check names the planted column. */
    private static void detect(String leak, Check expected, String column, AuditReport report,
                               Set<Check> blockingAllowed) {
        boolean found = report.findings(expected).stream()
                .anyMatch(f -> f.isOpen() && f.columns().contains(column));
        detections.add(String.format("| %-62s | %-14s | %-5s |%n", leak, expected.id(), found ? "yes" : "NO"));
        assertTrue(found, expected.id() + " should name " + column + ":\n" + report.markdown());
        Set<Check> blocking = new TreeSet<>();
        report.findings().stream().filter(Finding::blocks).forEach(f -> blocking.add(f.check()));
        assertTrue(blockingAllowed.containsAll(blocking), "one kind of leak, but blocking " + blocking + ":\n"
                + report.markdown());
    }

    private static String evidence(AuditReport report, Check check) {
        return report.checks().stream().filter(c -> c.check() == check).findFirst().orElseThrow().evidence();
    }

    private static String withFeature(String recipe, String feature) {
        return recipe.replace("\naudit:\n", feature + "\naudit:\n");
    }

    /** A recipe file in a folder of its own, beside the database it reads as club.sqlite. */
    private static Path recipe(String name, String text, Path database) {
        try {
            Path dir = folder.resolve(name);
            Files.createDirectories(dir);
            if (!database.getParent().equals(dir)) {
                Files.copy(database, dir.resolve("club.sqlite"));
            }
            Path file = dir.resolve(name + ".yaml");
            Files.writeString(file, text);
            return file;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** A copy of the small club in a folder of its own, changed by some SQL. */
    private static Path copyOfClub(String name, String... sql) {
        try {
            Path dir = folder.resolve(name);
            Files.createDirectories(dir);
            Path copy = dir.resolve("club.sqlite");
            Files.copy(club, copy);
            try (TestDatabase db = TestDatabase.create(copy)) {
                db.execute(sql);
            }
            return copy;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** A member who joined before the first cutoff and never cancelled. */
    private static long firstLoyalMember() {
        return scalar(club, "select min(member_id) from members where joined_on < '2024-06-01'"
                + " and member_id not in (select member_id from cancellations)");
    }

    private static long scalar(Path db, String sql) {
        try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db);
             Statement s = c.createStatement(); ResultSet rs = s.executeQuery(sql)) {
            rs.next();
            return rs.getLong(1);
        } catch (SQLException e) {
            throw new IllegalStateException(e);
        }
    }

    /**
     * A compiled recipe with its matrix written to a file, ready to audit (more than once). An audit reads the
     * file back, and also watches the matrix written again (or, when the test changed the file, is handed the
     * file's records) and must reach the same report: every planted leak is found both ways.
     */
    private record Built(Compilation compilation, Path matrix, boolean changed) {
        AuditReport audit(UnaryOperator<Audit> tweak) {
            try (Connection connection = compilation.source().open()) {
                AuditReport read = tweak.apply(audit()).run(connection, matrix);
                Audit watching = tweak.apply(audit());
                Audit.SourceEvidence evidence = watching.readSource(connection);
                Audit.Watch watch = watching.watch(() -> evidence);
                // A planted row is not the writer's: the watch is handed the changed file's records instead.
                Path watched = changed ? feed(watch) : write(compilation, watch);
                assertEquals(read.json(), watching.run(watch, watched).json(),
                        "the audit of the matrix as it was written differs from the audit of the file read back");
                return read;
            } catch (SQLException e) {
                throw new IllegalStateException(e);
            }
        }

        private Path feed(Audit.Watch watch) {
            try (var parser = MatrixWriter.FORMAT.builder().setHeader().setSkipHeaderRecord(true).get()
                    .parse(Files.newBufferedReader(matrix, StandardCharsets.UTF_8))) {
                parser.forEach(record -> watch.accept(record.values()));
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
            return matrix;
        }

        private Audit audit() {
            return Audit.of(compilation.recipe(), compilation.plan(), compilation.schema());
        }

        Built withMatrix(Consumer<Path> change) {
            change.accept(matrix);
            return new Built(compilation, matrix, true);
        }
    }

    private static Built build(Path recipe) {
        Compilation compilation = Quern.load(recipe).compile();
        return new Built(compilation, write(compilation, record -> { }), false);
    }

    private static Path write(Compilation compilation, Consumer<String[]> watch) {
        Path recipe = Path.of(compilation.recipe().file());
        try {
            Path matrix = Files.createTempFile(recipe.getParent(), "matrix-", ".csv");
            try (Connection connection = compilation.source().open();
                 OutputStream out = Files.newOutputStream(matrix)) {
                MatrixWriter.write(compilation.query(), connection, out, Progress.SILENT, watch);
            }
            return matrix;
        } catch (IOException | SQLException e) {
            throw new IllegalStateException(e);
        }
    }
}
