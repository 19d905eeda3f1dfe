package dev.quern.sample;

import dev.quern.Diagnostic;
import dev.quern.Failure;
import dev.quern.Position;
import dev.quern.QuernException;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.PosixFilePermissions;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.SplittableRandom;

/** Writes the sample SQLite database of a fictional cycle club, the same rows for the same members and seed. */
public final class CycleClubGenerator {

    /** Member count of the shipped {@code sample-db/cycle-club.sqlite}. */
    public static final int SHIPPED_MEMBERS = 1800;
    /** Seed of the shipped {@code sample-db/cycle-club.sqlite}. */
    public static final long SHIPPED_SEED = 20250131L;

    private final int members;
    private final long seed;

    public CycleClubGenerator(int members, long seed) {
        if (members < 1) {
            throw new IllegalArgumentException("a club needs at least one member, not " + members);
        }
        this.members = members;
        this.seed = seed;
    }

    /** Rewrites the shipped sample: {@code CycleClubGenerator [file]}, by default {@code sample-db/cycle-club.sqlite}. */
    public static void main(String[] args) {
        Path file = Path.of(args.length > 0 ? args[0] : "sample-db/cycle-club.sqlite");
        new CycleClubGenerator(SHIPPED_MEMBERS, SHIPPED_SEED).writeTo(file, true);
        System.out.println("wrote " + file);
    }

    /** Writes a new database file; refuses if {@code sqliteFile} already exists. */
    public void writeTo(Path sqliteFile) {
        writeTo(sqliteFile, false);
    }

    /**
     * Writes the database to a temporary file beside {@code sqliteFile} and renames it into place only once
     * it is complete, so a failure never leaves a half-written database behind.
     *
     * @param replace whether an existing {@code sqliteFile} may be overwritten
     */
    public void writeTo(Path sqliteFile, boolean replace) {
        Path target = sqliteFile.toAbsolutePath();
        if (!replace && Files.exists(target, LinkOption.NOFOLLOW_LINKS)) {
            throw new QuernException(Failure.OUTPUT, List.of(Diagnostic.at(Position.NONE,
                    target + " already exists; choose another file or allow replacing it")));
        }
        Club club = simulate();
        Path temp = null;
        try {
            temp = Files.createTempFile(target.getParent(), "." + target.getFileName() + ".", ".tmp");
            shareReadably(temp);
            fill(temp, club);
            if (replace) {
                Files.move(temp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            } else {
                Files.move(temp, target);
            }
        } catch (IOException | SQLException e) {
            throw QuernException.output("cannot write the sample database " + target + ": " + e.getMessage(), e);
        } finally {
            deleteQuietly(temp);
        }
    }

    private Club simulate() {
        SplittableRandom root = new SplittableRandom(seed);
        StationMap stations = StationMap.draw(root.split());
        Seasons seasons = Seasons.draw(root.split());
        long[] joins = JoinCalendar.draw(members, root.split());
        LifeSimulator simulator = new LifeSimulator(new RideMaker(stations, seasons));
        List<MemberLife> lives = new ArrayList<>(members);
        for (int i = 0; i < members; i++) {
            // Each member draws from a stream of their own, so one member's draws never shift another's.
            SplittableRandom random = root.split();
            lives.add(simulator.simulate(MemberProfile.draw(i + 1, joins[i], random), random));
        }
        return new Club(stations, lives);
    }

    private static void fill(Path file, Club club) throws SQLException {
        try (Connection connection = DriverManager.getConnection("jdbc:sqlite:" + file)) {
            try (Statement statement = connection.createStatement()) {
                // No journal: the file is private until the rename, and a failed file is thrown away.
                statement.execute("PRAGMA journal_mode = OFF");
                statement.execute("PRAGMA synchronous = OFF");
                statement.execute("PRAGMA foreign_keys = ON");
            }
            new ClubWriter(connection).write(club.stations(), club.lives());
            try (Statement statement = connection.createStatement()) {
                statement.execute("VACUUM");
            }
        }
    }

    /** Temporary files start private to their owner; the finished database is meant to be shared. */
    private static void shareReadably(Path file) throws IOException {
        if (file.getFileSystem().supportedFileAttributeViews().contains("posix")) {
            Files.setPosixFilePermissions(file, PosixFilePermissions.fromString("rw-r--r--"));
        }
    }

    private static void deleteQuietly(Path temp) {
        if (temp == null) {
            return;
        }
        try {
            Files.deleteIfExists(temp);
        } catch (IOException ignored) {
            // Only a leftover temporary file; the real failure, if any, is already on its way.
        }
    }

    /** The stations and every member's life, as simulated from one seed. */
    private record Club(StationMap stations, List<MemberLife> lives) {
        Club {
            Objects.requireNonNull(stations, "stations");
            lives = List.copyOf(lives);
        }
    }
}
