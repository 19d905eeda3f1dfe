package dev.quern.encode;

import dev.quern.BuildSummary;
import dev.quern.Quern;
import dev.quern.recipe.RecipeReader;
import dev.quern.run.Progress;
import dev.quern.testing.Matrix;
import dev.quern.testing.TestDatabase;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * A small hand-made club for encoding tests: members with a zone, a tier and a fee (entity attributes),
 * rides with a distance, and complaints, the label's table. Rows are added by the test, then written.
 */
final class Club {

    /** The recipe every encoding test starts from; a test appends its own {@code encode} and {@code split}. */
    static final String RECIPE = """
            recipe: club
            source: jdbc:sqlite:club.sqlite
            entity: { table: members, key: member_id, since: joined_on }
            cutoffs: { dates: [2025-01-31, 2025-02-28, 2025-03-31, 2025-04-30] }
            tables:
              rides: { key: ride_id, time: started_at, links: { member_id: members } }
              complaints: { key: complaint_id, time: made_at, links: { member_id: members } }
            label: { name: complains_in_30d, from: complaints, horizon: 30d, value: exists }
            features:
              - from: rides
                windows: [30d]
                measures: [count, sum(km)]
              - lookup: members.zone
                name: zone
              - lookup: members.tier
                name: tier
              - lookup: members.fee
                name: fee
            audit:
              acknowledge:
                - { check: current-state, column: zone, reason: "test data: a member's zone is set when it joins" }
                - { check: current-state, column: tier, reason: "test data: a member's tier is set when it joins" }
                - { check: current-state, column: fee, reason: "test data: a member's fee is set when it joins" }
            """;

    final List<List<Object>> members = new ArrayList<>();
    final List<List<Object>> rides = new ArrayList<>();
    final List<List<Object>> complaints = new ArrayList<>();

    Club member(int id, String joined, String zone, String tier, Double fee) {
        members.add(java.util.Arrays.asList(id, joined, zone, tier, fee));
        return this;
    }

    Club ride(int member, String at, double km) {
        rides.add(List.of(rides.size() + 1, member, at, km));
        return this;
    }

    Club complaint(int member, String at) {
        complaints.add(List.of(complaints.size() + 1, member, at));
        return this;
    }

    /** Writes the database as {@code club.sqlite} in {@code folder}, replacing an earlier one. */
    void writeTo(Path folder) {
        try {
            java.nio.file.Files.deleteIfExists(folder.resolve("club.sqlite"));
        } catch (java.io.IOException e) {
            throw new IllegalStateException(e);
        }
        try (TestDatabase db = TestDatabase.create(folder.resolve("club.sqlite"))) {
            db.execute("create table members (member_id integer primary key, joined_on text, zone text, tier text,"
                            + " fee real)",
                    "create table rides (ride_id integer primary key, member_id integer, started_at text, km real)",
                    "create table complaints (complaint_id integer primary key, member_id integer, made_at text)");
            db.insert("members", members).insert("rides", rides).insert("complaints", complaints);
        }
    }

    /** Builds {@code recipe} (text) from {@code folder} into {@code folder/out}, and reads the matrix back. */
    static Matrix build(Quern quern, Path out) {
        BuildSummary built = quern.build(out, Progress.SILENT);
        if (built.files().isEmpty()) {
            throw new IllegalStateException("nothing written");
        }
        return Matrix.read(out.resolve(Quern.MATRIX));
    }

    static Quern recipe(Path folder, String text) {
        return Quern.of(RecipeReader.parse("club.yaml", text), folder);
    }
}
