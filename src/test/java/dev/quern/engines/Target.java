package dev.quern.engines;

/** The engines the cross-engine tests build on; SQLite is the reference the others are compared with. */
enum Target {
    SQLITE("SQLite"),
    POSTGRES("PostgreSQL"),
    MARIADB("MariaDB"),
    DUCKDB("DuckDB");

    private final String label;

    Target(String label) {
        this.label = label;
    }

    @Override
    public String toString() {
        return label;
    }
}
