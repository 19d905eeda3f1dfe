package dev.quern;

import dev.quern.audit.Audit;
import dev.quern.audit.AuditReport;
import dev.quern.encode.EncodePlan;
import dev.quern.encode.Encoder;
import dev.quern.encode.Fitted;
import dev.quern.plan.Plan;
import dev.quern.plan.Planner;
import dev.quern.recipe.Recipe;
import dev.quern.recipe.RecipeReader;
import dev.quern.report.BuildFiles;
import dev.quern.report.Compare;
import dev.quern.report.Comparison;
import dev.quern.report.DataDictionary;
import dev.quern.report.HtmlReport;
import dev.quern.report.Lineage;
import dev.quern.report.Provenance;
import dev.quern.report.RulesReport;
import dev.quern.report.Thresholds;
import dev.quern.run.MatrixFormat;
import dev.quern.run.RuleOutcome;
import dev.quern.run.RuleRunner;
import dev.quern.sql.LateRows;
import dev.quern.sql.TextInNumbers;
import dev.quern.sql.RuleQueries;
import dev.quern.run.MatrixWriter;
import dev.quern.run.OutputFolder;
import dev.quern.run.ParquetWriter;
import dev.quern.run.Progress;
import dev.quern.run.RunResult;
import dev.quern.run.ReadAside;
import dev.quern.schema.Engine;
import dev.quern.schema.SchemaReader;
import dev.quern.schema.Source;
import dev.quern.schema.SourceSchema;
import dev.quern.sql.BlockShape;
import dev.quern.spark.SparkMatrix;
import dev.quern.sql.CompiledQuery;
import dev.quern.sql.SqlCompiler;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.sql.Connection;
import java.sql.SQLException;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Quern's Java API: a recipe on its way through the stages (recipe, schema, plan, sql, run, report).
 * The command line is a thin shell over this class.
 *
 * <pre>{@code
 * BuildSummary built = Quern.load(Path.of("recipes/member-churn.yaml")).build(Path.of("out"), Progress.SILENT);
 * }</pre>
 */
public final class Quern {

    public static final String MATRIX = "matrix.csv";
    public static final String MATRIX_PARQUET = "matrix.parquet";
    public static final String DICTIONARY_CSV = "dictionary.csv";
    public static final String DICTIONARY_MD = "dictionary.md";
    public static final String PROVENANCE = "provenance.json";
    public static final String RULES = "rules.md";
    public static final String REPORT = "report.html";
    public static final String AUDIT_JSON = "audit.json";
    public static final String AUDIT_MD = "audit.md";

    private final Recipe recipe;
    private final Path recipeFolder;
    private final Optional<List<LocalDate>> cutoffs;
    private final Optional<Path> fitted;
    private final MatrixFormat format;
    private final Optional<BlockShape> shape;

    private Quern(Recipe recipe, Path recipeFolder) {
        this(recipe, recipeFolder, Optional.empty(), Optional.empty(), MatrixFormat.CSV, Optional.empty());
    }

    private Quern(Recipe recipe, Path recipeFolder, Optional<List<LocalDate>> cutoffs, Optional<Path> fitted,
                  MatrixFormat format, Optional<BlockShape> shape) {
        this.recipe = recipe;
        this.recipeFolder = recipeFolder;
        this.cutoffs = cutoffs;
        this.fitted = fitted;
        this.format = format;
        this.shape = shape;
    }

    /** Reads and parses a recipe file; relative SQLite paths in it are read from the file's folder. */
    public static Quern load(Path recipeFile) {
        Path folder = Optional.ofNullable(recipeFile.toAbsolutePath().getParent()).orElse(Path.of("."));
        return new Quern(RecipeReader.read(recipeFile), folder);
    }

    /** A recipe given as text; relative SQLite paths are read from {@code folder}. */
    public static Quern of(Recipe recipe, Path folder) {
        return new Quern(recipe, folder);
    }

    /** The same recipe reading another source (a JDBC URL; may name {@code ${VARIABLES}}). */
    public Quern withSource(String url) {
        return new Quern(recipe.withSource(url), Path.of("").toAbsolutePath(), cutoffs, fitted, format, shape);
    }

    /** The same recipe built at other cutoffs (a scoring run): same columns, other rows. */
    public Quern withCutoffs(List<LocalDate> dates) {
        return new Quern(recipe, recipeFolder, Optional.of(List.copyOf(dates)), fitted, format, shape);
    }

