package dev.quern.audit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.cli.Main;
import dev.quern.sample.CycleClubGenerator;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The audit through the command line: {@code quern audit}, and a build the audit blocks, with exit codes. */
class AuditCommandTest {

    @TempDir
    static Path folder;

    private static Path clean;
    private static Path leaking;

    private final StringWriter out = new StringWriter();
    private final StringWriter err = new StringWriter();

    @BeforeAll
    static void recipes() throws IOException {
        new CycleClubGenerator(150, 3).writeTo(folder.resolve("club.sqlite"));
        String demo = Files.readString(Path.of("recipes/member-churn.yaml"))
                .replace("../sample-db/cycle-club.sqlite", "club.sqlite")
                .replace("from: 2024-06-30", "from: 2025-01-31");
        clean = folder.resolve("clean.yaml");
        Files.writeString(clean, demo);
        leaking = folder.resolve("leaking.yaml");
        Files.writeString(leaking, demo.replace("\naudit:\n", "  - lookup: members.status\n    name: status\n\naudit:\n"));
    }

    private int quern(String... args) {
        return Main.run(new PrintWriter(out, true), new PrintWriter(err, true), args);
    }

    @Test
    void auditPrintsTheReportAndWritesItIntoAFolderWithoutAMatrix() throws IOException {
        Path target = folder.resolve("audit-only");

        assertEquals(0, quern("audit", clean.toString(), "--out", target.toString()), err.toString());

        assertTrue(out.toString().startsWith("# Leakage audit: member-churn\n\n**Passed.**"), out.toString());
        assertEquals(List.of("audit.json", "audit.md"), names(target));
        assertEquals(out.toString(), Files.readString(target.resolve("audit.md")));
        assertTrue(Files.readString(target.resolve("audit.json")).startsWith("{\n  \"format\": \"quern-audit/1\",\n"
                + "  \"recipe\": \"member-churn\",\n  \"outcome\": \"passed\",\n"));
        assertEquals("", err.toString());
    }

    @Test
    void auditExitsWithSixtySevenWhenABlockingFindingIsOpen() {
        assertEquals(67, quern("audit", leaking.toString()));

        assertTrue(out.toString().contains("### current-state: status (blocking)\n"), out.toString());
        assertEquals("quern: the leakage audit is blocked: 1 blocking, 0 warning(s), 0 note(s); 2 finding(s)"
                + " acknowledged in the recipe\n", err.toString());
    }

    @Test
    void aBlockedBuildWritesTheAuditNoMatrixAndLeavesEarlierOutputsAlone() throws IOException {
        Path target = folder.resolve("blocked");
        Files.createDirectories(target);
        Files.writeString(target.resolve("matrix.csv"), "an earlier build\n");

        assertEquals(67, quern("build", leaking.toString(), "--out", target.toString()));

        assertEquals(List.of("audit.json", "audit.md", "matrix.csv"), names(target), "no temporary files either");
        assertEquals("an earlier build\n", Files.readString(target.resolve("matrix.csv")));
        assertTrue(Files.readString(target.resolve("audit.md")).startsWith("# Leakage audit: member-churn\n\n"
                + "**Blocked.** 1 blocking finding is not acknowledged"));
        String[] lines = err.toString().split("\n");
        assertEquals(2, lines.length, err.toString());
        assertTrue(lines[0].matches(".*leaking\\.yaml:\\d+:5: leakage audit, current-state: status reads"
                + " members\\.status, and members keeps no time or history: .*"), lines[0]);
        assertEquals("the leakage audit blocked the build: matrix.csv was not written; see "
                + target.resolve("audit.md") + ", and fix each blocking finding or acknowledge it under"
                + " audit.acknowledge with a reason", lines[1]);
        assertEquals("", out.toString());
    }

    @Test
    void aBuildThatPassesTheAuditWritesItBesideTheMatrix() throws IOException {
        Path target = folder.resolve("passed");

        assertEquals(0, quern("build", clean.toString(), "--out", target.toString()), err.toString());

        assertEquals(List.of("audit.json", "audit.md", "dictionary.csv", "dictionary.md", "matrix.csv",
                "provenance.json", "report.html", "rules.md"), names(target));
        assertTrue(out.toString().contains("leakage audit passed: 0 blocking, 0 warning(s), 0 note(s); 2 finding(s)"
                + " acknowledged in the recipe (see audit.md)"), out.toString());
        assertTrue(Files.readString(target.resolve("provenance.json")).contains("\"audit_ms\": "));
        assertFalse(Files.readString(target.resolve("dictionary.md")).isEmpty());
    }

    private static List<String> names(Path dir) throws IOException {
        try (Stream<Path> files = Files.list(dir)) {
            return files.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }
}
