package dev.quern.run;

import dev.quern.schema.Engine;
import java.sql.Connection;
import java.sql.SQLException;

/** A connection to read one more result on while others are still streaming. */
final class ConcurrentReads {

    private ConcurrentReads() {
    }

    /**
     * DuckDB streams one result per connection: a second query on it ends the first. A duplicate shares
     * the database (and its read-only setting) with a connection of its own. SQLite and PostgreSQL step
     * several open results on one connection.
     */
    static Connection another(Connection connection, Engine engine) throws SQLException {
        if (engine == Engine.DUCKDB) {
            return connection.unwrap(org.duckdb.DuckDBConnection.class).duplicate();
        }
        return connection;
    }
}
