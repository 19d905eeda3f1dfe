package dev.quern.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.constructor.SafeConstructor;

/**
 * The same recipe built twice on the same source gives the same bytes: matrix and dictionaries exactly,
 * report.html but for its one build-time line, provenance.json but for its build time and timings.
 */
class ReproducibleBuildTest {

    @Test
    void matrixAndDictionariesAreByteIdentical() throws IOException {
        Path a = DemoBuilds.first();
        Path b = DemoBuilds.second();

        for (String file : new String[] {"matrix.csv", "dictionary.csv", "dictionary.md"}) {
            assertArrayEquals(Files.readAllBytes(a.resolve(file)), Files.readAllBytes(b.resolve(file)), file);
        }
    }

    @Test
    void theReportDiffersOnlyInItsBuildTimeLine() throws IOException {
        String a = Files.readString(DemoBuilds.first().resolve("report.html"));
        String b = Files.readString(DemoBuilds.second().resolve("report.html"));

        assertEquals(1, a.lines().filter(l -> l.contains("id=\"" + HtmlReport.BUILT_AT_ID + "\"")).count());
        assertNotEquals(a, b, "the build times differ");
        assertEquals(withoutBuildTime(a), withoutBuildTime(b));
    }

    @Test
    void provenanceDiffersOnlyInBuildTimeAndTimings() throws IOException {
        Map<String, Object> a = provenance(DemoBuilds.first());
        Map<String, Object> b = provenance(DemoBuilds.second());

        assertNotEquals(a.get("built_at"), b.get("built_at"));
        for (Map<String, Object> p : java.util.List.of(a, b)) {
            p.remove("built_at");
            p.remove("timings");
        }
        assertEquals(a, b);
    }

    private static String withoutBuildTime(String html) {
        String marker = "id=\"" + HtmlReport.BUILT_AT_ID + "\"";
        return String.join("\n", html.lines().filter(l -> !l.contains(marker)).toList());
    }

    @SuppressWarnings("unchecked")
    private static Map<String, Object> provenance(Path folder) throws IOException {
        return (Map<String, Object>) new Yaml(new SafeConstructor(new LoaderOptions()))
                .load(Files.readString(folder.resolve("provenance.json")));
    }
}
