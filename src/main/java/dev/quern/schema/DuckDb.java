package dev.quern.schema;

import java.util.Properties;

/** Connection settings every DuckDB connection of Quern's gets, reading or loading. */
public final class DuckDb {

    /** The driver's property for opening a file database read-only. */
    public static final String READ_ONLY = "duckdb.read_only";

    private DuckDb() {
    }

    /**
     * DuckDB installs a missing extension from the network on first use; Quern never wants a build to
     * download code, and offline machines would wait for a timeout. Built-in readers (CSV, Parquet) need none.
     */
    public static Properties offline() {
        Properties p = new Properties();
        p.setProperty("autoinstall_known_extensions", "false");
        return p;
    }
}
