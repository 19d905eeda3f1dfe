package dev.quern.sample;

import java.util.List;

/** The sample database's tables and indexes, exactly as the rest of Quern and its tests expect them. */
final class ClubSchema {

    static final List<String> STATEMENTS = List.of(
            "CREATE TABLE stations (station_id INTEGER PRIMARY KEY, name TEXT NOT NULL, zone TEXT NOT NULL,"
                    + " docks INTEGER NOT NULL)",
            "CREATE TABLE members (member_id INTEGER PRIMARY KEY, joined_on TEXT NOT NULL, home_zone TEXT NOT NULL,"
                    + " birth_year INTEGER, referral_channel TEXT NOT NULL, status TEXT NOT NULL,"
                    + " updated_at TEXT NOT NULL)",
            "CREATE TABLE plans (plan_row_id INTEGER PRIMARY KEY,"
                    + " member_id INTEGER NOT NULL REFERENCES members(member_id), plan TEXT NOT NULL,"
                    + " monthly_fee REAL NOT NULL, valid_from TEXT NOT NULL, valid_to TEXT)",
            "CREATE TABLE rides (ride_id INTEGER PRIMARY KEY,"
                    + " member_id INTEGER NOT NULL REFERENCES members(member_id), started_at TEXT NOT NULL,"
                    + " ended_at TEXT NOT NULL,"
                    + " start_station_id INTEGER NOT NULL REFERENCES stations(station_id),"
                    + " end_station_id INTEGER NOT NULL REFERENCES stations(station_id),"
                    + " distance_km REAL NOT NULL, duration_min REAL NOT NULL)",
            "CREATE TABLE payments (payment_id INTEGER PRIMARY KEY,"
                    + " member_id INTEGER NOT NULL REFERENCES members(member_id), paid_at TEXT NOT NULL,"
                    + " amount REAL NOT NULL, status TEXT NOT NULL)",
            "CREATE TABLE tickets (ticket_id INTEGER PRIMARY KEY,"
                    + " member_id INTEGER NOT NULL REFERENCES members(member_id), opened_at TEXT NOT NULL,"
                    + " closed_at TEXT, topic TEXT NOT NULL, satisfaction INTEGER)",
            "CREATE TABLE cancellations (cancellation_id INTEGER PRIMARY KEY,"
                    + " member_id INTEGER NOT NULL REFERENCES members(member_id), cancelled_at TEXT NOT NULL,"
                    + " reason TEXT NOT NULL)");

    /** Created after the rows are in: building an index once is quicker than keeping it up row by row. */
    static final List<String> INDEXES = List.of(
            "CREATE INDEX idx_rides_member_started_at ON rides (member_id, started_at)",
            "CREATE INDEX idx_rides_started_at ON rides (started_at)",
            "CREATE INDEX idx_payments_member_paid_at ON payments (member_id, paid_at)",
            "CREATE INDEX idx_tickets_member_opened_at ON tickets (member_id, opened_at)",
            "CREATE INDEX idx_cancellations_member_cancelled_at ON cancellations (member_id, cancelled_at)",
            "CREATE INDEX idx_plans_member_valid_from ON plans (member_id, valid_from)");

    private ClubSchema() {
    }
}