    /** Encodings taken from an earlier build's fitted file instead of fitted again. */
    public Quern withFitted(Path file) {
        return new Quern(recipe, recipeFolder, cutoffs, Optional.of(file), format, shape);
    }

    /** The same recipe, writing the matrix in {@code format} (CSV unless told). */
    public Quern withFormat(MatrixFormat format) {
        return new Quern(recipe, recipeFolder, cutoffs, fitted, java.util.Objects.requireNonNull(format, "format"), shape);
    }

    /**
     * The same recipe with every block computed in {@code shape} where that shape can compute it, instead of
     * the shape chosen for the engine; {@code quern sql --explain} says what was chosen and why.
     */
    public Quern withShape(BlockShape shape) {
        return new Quern(recipe, recipeFolder, cutoffs, fitted, format,
                Optional.of(java.util.Objects.requireNonNull(shape, "shape")));
    }

    public Recipe recipe() {
        return recipe;
    }

    public Source source() {
        return Source.of(recipe.source(), recipeFolder);
    }

    /** Checks the recipe against the source and compiles it, reading the catalogue but no feature data. */
    public Compilation compile() {
        Source source = source();
        try (Connection connection = source.open()) {
            return compile(source, connection, new LinkedHashMap<>());
        } catch (SQLException e) {
            throw QuernException.data("closing the source failed: " + e.getMessage(), e);
        }
    }

    /**
     * Compiles for {@code target} rather than for the source's own engine (Spark, for a recipe developed on a
     * SQLite extract): the catalogue and the time storage are read from the source, and the query is rendered
     * for {@code target}. Times the source keeps as ISO text are compared as text, which also holds for DATE
     * and TIMESTAMP columns; the query a build on {@code target} runs is {@link #compile()} with that source.
     */
    public Compilation compileFor(Engine target) {
        Source source = source();
        try (Connection connection = source.open()) {
            return compile(source, connection, new LinkedHashMap<>(), target);
        } catch (SQLException e) {
            throw QuernException.data("closing the source failed: " + e.getMessage(), e);
        }
    }

    /** Builds the modelling table and its reports into {@code folder}; all or nothing. */
    public BuildSummary build(Path folder, Progress progress) {
        return build(folder, progress, Optional.empty());
    }

