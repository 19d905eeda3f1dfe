package dev.quern.encode;

import dev.quern.Diagnostic;
import dev.quern.Failure;
import dev.quern.Position;
import dev.quern.QuernException;
import dev.quern.report.Json;
import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.constructor.SafeConstructor;
import org.yaml.snakeyaml.error.YAMLException;

/**
 * {@code fitted.json}: every fitted value of a build, with the recipe's SHA-256 and the training cutoffs.
 * Written with Quern's JSON writer (numbers in the shortest form that reads back as the same double) and
 * read back with SnakeYAML, whose YAML reads this JSON as it is.
 */
public final class FittedFile {

    /** The format's version, written first; a reader refuses others. */
    static final int FORMAT = 1;

    private FittedFile() {
    }

    public static String render(Fitted fitted) {
        Map<String, Object> root = new LinkedHashMap<>();
        root.put("quern_fitted", FORMAT);
        root.put("quern_version", fitted.quernVersion());
        Map<String, Object> recipe = new LinkedHashMap<>();
        recipe.put("name", fitted.recipeName());
        recipe.put("sha256", fitted.recipeSha256());
        root.put("recipe", recipe);
        root.put("label", fitted.label().orElse(null));
        root.put("training_cutoffs", fitted.trainingCutoffs().stream().map(Object::toString).toList());
        root.put("training_rows", fitted.trainingRows());
        root.put("columns", fitted.header());
        List<Object> encodings = new ArrayList<>();
        for (FittedColumn c : fitted.columns()) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("column", c.source());
            m.put("output", c.output().orElse(null));
            m.put("steps", c.steps().stream().map(FittedFile::step).toList());
            encodings.add(m);
        }
        root.put("encodings", encodings);
        return Json.write(root);
    }

    private static Object step(FittedStep step) {
        Map<String, Object> m = new LinkedHashMap<>();
        if (step instanceof FittedStep.OneHot h) {
            m.put("kind", Kind.ONE_HOT.spelling());
            m.put("top", h.top());
            m.put("rows", h.rows());
            m.put("levels", h.levels().stream().map(l -> entries("level", l.level(), "rows", l.rows(), "column",
                    l.column())).toList());
            m.put("other", entries("rows", h.otherRows(), "column", h.otherColumn()));
            m.put("missing", entries("rows", h.emptyRows(), "column", h.missingColumn()));
        } else if (step instanceof FittedStep.Frequency f) {
            m.put("kind", Kind.FREQUENCY.spelling());
            m.put("rows", f.rows());
            m.put("levels", f.levels().stream().map(s -> entries("level", s.level(), "rows", s.rows(), "share",
                    s.share())).toList());
            m.put("empty", entries("rows", f.empty().rows(), "share", f.empty().share()));
        } else if (step instanceof FittedStep.TargetMean t) {
            m.put("kind", Kind.TARGET_MEAN.spelling());
            m.put("m", t.m());
            m.put("labelled_rows", t.labelledRows());
            m.put("prior", t.prior());
            m.put("levels", t.levels().stream().map(l -> entries("level", l.level(), "rows", l.rows(), "label_mean",
                    l.labelMean(), "value", l.value())).toList());
            m.put("empty", entries("rows", t.empty().rows(), "label_mean", t.empty().labelMean(), "value",
                    t.empty().value()));
        } else if (step instanceof FittedStep.Bins b) {
            m.put("kind", Kind.BINS.spelling());
            m.put("count", b.count());
            m.put("rows", b.rows());
            m.put("edges", b.edges());
        } else if (step instanceof FittedStep.Log1p) {
            m.put("kind", Kind.LOG1P.spelling());
        } else if (step instanceof FittedStep.Standardise s) {
            m.put("kind", Kind.STANDARDISE.spelling());
            m.put("rows", s.rows());
            m.put("mean", s.mean());
            m.put("sd", s.sd());
            m.put("scale", s.scale());
        } else if (step instanceof FittedStep.Missing x) {
            m.put("kind", Kind.MISSING.spelling());
            m.put("column", x.column());
        } else if (step instanceof FittedStep.Impute i) {
            m.put("kind", Kind.IMPUTE.spelling());
            m.put("with", i.with());
            m.put("rows", i.rows());
            m.put("value", i.value());
        }
        return m;
    }

    private static Map<String, Object> entries(Object... keysAndValues) {
        Map<String, Object> m = new LinkedHashMap<>();
        for (int i = 0; i < keysAndValues.length; i += 2) {
            m.put((String) keysAndValues[i], keysAndValues[i + 1]);
        }
        return m;
    }

    // ------------------------------------------------------------------------------------------ reading

    /**
     * Reads a fitted file for a recipe whose text has SHA-256 {@code recipeSha256}; a file fitted for another
     * recipe text is refused, since its columns and values may not be this recipe's.
     */
    public static Fitted read(Path file, String recipeSha256) {
        Object root;
        if (!Files.isRegularFile(file)) {
            throw new QuernException(Failure.USAGE, List.of(Diagnostic.at(Position.NONE, "the fitted file " + file
                    + " does not exist: name the fitted.json an earlier build wrote")));
        }
        try (Reader in = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            LoaderOptions options = new LoaderOptions();
            options.setCodePointLimit(Integer.MAX_VALUE);
            root = new Yaml(new SafeConstructor(options)).load(in);
        } catch (IOException e) {
            throw new QuernException(Failure.USAGE, List.of(Diagnostic.at(Position.NONE, "cannot read the fitted file "
                    + file + ": " + e.getMessage())), e);
        } catch (YAMLException e) {
            throw wrong(file, "it is not JSON (" + e.getMessage().lines().findFirst().orElse("") + ")");
        }
        Reading r = new Reading(file);
        Map<?, ?> m = r.map(root, "the file");
        Object format = m.get("quern_fitted");
        if (!(format instanceof Number n) || n.intValue() != FORMAT) {
            throw wrong(file, "it has no 'quern_fitted: " + FORMAT + "'; it was not written by quern build");
        }
        Map<?, ?> recipe = r.map(m.get("recipe"), "recipe");
        String name = r.string(recipe.get("name"), "recipe.name");
        String sha = r.string(recipe.get("sha256"), "recipe.sha256");
        if (!sha.equals(recipeSha256)) {
            throw new QuernException(Failure.RECIPE, List.of(Diagnostic.at(new Position(file.toString(), 0, 0),
                    "was fitted for another recipe text (recipe " + name + ", sha256 " + shortHash(sha) + "), not this"
                            + " recipe (sha256 " + shortHash(recipeSha256) + "): its columns and values may not fit."
                            + " Rebuild the training table with this recipe to fit again, or score with the recipe"
                            + " file it was fitted with")));
        }
        Optional<String> label = Optional.ofNullable(m.get("label")).map(v -> r.string(v, "label"));
        List<LocalDate> cutoffs = r.list(m.get("training_cutoffs"), "training_cutoffs").stream()
                .map(v -> r.date(v, "training_cutoffs")).toList();
        long rows = r.whole(m.get("training_rows"), "training_rows");
        List<String> header = r.list(m.get("columns"), "columns").stream().map(v -> r.string(v, "columns")).toList();
        List<FittedColumn> columns = new ArrayList<>();
        for (Object e : r.list(m.get("encodings"), "encodings")) {
            Map<?, ?> c = r.map(e, "an encoding");
            String source = r.string(c.get("column"), "encodings.column");
            Optional<String> output = Optional.ofNullable(c.get("output")).map(v -> r.string(v, "encodings.output"));
            List<FittedStep> steps = new ArrayList<>();
            for (Object s : r.list(c.get("steps"), "steps of " + source)) {
                steps.add(r.step(r.map(s, "a step of " + source), source));
            }
            columns.add(new FittedColumn(source, steps, output));
        }
        String version = m.get("quern_version") == null ? "unknown" : m.get("quern_version").toString();
        return new Fitted(name, sha, version, label, cutoffs, rows, columns, header);
    }

    private static String shortHash(String sha) {
        return sha.length() > 12 ? sha.substring(0, 12) + "..." : sha;
    }

    static QuernException wrong(Path file, String why) {
        return new QuernException(Failure.RECIPE, List.of(Diagnostic.at(new Position(file.toString(), 0, 0),
                "is not a usable fitted file: " + why)));
    }

    /** Typed reads of the parsed JSON, each failing with what was expected where. */
    private record Reading(Path file) {

        Map<?, ?> map(Object v, String what) {
            if (v instanceof Map<?, ?> m) {
                return m;
            }
            throw wrong(file, what + " should be an object");
        }

        List<?> list(Object v, String what) {
            if (v instanceof List<?> l) {
                return l;
            }
            throw wrong(file, what + " should be a list");
        }

        String string(Object v, String what) {
            if (v instanceof String s) {
                return s;
            }
            throw wrong(file, what + " should be text");
        }

        double number(Object v, String what) {
            if (v == null) {
                return Double.NaN;
            }
            if (v instanceof Number n) {
                return n.doubleValue();
            }
            throw wrong(file, what + " should be a number");
        }

        long whole(Object v, String what) {
            if (v instanceof Number n && n.doubleValue() == Math.rint(n.doubleValue())) {
                return n.longValue();
            }
            throw wrong(file, what + " should be a whole number");
        }

        LocalDate date(Object v, String what) {
            try {
                return LocalDate.parse(string(v, what));
            } catch (DateTimeParseException e) {
                throw wrong(file, what + " should hold dates YYYY-MM-DD");
            }
        }

        FittedStep step(Map<?, ?> m, String column) {
            String kind = string(m.get("kind"), "the kind of a step of " + column);
            String at = kind + " of " + column;
            return switch (Kind.of(kind).orElseThrow(() -> wrong(file, "unknown step kind '" + kind + "'"))) {
                case ONE_HOT -> {
                    List<FittedStep.Level> levels = new ArrayList<>();
                    for (Object o : list(m.get("levels"), at + ": levels")) {
                        Map<?, ?> l = map(o, at + ": a level");
                        levels.add(new FittedStep.Level(string(l.get("level"), at + ": level"),
                                whole(l.get("rows"), at + ": rows"), string(l.get("column"), at + ": column")));
                    }
                    Map<?, ?> other = map(m.get("other"), at + ": other");
                    Map<?, ?> missing = map(m.get("missing"), at + ": missing");
                    yield new FittedStep.OneHot((int) whole(m.get("top"), at + ": top"), whole(m.get("rows"), at),
                            levels, whole(other.get("rows"), at), string(other.get("column"), at),
                            whole(missing.get("rows"), at), string(missing.get("column"), at));
                }
                case FREQUENCY -> {
                    List<FittedStep.Share> levels = new ArrayList<>();
                    for (Object o : list(m.get("levels"), at + ": levels")) {
                        Map<?, ?> l = map(o, at + ": a level");
                        levels.add(new FittedStep.Share(string(l.get("level"), at), whole(l.get("rows"), at),
                                number(l.get("share"), at)));
                    }
                    Map<?, ?> empty = map(m.get("empty"), at + ": empty");
                    yield new FittedStep.Frequency(whole(m.get("rows"), at), levels, new FittedStep.Share("",
                            whole(empty.get("rows"), at), number(empty.get("share"), at)));
                }
                case TARGET_MEAN -> {
                    List<FittedStep.LevelMean> levels = new ArrayList<>();
                    for (Object o : list(m.get("levels"), at + ": levels")) {
                        Map<?, ?> l = map(o, at + ": a level");
                        levels.add(new FittedStep.LevelMean(string(l.get("level"), at), whole(l.get("rows"), at),
                                number(l.get("label_mean"), at), number(l.get("value"), at)));
                    }
                    Map<?, ?> empty = map(m.get("empty"), at + ": empty");
                    yield new FittedStep.TargetMean(number(m.get("m"), at), whole(m.get("labelled_rows"), at),
                            number(m.get("prior"), at), levels, new FittedStep.LevelMean("",
                            whole(empty.get("rows"), at), number(empty.get("label_mean"), at),
                            number(empty.get("value"), at)));
                }
                case BINS -> new FittedStep.Bins((int) whole(m.get("count"), at), whole(m.get("rows"), at),
                        list(m.get("edges"), at + ": edges").stream().map(e -> number(e, at + ": edges")).toList());
                case LOG1P -> new FittedStep.Log1p();
                case STANDARDISE -> new FittedStep.Standardise(whole(m.get("rows"), at), number(m.get("mean"), at),
                        number(m.get("sd"), at), number(m.get("scale"), at));
                case MISSING -> new FittedStep.Missing(string(m.get("column"), at + ": column"));
                case IMPUTE -> new FittedStep.Impute(string(m.get("with"), at + ": with"), whole(m.get("rows"), at),
                        number(m.get("value"), at + ": value"));
            };
        }
    }
}
