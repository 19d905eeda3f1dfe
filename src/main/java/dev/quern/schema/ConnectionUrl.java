package dev.quern.schema;

import dev.quern.Diagnostics;
import dev.quern.Failure;
import dev.quern.Position;
import dev.quern.QuernException;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;
import java.util.Properties;
import java.util.function.UnaryOperator;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A JDBC URL as the user wrote it. Credentials come only from environment variables named in it
 * ({@code password=${PGPASSWORD}}): a password written out is refused, because recipes are versioned and
 * command lines are logged. Variables are expanded only in {@link #expand()}, whose result is handed to
 * the driver and never kept or printed; {@link #display()} is the form for messages and provenance.
 */
public final class ConnectionUrl {

    private static final Pattern VARIABLE = Pattern.compile("\\$\\{([A-Za-z_][A-Za-z0-9_]*)}");
    private static final Pattern SECRET_PARAMETER =
            Pattern.compile("(?i)((?:password|pwd|secret|token)=)([^&;]*)");
    private static final Pattern USER_INFO = Pattern.compile("(//[^/@:?;&]*:)([^/@?;&]*)@");

    private final String written;
    private final Position position;
    private final String role;
    private final Engine engine;
    private final UnaryOperator<String> environment;

    private ConnectionUrl(String written, Position position, String role, Engine engine,
                          UnaryOperator<String> environment) {
        this.written = written;
        this.position = position;
        this.role = role;
        this.engine = engine;
        this.environment = environment;
    }

    /** A recipe's source {@code written} at {@code position}, its variables read from the process environment. */
    public static ConnectionUrl of(String written, Position position) {
        return of(written, position, "source", System::getenv);
    }

    /** The database {@code quern load} writes to, as the command line names it. */
    public static ConnectionUrl target(String written) {
        return of(written, Position.NONE, "target", System::getenv);
    }

    static ConnectionUrl of(String written, Position position, String role, UnaryOperator<String> environment) {
        Objects.requireNonNull(written, "written");
        Objects.requireNonNull(position, "position");
        Objects.requireNonNull(environment, "environment");
        Engine engine = Engine.forUrl(written).orElseThrow(() -> QuernException.recipe(position,
                role + " '" + display(written) + "' is not a JDBC URL Quern knows; it starts with one of "
                        + Arrays.stream(Engine.values()).map(Engine::urlPrefix).toList()));
        Diagnostics problems = new Diagnostics();
        for (Pattern p : new Pattern[] {SECRET_PARAMETER, USER_INFO}) {
            Matcher m = p.matcher(written);
            while (m.find()) {
                if (!m.group(2).isEmpty() && !VARIABLE.matcher(m.group(2)).matches()) {
                    problems.error(position, "the " + role + " '" + display(written) + "' holds a credential written out;"
                            + " credentials come only from environment variables: write "
                            + (p == USER_INFO ? "//user:${PGPASSWORD}@" : m.group(1) + "${PGPASSWORD}")
                            + " and set that variable");
                }
            }
        }
        problems.throwIfAny(Failure.RECIPE);
        return new ConnectionUrl(written, position, role, engine, environment);
    }

    public Engine engine() {
        return engine;
    }

    public Position position() {
        return position;
    }

    /**
     * The URL as written: it names variables but holds no credential (one written out is refused above), so
     * another source can be opened from it with the same variables.
     */
    public String written() {
        return written;
    }

    /** The URL as written, with any credential in it masked: safe to print. */
    public String display() {
        return display(written);
    }

    static String display(String url) {
        String masked = SECRET_PARAMETER.matcher(url).replaceAll("$1***");
        return USER_INFO.matcher(masked).replaceAll("$1***@");
    }

    /**
     * The URL with its variables' values in place, for the driver only: never print it, never keep it.
     * A variable that is not set stops with a message naming it.
     */
    public String expand() {
        Matcher m = VARIABLE.matcher(written);
        StringBuilder out = new StringBuilder();
        Diagnostics missing = new Diagnostics();
        while (m.find()) {
            String value = environment.apply(m.group(1));
            if (value == null) {
                missing.error(position, "the " + role + " names the environment variable " + m.group(1)
                        + ", which is not set; set it before running");
                value = "";
            }
            m.appendReplacement(out, Matcher.quoteReplacement(value));
        }
        m.appendTail(out);
        missing.throwIfAny(Failure.RECIPE);
        return out.toString();
    }

    /**
     * Connects. Credentials named as URL parameters ({@code password=${PGPASSWORD}}) are handed to the driver
     * as connection properties, not inside the URL: drivers write the URL to their logs (PostgreSQL's at
     * FINE: "Connecting with URL"), and a secret must not follow it there.
     */
    public Connection connect(Properties properties) throws SQLException {
        DriverArguments arguments = driverArguments(properties);
        return DriverManager.getConnection(arguments.url(), arguments.properties());
    }

    /**
     * What a driver is handed: the URL without its credential parameters, expanded, and those credentials as
     * properties along with {@code properties}. For the driver (or Spark's JDBC reader) only: never print it.
     */
    public record DriverArguments(String url, Properties properties) {
        @Override
        public String toString() {
            return "driver arguments (not shown: they may hold a credential)";
        }
    }

    public DriverArguments driverArguments(Properties properties) {
        expand(); // stops, naming it, if a variable is not set
        Properties all = new Properties();
        all.putAll(properties);
        StringBuilder rest = new StringBuilder();
        Matcher m = SECRET_PARAMETER.matcher(written);
        int from = 0;
        while (m.find()) {
            Matcher variable = VARIABLE.matcher(m.group(2));
            if (variable.matches()) {
                rest.append(written, from, m.start());
                from = m.end();
                all.setProperty(m.group(1).substring(0, m.group(1).length() - 1),
                        environment.apply(variable.group(1)));
            }
        }
        rest.append(written.substring(from));
        String withoutSecrets = rest.toString().replaceAll("([?;&])[&;]+", "$1").replaceAll("[?&;]+$", "");
        return new DriverArguments(of(withoutSecrets, position, role, environment).expand(), all);
    }

    /** The URL written after a prefix of its own ({@code spark:jdbc:} names a JDBC URL), with the same environment. */
    public ConnectionUrl inner(String prefix) {
        if (!written.regionMatches(true, 0, prefix, 0, prefix.length())) {
            throw new IllegalArgumentException(display() + " does not start with " + prefix);
        }
        return of(written.substring(prefix.length()), position, role, environment);
    }

    /**
     * A driver's message with the expanded URL and every variable's value replaced by their safe forms:
     * drivers quote URLs and user names in their messages, and either may carry a secret.
     */
    public String safeMessage(Throwable e) {
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
        Map<String, String> values = new LinkedHashMap<>();
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