    /**
     * Builds as {@link #build(Path, Progress)} does, and when {@code compareTo} names an earlier build's
     * folder (it may be {@code folder} itself), compares the new matrix with it; the drift goes into
     * report.html and the summary.
     */
    public BuildSummary build(Path folder, Progress progress, Optional<Path> compareTo) {
        Optional<BuildFiles> earlier = compareTo.map(BuildFiles::read);
        Source source = source();
        Map<String, Duration> timings = new LinkedHashMap<>();
        Instant builtAt = Instant.now();
        // Fingerprinting a database file reads all of it; it needs nothing of the build, so it runs beside it.
        ReadAside<Optional<String>> sourceSha256 = ReadAside.start(() -> source.file().map(Quern::sha256));
        try (Connection connection = source.open(); OutputFolder out = new OutputFolder(folder)) {
            progress.stage("checking the recipe against " + source.engine().label());
            Compilation compilation = compile(source, connection, timings);
            EncodePlan encoding = Encoder.plan(recipe, compilation.plan());
            String recipeSha256 = sha256(recipe.text());
            Optional<Fitted> frozen = fitted.map(f -> Encoder.readFitted(f, encoding, recipeSha256));
            Audit leakage = Audit.of(recipe, compilation.plan(), compilation.schema());
            // The audit's reads of the source do not need the matrix: they run beside it on a second connection.
            long[] sourceAuditNanos = {0};
            ReadAside<Audit.SourceEvidence> evidence = ReadAside.start(source, connection, c -> {
                long started = System.nanoTime();
                Audit.SourceEvidence read = leakage.readSource(c);
                sourceAuditNanos[0] = System.nanoTime() - started;
                return read;
            });
            progress.stage("checking the data against the recipe's rules");
            long rulesStarted = System.nanoTime();
            List<RuleOutcome> rules = RuleRunner.run(RuleQueries.of(compilation.plan()), connection);
            List<LateRows.Query> lateQueries = LateRows.of(compilation.plan());
            Map<String, Long> late = RuleRunner.countLate(lateQueries, connection);
            RuleRunner.requireNumbers(TextInNumbers.of(compilation.query()), connection);
            timings.put("rules", Duration.ofNanos(System.nanoTime() - rulesStarted));
            CompiledQuery matrixQuery = compilation.query();
            if (source.engine() == Engine.SPARK) {
                // Spark writes the matrix itself, on the cluster; the stages below read its files back.
                progress.stage("building " + MATRIX_PARQUET + " with Spark");
                long sparkStarted = System.nanoTime();
                matrixQuery = SparkMatrix.write(compilation.query(), connection, out.reserveFolder(MATRIX_PARQUET));
                timings.put("spark", Duration.ofNanos(System.nanoTime() - sparkStarted));
            }
            CompiledQuery rows = matrixQuery;
            progress.stage("building " + MATRIX);
            RunResult run;
            Plan table = compilation.plan();
            // The audit screens the raw matrix, whose columns are the plan's: before encoding, when there is one.
            List<AuditReport> audited = new ArrayList<>();
            // The audit's first pass over the matrix takes the rows as they are written. On Spark the evidence
            // is read on the build's connection, so it is read before the write holds that connection.
            Audit.SourceEvidence sparkEvidence = source.engine() == Engine.SPARK ? evidence.get() : null;
            Audit.Watch watch = leakage.watch(sparkEvidence != null ? () -> sparkEvidence : evidence::get);
            java.util.function.Consumer<Path> audit = matrix -> {
                progress.stage("auditing for leakage");
                long auditStart = System.nanoTime();
                audited.add(leakage.run(watch, matrix));
                timings.put("audit", Duration.ofNanos(System.nanoTime() - auditStart));
                timings.put("audit_source", Duration.ofNanos(sourceAuditNanos[0]));
            };
            if (encoding.isEmpty() && frozen.isEmpty()) {
                try (OutputStream matrix = out.openBytes(MATRIX)) {
                    run = MatrixWriter.write(rows, connection, matrix, progress, watch);
                }
                audit.accept(out.pending(MATRIX));
            } else {
                // The encode stage: the raw matrix goes to a scratch file, then is fitted and encoded into MATRIX.
                Encoder.Encoded encoded = Encoder.build(encoding, frozen, recipeSha256, out,
                        raw -> MatrixWriter.write(rows, connection, raw, progress, watch), audit, progress);
                run = encoded.run();
                table = encoded.plan();
                // Spark's Parquet holds the raw columns; the matrix of an encoding recipe is the encoded CSV.
                out.discard(MATRIX_PARQUET);
                timings.put("encode", encoded.time());
            }
            timings.put("query", run.queryTime());
            timings.put("write", run.writeTime());
            AuditReport leaks = audited.get(0);
            out.write(AUDIT_JSON, leaks.json());
            out.write(AUDIT_MD, leaks.markdown());
            if (leaks.blocked()) {
                // The audit is the one output of a blocked build: no matrix, and nothing that describes one.
                out.discard(MATRIX);
                out.discard(MATRIX_PARQUET);
                out.discard(Encoder.FITTED);
                out.commit();
                throw blockedBy(leaks, folder);
            }
            progress.stage("writing reports");
            Lineage lineage = Lineage.of(table);
            DataDictionary dictionary = new DataDictionary(leaks.annotate(table), run, lineage);
            String dictionaryCsv = dictionary.csv();
            out.write(DICTIONARY_CSV, dictionaryCsv);
            out.write(DICTIONARY_MD, dictionary.markdown());
            out.write(RULES, RulesReport.markdown(recipe.name().text(), rules, compilation.schema(),
                    recipe.eventTimes(), late,
                    lateQueries.stream().map(LateRows.Query::from).findFirst()));
            String provenance = Provenance.render(table, compilation.schema(), run, rules,
                    new Provenance.Facts(recipe.file(), recipeSha256, Version.current(), source.display(),
                            sourceSha256.get(), builtAt, timings));
            out.write(PROVENANCE, provenance);
            Optional<Comparison> drift = Optional.empty();
            if (earlier.isPresent()) {
                progress.stage("comparing with " + earlier.get().name());
                drift = Optional.of(Compare.of(earlier.get(),
                        BuildFiles.of(folder.toString(), out.pending(MATRIX), dictionaryCsv, provenance)));
            }
            out.write(REPORT, HtmlReport.render(table, run, lineage,
                    new HtmlReport.Facts(recipe.file(), recipeSha256, Version.current(), source.display(), builtAt),
                    new HtmlReport.Checks(leaks, rules), drift, Thresholds.DEFAULT));
            boolean writtenBySpark = source.engine() == Engine.SPARK && encoding.isEmpty() && frozen.isEmpty();
            if (format == MatrixFormat.PARQUET) {
                if (!writtenBySpark) {
                    progress.stage("writing " + format.fileName());
                    ParquetWriter.convert(out.pending(MATRIX), table.columns(), out.reserve(format.fileName()));
                }
                out.discard(MATRIX);
            }
            List<Path> files = out.commit();
            return new BuildSummary(compilation, run, rules, files, table.columns(), drift, leaks);
        } catch (IOException e) {
            throw QuernException.output("writing to " + folder + " failed: " + e.getMessage(), e);
        } catch (SQLException e) {
            throw QuernException.data("closing the source failed: " + e.getMessage(), e);
        } finally {
            progress.done();
        }
    }

