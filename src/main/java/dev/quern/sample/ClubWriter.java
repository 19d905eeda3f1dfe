package dev.quern.sample;

import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.function.Function;
import java.util.function.ToLongFunction;

/**
 * Writes simulated lives into an empty SQLite database in one transaction. Event rows are numbered in time
 * order (ties by member, then by the member's own order), as an application appending rows would have
 * numbered them; that keeps the keys meaningful as tie-breakers.
 */
final class ClubWriter {

    private static final int BATCH = 5_000;

    private final Connection connection;

    ClubWriter(Connection connection) {
        this.connection = connection;
    }

    void write(StationMap stations, List<MemberLife> lives) throws SQLException {
        try (Statement statement = connection.createStatement()) {
            for (String ddl : ClubSchema.STATEMENTS) {
                statement.execute(ddl);
            }
        }
        connection.setAutoCommit(false);
        writeStations(stations);
        writeMembers(lives);
        writePlans(inTimeOrder(lives, MemberLife::plans, p -> p.validFrom().toEpochDay()));
        writeRides(inTimeOrder(lives, MemberLife::rides, Ride::startedAt));
        writePayments(inTimeOrder(lives, MemberLife::payments, Payment::paidAt));
        writeTickets(inTimeOrder(lives, MemberLife::tickets, Ticket::openedAt));
        writeCancellations(inTimeOrder(lives, l -> l.cancellation().stream().toList(), Cancellation::cancelledAt));
        try (Statement statement = connection.createStatement()) {
            for (String index : ClubSchema.INDEXES) {
                statement.execute(index);
            }
        }
        connection.commit();
        connection.setAutoCommit(true);
    }

    /** Lives come in member order and each member's rows in their own order, so a stable sort on time suffices. */
    private static <T> List<T> inTimeOrder(List<MemberLife> lives,
            Function<MemberLife, List<T>> rows, ToLongFunction<T> time) {
        List<T> all = new ArrayList<>();
        for (MemberLife life : lives) {
            all.addAll(rows.apply(life));
        }
        all.sort(Comparator.comparingLong(time));
        return all;
    }

    private void writeStations(StationMap stations) throws SQLException {
        try (PreparedStatement insert = connection.prepareStatement("INSERT INTO stations VALUES (?, ?, ?, ?)")) {
            for (Station s : stations.all()) {
                insert.setInt(1, s.id());
                insert.setString(2, s.name());
                insert.setString(3, s.zone().label());
                insert.setInt(4, s.docks());
                insert.addBatch();
            }
            insert.executeBatch();
        }
    }

    private void writeMembers(List<MemberLife> lives) throws SQLException {
        try (PreparedStatement insert = connection.prepareStatement("INSERT INTO members VALUES (?, ?, ?, ?, ?, ?, ?)")) {
            int count = 0;
            for (MemberLife life : lives) {
                MemberProfile m = life.profile();
                insert.setInt(1, m.id());
                insert.setString(2, Timeline.date(m.joinedOn()));
                insert.setString(3, m.homeZone().label());
                insert.setObject(4, m.birthYear());
                insert.setString(5, m.channel());
                insert.setString(6, life.status());
                insert.setString(7, Timeline.timestamp(life.updatedAt()));
                count = add(insert, count + 1);
            }
            insert.executeBatch();
        }
    }

    private void writePlans(List<PlanPeriod> plans) throws SQLException {
        try (PreparedStatement insert = connection.prepareStatement("INSERT INTO plans VALUES (?, ?, ?, ?, ?, ?)")) {
            int id = 0;
            for (PlanPeriod p : plans) {
                insert.setInt(1, ++id);
                insert.setInt(2, p.memberId());
                insert.setString(3, p.plan().label());
                insert.setDouble(4, p.plan().monthlyFee());
                insert.setString(5, Timeline.date(p.validFrom()));
                insert.setString(6, p.validTo() == null ? null : Timeline.date(p.validTo()));
                id = add(insert, id);
            }
            insert.executeBatch();
        }
    }

    private void writeRides(List<Ride> rides) throws SQLException {
        try (PreparedStatement insert = connection.prepareStatement("INSERT INTO rides VALUES (?, ?, ?, ?, ?, ?, ?, ?)")) {
            int id = 0;
            for (Ride r : rides) {
                insert.setInt(1, ++id);
                insert.setInt(2, r.memberId());
                insert.setString(3, Timeline.timestamp(r.startedAt()));
                insert.setString(4, Timeline.timestamp(r.endedAt()));
                insert.setInt(5, r.startStationId());
                insert.setInt(6, r.endStationId());
                insert.setDouble(7, r.distanceKm());
                insert.setDouble(8, r.durationMin());
                id = add(insert, id);
            }
            insert.executeBatch();
        }
    }

    private void writePayments(List<Payment> payments) throws SQLException {
        try (PreparedStatement insert = connection.prepareStatement("INSERT INTO payments VALUES (?, ?, ?, ?, ?)")) {
            int id = 0;
            for (Payment p : payments) {
                insert.setInt(1, ++id);
                insert.setInt(2, p.memberId());
                insert.setString(3, Timeline.timestamp(p.paidAt()));
                insert.setDouble(4, p.amount());
                insert.setString(5, p.status());
                id = add(insert, id);
            }
            insert.executeBatch();
        }
    }

    private void writeTickets(List<Ticket> tickets) throws SQLException {
        try (PreparedStatement insert = connection.prepareStatement("INSERT INTO tickets VALUES (?, ?, ?, ?, ?, ?)")) {
            int id = 0;
            for (Ticket t : tickets) {
                insert.setInt(1, ++id);
                insert.setInt(2, t.memberId());
                insert.setString(3, Timeline.timestamp(t.openedAt()));
                insert.setString(4, t.closedAt() == null ? null : Timeline.timestamp(t.closedAt()));
                insert.setString(5, t.topic());
                insert.setObject(6, t.satisfaction());
                id = add(insert, id);
            }
            insert.executeBatch();
        }
    }

    private void writeCancellations(List<Cancellation> cancellations) throws SQLException {
        try (PreparedStatement insert = connection.prepareStatement("INSERT INTO cancellations VALUES (?, ?, ?, ?)")) {
            int id = 0;
            for (Cancellation c : cancellations) {
                insert.setInt(1, ++id);
                insert.setInt(2, c.memberId());
                insert.setString(3, Timeline.timestamp(c.cancelledAt()));
                insert.setString(4, c.reason());
                id = add(insert, id);
            }
            insert.executeBatch();
        }
    }

    /** Queues the {@code count}-th row, flushing every {@link #BATCH} rows so memory stays flat; returns {@code count}. */
    private static int add(PreparedStatement insert, int count) throws SQLException {
        insert.addBatch();
        if (count % BATCH == 0) {
            insert.executeBatch();
        }
        return count;
    }
}
