package dev.quern.encode;

import dev.quern.Quern;
import dev.quern.QuernException;
import dev.quern.Version;
import dev.quern.plan.OutputColumn;
import dev.quern.plan.Plan;
import dev.quern.plan.Role;
import dev.quern.recipe.Recipe;
import dev.quern.run.ColumnStats;
import dev.quern.run.MatrixWriter;
import dev.quern.run.OutputFolder;
import dev.quern.run.Progress;
import dev.quern.run.RunResult;
import java.io.IOException;
import java.io.OutputStream;
import java.io.Writer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import java.util.function.Function;
import org.apache.commons.csv.CSVPrinter;

/**
 * The encode stage, between the run stage's raw matrix and the reports. {@link #plan} checks the recipe's
 * {@code encode} and {@code split} against the plan; {@link #build} has the raw matrix written to a scratch
 * file, fits every encoding on the training rows in passes over that file (or takes a frozen fit read by
 * {@link #readFitted}), and writes the encoded {@code matrix.csv} and {@code fitted.json} in one more
 * streaming pass. Memory does not grow with the row count, except for exact quantiles (see {@link Fitter}).
 */
public final class Encoder {

    /** The file a build writes its fitted encodings to, and a scoring run reads them from. */
    public static final String FITTED = "fitted.json";

    private Encoder() {
    }

    /** What the stage produced: the plan with the encoded matrix's columns, its statistics, and the fit. */
    public record Encoded(Plan plan, RunResult run, Fitted fitted, RunResult raw, Duration time) {
        public Encoded {
            Objects.requireNonNull(plan, "plan");
            Objects.requireNonNull(run, "run");
            Objects.requireNonNull(fitted, "fitted");
            Objects.requireNonNull(raw, "raw");
            Objects.requireNonNull(time, "time");
        }
    }

    /** Checks the recipe's encodings and split against {@code plan}; every mistake at once, with positions. */
    public static EncodePlan plan(Recipe recipe, Plan plan) {
        return new EncodePlanner(recipe, plan).plan();
    }

    /**
     * Reads a fitted file for this recipe (SHA-256 of its text) and checks that it encodes the columns
     * {@code plan} encodes, with the same steps; it then gives the same columns in the same order.
     */
    public static Fitted readFitted(Path file, EncodePlan plan, String recipeSha256) {
        Fitted fitted = FittedFile.read(file, recipeSha256);
        List<String> expected = plan.columns().stream().map(c -> c.source().name() + ": " + c.steps().stream()
                .map(Step::spelling).toList()).toList();
        List<String> found = fitted.columns().stream().map(c -> c.source() + ": " + c.steps().stream()
                .map(Encoder::spelling).toList()).toList();
        if (!expected.equals(found)) {
            throw FittedFile.wrong(file, "it encodes " + found + ", but the recipe encodes " + expected);
        }
        List<String> header = Naming.header(plan, fitted.columns());
        if (!header.equals(fitted.header())) {
            throw FittedFile.wrong(file, "its columns " + fitted.header() + " are not those its encodings give: "
                    + header);
        }
        return fitted;
    }

    private static String spelling(FittedStep step) {
        if (step instanceof FittedStep.OneHot) {
            return Kind.ONE_HOT.spelling();
        } else if (step instanceof FittedStep.Frequency) {
            return Kind.FREQUENCY.spelling();
        } else if (step instanceof FittedStep.TargetMean) {
            return Kind.TARGET_MEAN.spelling();
        } else if (step instanceof FittedStep.Bins) {
            return Kind.BINS.spelling();
        } else if (step instanceof FittedStep.Log1p) {
            return Kind.LOG1P.spelling();
        } else if (step instanceof FittedStep.Standardise) {
            return Kind.STANDARDISE.spelling();
        } else if (step instanceof FittedStep.Missing) {
            return Kind.MISSING.spelling();
        }
        return Kind.IMPUTE.spelling();
    }