    /**
     * Runs the leakage audit alone: builds the matrix into a temporary file (streamed, so memory stays flat;
     * the disk holds one matrix), audits it and removes it. Writes nothing else.
     */
    public AuditReport audit(Progress progress) {
        Source source = source();
        Path temp = null;
        try (Connection connection = source.open()) {
            progress.stage("checking the recipe against " + source.engine().label());
            Compilation compilation = compile(source, connection, new LinkedHashMap<>());
            Audit leakage = Audit.of(recipe, compilation.plan(), compilation.schema());
            RuleRunner.requireNumbers(TextInNumbers.of(compilation.query()), connection);
            progress.stage("building the matrix to audit");
            temp = Files.createTempFile("quern-audit-", ".csv");
            Audit.SourceEvidence evidence = leakage.readSource(connection);
            Audit.Watch watch = leakage.watch(() -> evidence);
            try (OutputStream matrix = Files.newOutputStream(temp)) {
                MatrixWriter.write(compilation.query(), connection, matrix, progress, watch);
            }
            progress.stage("auditing for leakage");
            return leakage.run(watch, temp);
        } catch (IOException e) {
            throw QuernException.output("cannot write the temporary matrix to audit: " + e.getMessage(), e);
        } catch (SQLException e) {
            throw QuernException.data("closing the source failed: " + e.getMessage(), e);
        } finally {
            progress.done();
            if (temp != null) {
                try {
                    Files.deleteIfExists(temp);
                } catch (IOException e) {
                    // A temporary file left behind is not worth failing the audit for.
                }
            }
        }
    }

    /** The failure of a build the audit blocked: each open blocking finding, then where to read more. */
    static QuernException blockedBy(AuditReport audit, Path folder) {
        List<Diagnostic> diagnostics = new ArrayList<>(audit.blocking());
        diagnostics.add(Diagnostic.at(Position.NONE, "the leakage audit blocked the build: " + MATRIX
                + " was not written; see " + folder.resolve(AUDIT_MD) + ", and fix each blocking finding or"
                + " acknowledge it under audit.acknowledge with a reason"));
        return new QuernException(Failure.LEAKAGE, diagnostics);
    }

    private Compilation compile(Source source, Connection connection, Map<String, Duration> timings) {
        return compile(source, connection, timings, source.engine());
    }

    private Compilation compile(Source source, Connection connection, Map<String, Duration> timings, Engine target) {
        long t0 = System.nanoTime();
        SourceSchema read = new SchemaReader(connection, source.engine()).read(recipe);
        SourceSchema schema = new SourceSchema(target, read.tables(), read.times());
        long t1 = System.nanoTime();
        Plan planned = Planner.plan(recipe, schema);
        Plan plan = cutoffs.map(planned::withCutoffs).orElse(planned);
        Encoder.plan(recipe, plan);
        Audit.checkAcknowledgements(recipe, plan);
        CompiledQuery query = SqlCompiler.compile(plan, shape);
        long t2 = System.nanoTime();
        timings.put("schema", Duration.ofNanos(t1 - t0));
        timings.put("compile", Duration.ofNanos(t2 - t1));
        return new Compilation(recipe, source, schema, plan, query);
    }

    static String sha256(String text) {
        return HexFormat.of().formatHex(digest().digest(text.getBytes(StandardCharsets.UTF_8)));
    }

    static String sha256(Path file) {
        MessageDigest digest = digest();
        try (InputStream in = Files.newInputStream(file)) {
            byte[] buffer = new byte[1 << 16];
            for (int n; (n = in.read(buffer)) > 0; ) {
                digest.update(buffer, 0, n);
            }
        } catch (IOException e) {
            throw QuernException.data("cannot read " + file + " to fingerprint it: " + e.getMessage(), e);
        }
        return HexFormat.of().formatHex(digest.digest());
    }

    private static MessageDigest digest() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java runtime has SHA-256", e);
        }
    }
}
