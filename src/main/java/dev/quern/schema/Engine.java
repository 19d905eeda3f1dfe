package dev.quern.schema;

import java.util.Locale;
import java.util.Optional;
import org.jooq.DSLContext;
import org.jooq.SQLDialect;
import org.jooq.conf.RenderQuotedNames;
import org.jooq.conf.Settings;
import org.jooq.impl.DSL;

/** The database engines Quern runs on, recognised from a JDBC URL. */
public enum Engine {
    SQLITE("sqlite", "jdbc:sqlite:", SQLDialect.SQLITE),
    POSTGRES("postgresql", "jdbc:postgresql:", SQLDialect.POSTGRES),
    MARIADB("mariadb", "jdbc:mariadb:", SQLDialect.MARIADB),
    MYSQL("mysql", "jdbc:mysql:", SQLDialect.MYSQL),
    DUCKDB("duckdb", "jdbc:duckdb:", SQLDialect.DUCKDB);

    /** Held so that the logging configuration below is not collected with the logger. */
    private static final java.util.logging.Logger JOOQ_LOG = java.util.logging.Logger.getLogger("org.jooq");
    private static final java.util.logging.Logger MARIADB_LOG = java.util.logging.Logger.getLogger("org.mariadb.jdbc");

    static {
        // jOOQ prints a banner, tips and version notes on first use unless told not to; Quern's output is its own.
        System.setProperty("org.jooq.no-logo", "true");
        System.setProperty("org.jooq.no-tips", "true");
        JOOQ_LOG.setLevel(java.util.logging.Level.WARNING);
        // MariaDB's driver prints every failed statement to the console unless routed to java.util.logging;
        // Quern reports failures itself, in its own words and without the URL.
        if (System.getProperty("mariadb.logging.fallback") == null) {
            System.setProperty("mariadb.logging.fallback", "JDK");
        }
        MARIADB_LOG.setLevel(java.util.logging.Level.OFF);
    }

    private final String label;
    private final String urlPrefix;
    private final SQLDialect dialect;

    Engine(String label, String urlPrefix, SQLDialect dialect) {
        this.label = label;
        this.urlPrefix = urlPrefix;
        this.dialect = dialect;
    }

    public SQLDialect dialect() {
        return dialect;
    }

    /**
     * A jOOQ context that renders for this engine. Every name is quoted, so an identifier is only ever
     * an identifier, whatever characters it holds.
     */
    public DSLContext sql() {
        return DSL.using(dialect, settings());
    }

    /** The same, executing on {@code connection}. */
    public DSLContext sql(java.sql.Connection connection) {
        return DSL.using(connection, dialect, settings());
    }

    private static Settings settings() {
        return new Settings()
                .withRenderQuotedNames(RenderQuotedNames.ALWAYS)
                .withRenderSchema(false)
                .withRenderFormatted(false)
                .withExecuteLogging(false);
    }

    public String label() {
        return label;
    }

    public String urlPrefix() {
        return urlPrefix;
    }

    public static Optional<Engine> forUrl(String url) {
        String lowered = url.toLowerCase(Locale.ROOT);
        for (Engine e : values()) {
            if (lowered.startsWith(e.urlPrefix)) {
                return Optional.of(e);
            }
        }
        return Optional.empty();
    }
}
