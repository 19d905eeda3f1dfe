package dev.quern.schema;

import java.util.Locale;
import java.util.Optional;
import org.jooq.DSLContext;
import org.jooq.SQLDialect;
import org.jooq.conf.RenderQuotedNames;
import org.jooq.conf.Settings;
import org.jooq.conf.StatementType;
import org.jooq.impl.DSL;

/** The database engines Quern runs on, recognised from a JDBC URL. */
public enum Engine {
    SQLITE("sqlite", "jdbc:sqlite:", SQLDialect.SQLITE),
    POSTGRES("postgresql", "jdbc:postgresql:", SQLDialect.POSTGRES),
    MARIADB("mariadb", "jdbc:mariadb:", SQLDialect.MARIADB),
    MYSQL("mysql", "jdbc:mysql:", SQLDialect.MYSQL),
    DUCKDB("duckdb", "jdbc:duckdb:", SQLDialect.DUCKDB),
    /**
     * Spark SQL has no jOOQ dialect. DuckDB's rendering is the closest Spark parses: {@code double} and
     * {@code varchar(n)} casts, {@code DATE '...'} literals, {@code nulls last}, {@code filter (where ...)};
     * PostgreSQL's {@code double precision} is a parse error in Spark 4.0. Its double-quoted names need
     * {@code spark.sql.ansi.doubleQuotedIdentifiers=true}, which Quern's Spark connection sets. What else
     * differs is in {@code sql.SparkSql} and {@code expr.SparkFunctions}.
     */
    SPARK("spark", "spark:", SQLDialect.DUCKDB);

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

    private Settings settings() {
        // Quern's Spark connection runs plain statements only (a SparkSession has no bind variables in JDBC's
        // sense), so values are rendered inline there; they go through DSL.inline either way.
        StatementType statements = this == SPARK ? StatementType.STATIC_STATEMENT : StatementType.PREPARED_STATEMENT;
        return new Settings()
                .withStatementType(statements)
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

    /** The engine whose label ({@code sqlite}, {@code spark}, ...) is {@code label}, in any case. */
    public static Optional<Engine> forLabel(String label) {
        for (Engine e : values()) {
            if (e.label.equalsIgnoreCase(label)) {
                return Optional.of(e);
            }
        }
        return Optional.empty();
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
