package dev.quern.schema;

import dev.quern.Diagnostics;
import dev.quern.Failure;
import dev.quern.Position;
import dev.quern.QuernException;
import dev.quern.recipe.Name;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.util.Arrays;
import java.util.Map;
import java.util.Objects;
import java.util.Properties;
import java.util.function.UnaryOperator;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.sqlite.SQLiteConfig;
import org.sqlite.SQLiteOpenMode;

/**
 * The database a recipe reads, opened read-only. The URL as written may name environment variables
 * ({@code ${PGPASSWORD}}); they are expanded only when connecting, so no secret is ever kept in a value
 * that might be printed. {@link #display()} is the safe form for messages and provenance.
 */
public final class Source {

    private static final Pattern VARIABLE = Pattern.compile("\\$\\{([A-Za-z_][A-Za-z0-9_]*)}");
    private static final Pattern SECRET_PARAMETER =
            Pattern.compile("(?i)((?:password|pwd|secret|token)=)[^&;]*");
    private static final Pattern USER_INFO = Pattern.compile("(//[^/@:]*:)[^/@]*@");
    private static final byte[] SQLITE_HEADER = "SQLite format 3\0".getBytes(StandardCharsets.US_ASCII);

    private final String written;
    private final Position position;
    private final Engine engine;
    private final Path baseDirectory;
    private final UnaryOperator<String> environment;

    private Source(String written, Position position, Engine engine, Path baseDirectory,
                   UnaryOperator<String> environment) {
        this.written = written;
        this.position = position;
        this.engine = engine;
        this.baseDirectory = baseDirectory;
        this.environment = environment;
    }

    /** The source named by {@code url}; relative SQLite paths are read from {@code baseDirectory}. */
    public static Source of(Name url, Path baseDirectory) {
        return of(url, baseDirectory, System::getenv);
    }

    static Source of(Name url, Path baseDirectory, UnaryOperator<String> environment) {
        Objects.requireNonNull(baseDirectory, "baseDirectory");
        Engine engine = Engine.forUrl(url.text()).orElseThrow(() -> QuernException.recipe(url.position(),
                "source '" + display(url.text()) + "' is not a JDBC URL Quern knows; it starts with one of "
                        + Arrays.stream(Engine.values()).map(Engine::urlPrefix).toList()));
        return new Source(url.text(), url.position(), engine, baseDirectory, environment);
    }

    public Engine engine() {
        return engine;
    }

    /** The URL as written, with any password in it masked: safe to print. */
    public String display() {
        return display(written);
    }

    static String display(String url) {
        String masked = SECRET_PARAMETER.matcher(url).replaceAll("$1***");
        return USER_INFO.matcher(masked).replaceAll("$1***@");
    }

    /** The SQLite database file, for sources that are one. */
    public java.util.Optional<Path> file() {
        if (engine != Engine.SQLITE) {
            return java.util.Optional.empty();
        }
        String rest = expand().substring(engine.urlPrefix().length());
        if (rest.startsWith("file:")) {
            rest = rest.substring("file:".length());
        }
        int query = rest.indexOf('?');
        if (query >= 0) {
            rest = rest.substring(0, query);
        }
        return java.util.Optional.of(baseDirectory.resolve(rest).normalize());
    }

    /**
     * Opens a read-only connection. A missing SQLite file is an error here, never a new empty database.
     */
    public Connection open() {
        try {
            if (engine == Engine.SQLITE) {
                return openSqlite();
            }
            Connection c = DriverManager.getConnection(expand(), new Properties());
            c.setReadOnly(true);
            return c;
        } catch (SQLException e) {
            // Driver messages may quote the URL, and the URL may hold a secret: say only what is safe.
            throw QuernException.data("cannot connect to " + display() + ": " + safeMessage(e), e);
        }
    }

    private Connection openSqlite() throws SQLException {
        Path file = file().orElseThrow();
        if (!Files.isRegularFile(file)) {
            throw QuernException.data("the source database " + file + " does not exist (source '"
                    + display() + "' at " + position + "); check the path, which is read from the recipe's folder");
        }
        if (!hasSqliteHeader(file)) {
            throw QuernException.data("the source " + file + " is not a SQLite database file");
        }
        SQLiteConfig config = new SQLiteConfig();
        config.setReadOnly(true);
        config.setOpenMode(SQLiteOpenMode.READONLY);
        return DriverManager.getConnection("jdbc:sqlite:" + file, config.toProperties());
    }

    private static boolean hasSqliteHeader(Path file) {
        try (InputStream in = Files.newInputStream(file)) {
            return Arrays.equals(in.readNBytes(SQLITE_HEADER.length), SQLITE_HEADER);
        } catch (IOException e) {
            throw QuernException.data("cannot read the source database " + file + ": " + e.getMessage(), e);
        }
    }

    private String expand() {
        Matcher m = VARIABLE.matcher(written);
        StringBuilder out = new StringBuilder();
        Diagnostics missing = new Diagnostics();
        while (m.find()) {
            String value = environment.apply(m.group(1));
            if (value == null) {
                missing.error(position, "the source names the environment variable " + m.group(1)
                        + ", which is not set; set it before running");
                value = "";
            }
            m.appendReplacement(out, Matcher.quoteReplacement(value));
        }
        m.appendTail(out);
        missing.throwIfAny(Failure.RECIPE);
        return out.toString();
    }

    private String safeMessage(SQLException e) {
        String message = String.valueOf(e.getMessage());
        String expanded = expand();
        if (!expanded.equals(written)) {
            message = message.replace(expanded, display());
        }
        for (Map.Entry<String, String> secret : secrets().entrySet()) {
            message = message.replace(secret.getValue(), "${" + secret.getKey() + "}");
        }
        return message;
    }

    private Map<String, String> secrets() {
        Map<String, String> values = new java.util.LinkedHashMap<>();
        Matcher m = VARIABLE.matcher(written);
        while (m.find()) {
            String value = environment.apply(m.group(1));
            if (value != null && !value.isEmpty()) {
                values.put(m.group(1), value);
            }
        }
        return values;
    }

    @Override
    public String toString() {
        return display();
    }
}
