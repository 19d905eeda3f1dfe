package dev.quern.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * report.html in a real headless browser (Debian's chromium): it loads without console messages or
 * errors, draws one chart per numeric column, and its search box filters the dictionary. The page is
 * loaded with {@code #search=...}, which its script applies on load, and the DOM is read back with
 * {@code --dump-dom}; console messages come from chromium's log on standard error. Every host name is
 * mapped to nowhere, so a page that fetched anything would fail to.
 *
 * <p>Without chromium the test is skipped, unless {@code QUERN_REQUIRE_BROWSER=1} (set by .ci/run), when
 * it fails. {@code QUERN_CHROMIUM} names another browser binary. A screenshot is kept in
 * target/report-screenshot.png.
 */
class ReportInBrowserTest {

    static final Path SCREENSHOT = Path.of("target/report-screenshot.png");

    @TempDir
    Path profile;

    static Path chromium;
    static Path report;

    @BeforeAll
    static void findBrowserAndBuild() {
        Optional<Path> found = browser();
        if (found.isEmpty()) {
            String named = System.getenv("QUERN_CHROMIUM");
            String why = named != null && !named.isBlank() ? "QUERN_CHROMIUM names no executable file: " + named
                    : "no chromium on the PATH (install Debian's 'chromium' package, or set QUERN_CHROMIUM)";
            if ("1".equals(System.getenv("QUERN_REQUIRE_BROWSER"))) {
                fail(why + ", and QUERN_REQUIRE_BROWSER=1 says the browser test must run");
            }
            Assumptions.abort(why);
        }
        chromium = found.get();
        report = DemoBuilds.driftedFolder().resolve("report.html").toAbsolutePath();
    }

    private static Optional<Path> browser() {
        String named = System.getenv("QUERN_CHROMIUM");
        if (named != null && !named.isBlank()) {
            return Optional.of(Path.of(named)).filter(Files::isExecutable);
        }
        for (String dir : System.getenv().getOrDefault("PATH", "").split(File.pathSeparator)) {
            for (String name : List.of("chromium", "chromium-browser", "google-chrome")) {
                Path p = Path.of(dir, name);
                if (Files.isExecutable(p)) {
                    return Optional.of(p);
                }
            }
        }
        return Optional.empty();
    }

    /** What chromium printed: the DOM (or nothing) and its log. */
    private record Run(String out, String log) {
    }

    private Run chromium(String... args) throws IOException, InterruptedException {
        List<String> command = new ArrayList<>(List.of(chromium.toString(), "--headless", "--no-sandbox",
                "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync",
                "--no-first-run", "--user-data-dir=" + profile.resolve("p" + System.nanoTime()),
                "--host-resolver-rules=MAP * ~NOTFOUND", "--enable-logging=stderr", "--v=0"));
        command.addAll(List.of(args));
        Path stdout = profile.resolve("out.txt");
        Path stderr = profile.resolve("err.txt");
        Process p = new ProcessBuilder(command).redirectOutput(stdout.toFile()).redirectError(stderr.toFile()).start();
        if (!p.waitFor(120, TimeUnit.SECONDS)) {
            p.destroyForcibly();
            fail("chromium did not finish in 120 s: " + command);
        }
        String log = Files.readString(stderr, StandardCharsets.UTF_8);
        assertEquals(0, p.exitValue(), "chromium failed:\n" + log);
        return new Run(Files.readString(stdout, StandardCharsets.UTF_8), log);
    }

    private Run dump(String fragment) throws IOException, InterruptedException {
        return chromium("--dump-dom", report.toUri() + fragment);
    }

    /** Console output of the page: chromium logs each message, error or not, as CONSOLE. */
    private static List<String> console(String log) {
        return log.lines().filter(l -> l.contains(":CONSOLE") || l.contains("Uncaught")).toList();
    }

    @Test
    void loadsWithoutConsoleMessagesAndRunsItsScript() throws Exception {
        Run run = dump("");

        assertEquals(List.of(), console(run.log()));
        assertTrue(run.out().contains("<html lang=\"en\" data-ready=\"yes\">"), "the script ran to its end");
    }

    @Test
    void drawsOneChartPerNumericColumn() throws Exception {
        Run run = dump("");
        long numeric = HtmlReportTest.dictionary(DemoBuilds.driftedFolder()).stream()
                .filter(e -> (e[1].equals("feature") || e[1].equals("label"))
                        && (e[2].equals("integer") || e[2].equals("decimal"))).count();

        assertEquals(numeric, HtmlReportTest.count(run.out(), "<svg class=\"chart numeric\""));
        assertEquals(32, numeric);
    }

    @Test
    void theSearchBoxFiltersTheDictionary() throws Exception {
        Run all = dump("");
        Run some = dump("#search=stddev");

        assertEquals(36, visibleRows(all.out()).size());
        assertEquals(List.of("rides_stddev_duration_min_30d", "rides_stddev_duration_min_90d",
                "rides_stddev_duration_min_365d"), visibleRows(some.out()));
        assertTrue(some.out().contains("<span id=\"shown\">3 of 36 columns</span>"), "the count follows");
        assertTrue(some.out().contains("<input id=\"search\" type=\"search\""), "the box is there");
        assertEquals(34 - 3, HtmlReportTest.count(some.out(), "data-kind=\"numeric\" hidden=\"\"")
                + HtmlReportTest.count(some.out(), "data-kind=\"levels\" hidden=\"\""), "the charts follow too");
        assertEquals(List.of(), console(some.log()));

        Run words = dump("#search=" + "in%20force");
        assertEquals(List.of("plan", "monthly_fee"), visibleRows(words.out()), "a phrase of the meaning");
    }

    @Test
    void keepsAScreenshot() throws Exception {
        Files.createDirectories(SCREENSHOT.getParent());
        Files.deleteIfExists(SCREENSHOT);

        chromium("--hide-scrollbars", "--window-size=1280,2400", "--screenshot=" + SCREENSHOT.toAbsolutePath(),
                report.toUri().toString());

        byte[] png = Files.readAllBytes(SCREENSHOT);
        assertTrue(png.length > 10_000, "a real picture, " + png.length + " bytes");
        assertEquals((byte) 0x89, png[0]);
        assertEquals('P', png[1]);
    }

    /** The data-column of every dictionary row without the hidden attribute, in page order. */
    private static List<String> visibleRows(String dom) {
        Matcher m = Pattern.compile("<tr data-column=\"([^\"]+)\"( hidden=\"\")?>").matcher(dom);
        List<String> out = new ArrayList<>();
        while (m.find()) {
            if (m.group(2) == null) {
                out.add(m.group(1));
            }
        }
        return out;
    }
}
