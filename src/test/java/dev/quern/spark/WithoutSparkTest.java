package dev.quern.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.File;
import java.lang.reflect.InvocationTargetException;
import java.net.MalformedURLException;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * quern.jar holds no Spark: loaded with the test class path less Spark and Scala (as {@code java -jar} runs
 * it), a {@code spark:} source stops with a usage error that says how to run it, and a SQLite source still
 * opens and builds.
 */
class WithoutSparkTest {

    @Test
    void sparkSourceWithoutSparkIsAUsageErrorNamingSparkSubmit() throws Exception {
        try (URLClassLoader withoutSpark = new URLClassLoader(classPathWithoutSpark(),
                ClassLoader.getPlatformClassLoader())) {
            assertThrows(ClassNotFoundException.class,
                    () -> withoutSpark.loadClass("org.apache.spark.sql.SparkSession"), "Spark is left out");
            Object failure = open(withoutSpark, "spark:parquet:" + SparkSample.SAMPLE.getParent());
            assertTrue(failure instanceof Exception, "opening a Spark source fails");
            Exception e = (Exception) failure;
            assertEquals("dev.quern.QuernException", e.getClass().getName(), String.valueOf(e));
            Object kind = e.getClass().getMethod("failure").invoke(e);
            assertEquals("USAGE", kind.toString());
            assertTrue(e.getMessage().contains("spark-submit"), e.getMessage());

            // DriverManager hands a connection only from a driver the caller's loader sees: register that loader's own.
            Class.forName("org.sqlite.JDBC", true, withoutSpark);
            Object sqlite = open(withoutSpark, "jdbc:sqlite:" + SparkSample.SAMPLE);
            assertTrue(sqlite instanceof java.sql.Connection, "SQLite opens without Spark: " + sqlite);
            ((java.sql.Connection) sqlite).close();

            // The whole build, whose code also names the Spark writer, runs on SQLite without Spark.
            Class<?> quern = withoutSpark.loadClass("dev.quern.Quern");
            Class<?> progress = withoutSpark.loadClass("dev.quern.run.Progress");
            Object demo = quern.getMethod("load", Path.class).invoke(null, SparkSample.DEMO);
            Object recipe = quern.getMethod("withSource", String.class).invoke(demo, "jdbc:sqlite:" + SparkSample.SAMPLE);
            Path out = java.nio.file.Files.createTempDirectory(
                    java.nio.file.Files.createDirectories(Path.of("target", "spark-tests")), "without-spark-");
            quern.getMethod("build", Path.class, progress).invoke(recipe, out, progress.getField("SILENT").get(null));
            assertTrue(java.nio.file.Files.isRegularFile(out.resolve("matrix.csv")), "the SQLite build wrote its matrix");
        }
    }

    /** Source.of(url, folder).open() in the given loader: the connection, or the exception it threw. */
    private static Object open(ClassLoader loader, String url) throws ReflectiveOperationException {
        Class<?> name = loader.loadClass("dev.quern.recipe.Name");
        Class<?> position = loader.loadClass("dev.quern.Position");
        Object none = position.getField("NONE").get(null);
        Object recipeName = name.getConstructor(String.class, position).newInstance(url, none);
        Class<?> source = loader.loadClass("dev.quern.schema.Source");
        Object opened = source.getMethod("of", name, Path.class).invoke(null, recipeName, Path.of("."));
        try {
            return source.getMethod("open").invoke(opened);
        } catch (InvocationTargetException e) {
            return e.getCause();
        }
    }

    private static URL[] classPathWithoutSpark() throws MalformedURLException {
        List<URL> urls = new ArrayList<>();
        for (String entry : System.getProperty("java.class.path").split(File.pathSeparator)) {
            String e = entry.replace('\\', '/');
            if (e.contains("/org/apache/spark/") || e.contains("/org/scala-lang/")) {
                continue;
            }
            urls.add(Path.of(entry).toUri().toURL());
        }
        return urls.toArray(URL[]::new);
    }
}
