package dev.quern.load;

import dev.quern.schema.Engine;
import java.util.List;
import org.jooq.DSLContext;
import org.jooq.impl.DSL;

/**
 * What differs between the engines a SQLite database is loaded into: type names, collation, which indexes
 * pay off and what refreshes the planner's statistics. Each choice names the engine fact behind it.
 */
abstract class LoadTarget {

    static LoadTarget of(Engine engine) {
        return switch (engine) {
            case POSTGRES -> new Postgres();
            case MARIADB -> new MariaDb(engine, "utf8mb4_nopad_bin");
            // MySQL's utf8mb4_bin pads with spaces; its NO PAD binary collation needs 8.0, so keep the one
            // every version has.
            case MYSQL -> new MariaDb(engine, "utf8mb4_bin");
            case DUCKDB -> new DuckDb();
            case SQLITE -> throw new IllegalArgumentException("a SQLite target is a copy of the file");
            case SPARK -> throw new IllegalArgumentException("Spark is read, never loaded");
        };
    }

    abstract Engine engine();

    /** The column type for a column of this kind. */
    abstract String type(SqliteTables.Column column);

    /** Added after the closing parenthesis of CREATE TABLE. */
    String tableOptions() {
        return "";
    }

    /** Whether an index on this column can be made at all. */
    boolean indexable(SqliteTables.Column column) {
        return true;
    }

    /** Whether indexes beyond the primary key help this engine's scans. */
    boolean secondaryIndexes() {
        return true;
    }

    /** Whether CREATE TABLE takes part in a transaction (else a failed load drops what it made). */
    boolean transactionalDdl() {
        return true;
    }

    /** Statements that refresh the planner's statistics after a table is loaded. */
    List<String> afterLoad(String table) {
        return List.of();
    }

    final String quote(String identifier) {
        return sql().render(DSL.name(identifier));
    }

    final DSLContext sql() {
        return engine().sql();
    }

    /** PostgreSQL. */
    static final class Postgres extends LoadTarget {
        @Override
        Engine engine() {
            return Engine.POSTGRES;
        }

        /**
         * Text gets the "C" collation: byte order, as SQLite compares text, so min, max and sorting agree;
         * the database's default (often en_US) orders case and punctuation differently.
         */
        @Override
        String type(SqliteTables.Column column) {
            return switch (column.kind()) {
                case INTEGER -> "bigint";
                case DOUBLE -> "double precision";
                case TEXT -> "text collate \"C\"";
                case DATE -> "date";
                case TIMESTAMP -> column.fractionalSeconds() ? "timestamp(6)" : "timestamp(0)";
                case BLOB -> "bytea";
            };
        }

        /** Autovacuum analyses a new table only after a delay; the first build should not plan blind. */
        @Override
        List<String> afterLoad(String table) {
            return List.of("analyze " + quote(table));
        }
    }

    /** MariaDB and MySQL. */
    static final class MariaDb extends LoadTarget {

        /** The longest text kept as VARCHAR, which can be indexed: 255 characters of utf8mb4 are 1020 bytes. */
        private static final int LONGEST_VARCHAR = 255;

        private final Engine engine;
        private final String collation;

        MariaDb(Engine engine, String collation) {
            this.engine = engine;
            this.collation = collation;
        }

        @Override
        Engine engine() {
            return engine;
        }

        /**
         * DATETIME, not TIMESTAMP: TIMESTAMP converts to and from the session's time zone and ends in 2038.
         * DATETIME keeps whole seconds unless given a precision.
         */
        @Override
        String type(SqliteTables.Column column) {
            return switch (column.kind()) {
                case INTEGER -> "bigint";
                case DOUBLE -> "double";
                case TEXT -> column.longestText() <= LONGEST_VARCHAR
                        ? "varchar(" + Math.max(1, column.longestText()) + ")" : "longtext";
                case DATE -> "date";
                case TIMESTAMP -> column.fractionalSeconds() ? "datetime(6)" : "datetime";
                case BLOB -> "longblob";
            };
        }

        /**
         * The default collations compare text ignoring case ('A' = 'a'), which would merge distinct values
         * and reorder them; a binary collation compares bytes, as SQLite does.
         */
        @Override
        String tableOptions() {
            return " engine=InnoDB default charset=utf8mb4 collate=" + collation;
        }

        /** LONGTEXT and LONGBLOB columns can be indexed only on a prefix: leave them out. */
        @Override
        boolean indexable(SqliteTables.Column column) {
            return !type(column).startsWith("long");
        }

        /** Every DDL statement commits the transaction it is in. */
        @Override
        boolean transactionalDdl() {
            return false;
        }

        @Override
        List<String> afterLoad(String table) {
            return List.of("analyze table " + quote(table));
        }
    }

    /** DuckDB. */
    static final class DuckDb extends LoadTarget {
        @Override
        Engine engine() {
            return Engine.DUCKDB;
        }

        @Override
        String type(SqliteTables.Column column) {
            return switch (column.kind()) {
                case INTEGER -> "bigint";
                case DOUBLE -> "double";
                case TEXT -> "varchar";
                case DATE -> "date";
                case TIMESTAMP -> "timestamp";
                case BLOB -> "blob";
            };
        }

        /**
         * DuckDB scans columns with min-max zone maps kept for every row group; its ART indexes serve point
         * lookups and constraints, not the range joins a build runs, and cost time and memory to build.
         */
        @Override
        boolean secondaryIndexes() {
            return false;
        }
    }
}
