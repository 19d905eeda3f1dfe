package dev.quern.engines;

import dev.quern.load.DatabaseLoader;
import dev.quern.run.Progress;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.SecureRandom;
import java.sql.SQLException;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.extension.ExtensionContext;
import org.junit.jupiter.api.extension.ParameterContext;
import org.junit.jupiter.api.extension.ParameterResolver;

/**
 * The databases of one test run: every schema, database and DuckDB file it makes is named
 * {@code quern_test_<random>}, so that concurrent runs never meet, and is dropped when the run ends. A
 * SQLite file loaded once into an engine is shared by every test that asks for it.
 */
final class Databases implements ExtensionContext.Store.CloseableResource {

    /** The shipped sample database, from the project folder Maven runs the tests in. */
    static final Path SAMPLE = Path.of("sample-db", "cycle-club.sqlite").toAbsolutePath();
    static final List<String> SAMPLE_TABLES =
            List.of("cancellations", "members", "payments", "plans", "rides", "stations", "tickets");
    static final Path DEMO = Path.of("recipes", "member-churn.yaml");

    private static final SecureRandom RANDOM = new SecureRandom();

    private final String run = "quern_test_" + HexFormat.of().formatHex(RANDOM.generateSeed(4));
    private final Path folder;
    private final Map<Server, List<String>> created = new LinkedHashMap<>();
    private final Map<String, String> loaded = new LinkedHashMap<>();
    private final Map<String, Map<String, String>> checksumsAtLoad = new LinkedHashMap<>();
    private final Map<String, Built> builds = new LinkedHashMap<>();
    private int made;

    private Databases() throws IOException {
        folder = Files.createTempDirectory(run);
    }

    /** Resolves a {@link Databases} parameter: one instance for the whole run, closed at its end. */
    static final class Extension implements ParameterResolver {
        @Override
        public boolean supportsParameter(ParameterContext parameter, ExtensionContext context) {
            return parameter.getParameter().getType() == Databases.class;
        }

        @Override
        public Object resolveParameter(ParameterContext parameter, ExtensionContext context) {
            return context.getRoot().getStore(ExtensionContext.Namespace.GLOBAL)
                    .getOrComputeIfAbsent(Databases.class, k -> {
                        try {
                            return new Databases();
                        } catch (IOException e) {
                            throw new IllegalStateException(e);
                        }
                    }, Databases.class);
        }
    }

    /** A folder for the run's own files, removed at its end. */
    Path folder() {
        return folder;
    }

    /** The URL of the sample database on {@code target}. */
    String sample(Target target) {
        return loaded(target, SAMPLE);
    }

    /** The URL of a database on {@code target} holding the tables of {@code sqlite}, loaded once per run. */
    synchronized String loaded(Target target, Path sqlite) {
        String key = target + "|" + sqlite.toAbsolutePath();
        String url = loaded.get(key);
        if (url == null) {
            if (target == Target.SQLITE) {
                url = "jdbc:sqlite:" + sqlite.toAbsolutePath();
            } else {
                url = empty(target);
                DatabaseLoader.load(sqlite, url, false, Progress.SILENT);
            }
            if (sqlite.equals(SAMPLE)) {
                try {
                    checksumsAtLoad.put(url, Checksums.of(url, SAMPLE_TABLES));
                } catch (SQLException e) {
                    throw new IllegalStateException("cannot take checksums of " + url, e);
                }
            }
            loaded.put(key, url);
        }
        return url;
    }

    /** The checksums of the sample's tables taken right after loading, before any build read them. */
    synchronized Map<String, String> checksumsAtLoad(Target target) {
        return checksumsAtLoad.get(sample(target));
    }

    /** {@code recipe} built on the sample on {@code target}, once per run. */
    synchronized Built built(Path recipe, Target target) {
        String key = target + "|" + recipe.toAbsolutePath();
        Built built = builds.get(key);
        if (built == null) {
            String folder = (target + "-" + recipe).replaceAll("[^A-Za-z0-9.-]", "_");
            built = Built.build(recipe, sample(target), this.folder.resolve(folder));
            builds.put(key, built);
        }
        return built;
    }

    /** A new empty database on {@code target}, dropped when the run ends. */
    synchronized String empty(Target target) {
        String name = run + "_" + (++made);
        try {
            return switch (target) {
                case SQLITE -> "jdbc:sqlite:" + folder.resolve(name + ".sqlite");
                case DUCKDB -> "jdbc:duckdb:" + folder.resolve(name + ".duckdb");
                case POSTGRES -> create(Server.POSTGRES, name);
                case MARIADB -> create(Server.MARIADB, name);
            };
        } catch (SQLException e) {
            throw new IllegalStateException("cannot create " + name + " on " + target + ": " + e.getMessage(), e);
        }
    }

    private String create(Server server, String name) throws SQLException {
        server.require();
        String url = server.create(name);
        created.computeIfAbsent(server, s -> new ArrayList<>()).add(name);
        return url;
    }

    @Override
    public synchronized void close() throws IOException, SQLException {
        SQLException first = null;
        for (Map.Entry<Server, List<String>> e : created.entrySet()) {
            for (String name : e.getValue()) {
                try {
                    e.getKey().drop(name);
                } catch (SQLException failed) {
                    first = first == null ? failed : first;
                }
            }
        }
        try (Stream<Path> files = Files.walk(folder)) {
            for (Path p : files.sorted(Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(p);
            }
        }
        if (first != null) {
            throw first;
        }
    }
}