    /**
     * Runs the stage into {@code out}: {@code rawMatrix} writes the raw matrix to the stream it is given (a
     * scratch file in the output folder, removed afterwards) and {@code rawWritten} reads it (the leakage
     * audit screens the raw columns); then the encodings are fitted on it, unless
     * {@code frozen} holds a fit to reuse, and {@link Quern#MATRIX} and {@link #FITTED} are written.
     */
    public static Encoded build(EncodePlan plan, Optional<Fitted> frozen, String recipeSha256, OutputFolder out,
                                Function<OutputStream, RunResult> rawMatrix, java.util.function.Consumer<Path> rawWritten,
                                Progress progress) {
        Path scratch = null;
        try {
            scratch = Files.createTempFile(out.folder(), ".matrix.raw.", ".tmp");
            RunResult raw;
            try (OutputStream w = Files.newOutputStream(scratch)) {
                raw = rawMatrix.apply(w);
            }
            rawWritten.accept(scratch);
            long started = System.nanoTime();
            RawMatrix matrix = new RawMatrix(scratch, plan.plan().columns().stream().map(OutputColumn::name).toList());
            Fitted fitted;
            Map<Integer, TargetStatistics> targets;
            if (frozen.isPresent()) {
                fitted = frozen.get();
                targets = Map.of();
            } else {
                progress.stage("fitting encodings on " + plan.trainingCutoffs().size() + " training cutoffs");
                long trainingRows = plan.trainingCutoffs().stream()
                        .mapToLong(c -> raw.rowsPerCutoff().getOrDefault(c.toString(), 0L)).sum();
                Fitter.Result result = new Fitter(plan, matrix).fit(trainingRows);
                List<FittedColumn> columns = Naming.name(plan, result.steps());
                fitted = new Fitted(plan.plan().recipeName(), recipeSha256, Version.current(),
                        plan.plan().label().map(l -> l.column()), plan.trainingCutoffs(), trainingRows, columns,
                        Naming.header(plan, columns));
                targets = result.targets();
            }
            progress.stage("encoding " + Quern.MATRIX);
            List<OutputColumn> columns = EncodedColumns.of(plan, fitted);
            RunResult run;
            try (Writer w = out.open(Quern.MATRIX)) {
                run = write(plan, fitted, targets, frozen.isEmpty(), matrix, raw, columns, w, progress);
            }
            out.write(FITTED, FittedFile.render(fitted));
            return new Encoded(plan.plan().withColumns(columns), run, fitted, raw,
                    Duration.ofNanos(System.nanoTime() - started));
        } catch (IOException e) {
            throw QuernException.output("writing the matrix in " + out.folder() + " failed: " + e.getMessage(), e);
        } finally {
            if (scratch != null) {
                try {
                    Files.deleteIfExists(scratch);
                } catch (IOException e) {
                    progress.stage("could not remove the scratch file " + scratch);
                }
            }
        }
    }

    /** The second pass: every raw row through its chains, written as it is read. */
    private static RunResult write(EncodePlan plan, Fitted fitted, Map<Integer, TargetStatistics> targets,
                                   boolean fittedHere, RawMatrix matrix, RunResult raw, List<OutputColumn> columns,
                                   Writer out, Progress progress) throws IOException {
        List<OutputColumn> rawColumns = plan.plan().columns();
        if (!columns.stream().map(OutputColumn::name).toList().equals(fitted.header())) {
            throw new IllegalStateException("dictionary and header disagree");
        }
        Chain[] chains = new Chain[rawColumns.size()];
        for (int e = 0; e < plan.columns().size(); e++) {
            ColumnEncoding encoding = plan.columns().get(e);
            chains[encoding.index()] = new Chain(encoding, fitted.column(encoding.source().name()).orElseThrow(),
                    targets.get(e));
        }
        int cutoffIndex = -1;
        for (int i = 0; i < rawColumns.size(); i++) {
            if (rawColumns.get(i).role() == Role.CUTOFF) {
                cutoffIndex = i;
            }
        }
        List<ColumnStats> stats = new ArrayList<>();
        columns.forEach(c -> stats.add(new ColumnStats(c.name(), c.type())));
        Set<LocalDate> training = new HashSet<>(fitted.trainingCutoffs());
        Map<String, LocalDate> dates = new HashMap<>();
        String[] record = new String[columns.size()];
        int[] cell = new int[1];
        long[] rows = new long[1];
        Chain.Sink sink = (value, text) -> {
            record[cell[0]] = text;
            stats.get(cell[0]).add(value, text);
            cell[0]++;
        };
        int cutoffAt = cutoffIndex;
        try (CSVPrinter csv = new CSVPrinter(out, MatrixWriter.FORMAT)) {
            csv.printRecord(fitted.header());
            IOException[] failed = new IOException[1];
            matrix.forEachRow(row -> {
                if (failed[0] != null) {
                    return;
                }
                cell[0] = 0;
                LocalDate cutoff = dates.computeIfAbsent(row.get(cutoffAt), LocalDate::parse);
                boolean trainingRow = fittedHere && training.contains(cutoff);
                for (int i = 0; i < chains.length; i++) {
                    String text = row.get(i);
                    if (chains[i] != null) {
                        chains[i].emit(text, cutoff, trainingRow, sink);
                    } else {
                        sink.put(text.isEmpty() ? null : text, text);
                    }
                    if (i == cutoffAt && plan.split().isPresent()) {
                        String part = plan.partOf(cutoff).orElse("");
                        sink.put(part.isEmpty() ? null : part, part);
                    }
                }
                try {
                    csv.printRecord((Object[]) record);
                } catch (IOException e) {
                    failed[0] = e;
                }
                if (++rows[0] % 10_000 == 0) {
                    progress.rows(rows[0]);
                }
            });
            if (failed[0] != null) {
                throw failed[0];
            }
            progress.rows(rows[0]);
            csv.flush();
        }
        return new RunResult(raw.rows(), raw.rowsPerCutoff(), stats, raw.queryTime(), raw.writeTime(),
                raw.labelPerCutoff());
    }
}
