package dev.quern.report;

import dev.quern.QuernException;
import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.constructor.SafeConstructor;
import org.yaml.snakeyaml.error.YAMLException;

/**
 * What {@code quern compare} reads of one build: where its matrix is (read later, row by row), the data
 * dictionary's column names, roles and types, and provenance.json read back as maps and lists.
 */
public record BuildFiles(String name, Path matrix, List<Entry> dictionary, Map<String, Object> provenance) {

    static final String MATRIX = "matrix.csv";
    static final String DICTIONARY = "dictionary.csv";
    static final String PROVENANCE = "provenance.json";

    /** One data dictionary row as compare needs it. */
    public record Entry(String column, String role, String type) {
        public Entry {
            Objects.requireNonNull(column, "column");
            Objects.requireNonNull(role, "role");
            Objects.requireNonNull(type, "type");
        }

        /** Integer and decimal columns get numeric bins; everything else (text, dates) levels. */
        public boolean numeric() {
            return type.equals("integer") || type.equals("decimal");
        }
    }

    public BuildFiles {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(matrix, "matrix");
        dictionary = List.copyOf(dictionary);
        provenance = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(provenance));
    }

    /** A build folder as {@code quern build} wrote it. */
    public static BuildFiles read(Path folder) {
        if (!Files.isDirectory(folder)) {
            throw QuernException.data(folder + " is not a folder: name the --out folder of a build");
        }
        for (String file : List.of(MATRIX, DICTIONARY, PROVENANCE)) {
            if (!Files.isRegularFile(folder.resolve(file))) {
                throw QuernException.data(folder + " has no " + file + ": name the --out folder of a build");
            }
        }
        return of(folder.toString(), folder.resolve(MATRIX), text(folder.resolve(DICTIONARY)),
                text(folder.resolve(PROVENANCE)));
    }

    /** A build from its parts: the matrix file and the dictionary and provenance texts. */
    public static BuildFiles of(String name, Path matrix, String dictionaryCsv, String provenanceJson) {
        return new BuildFiles(name, matrix, entries(name, dictionaryCsv), provenance(name, provenanceJson));
    }

    public Optional<Entry> entry(String column) {
        return dictionary.stream().filter(e -> e.column().equals(column)).findFirst();
    }

    /** A provenance value by its path of keys ({@code "recipe", "sha256"}); empty when absent. */
    public Optional<Object> provenance(String... path) {
        Object at = provenance;
        for (String key : path) {
            if (!(at instanceof Map<?, ?> m) || !m.containsKey(key)) {
                return Optional.empty();
            }
            at = m.get(key);
        }
        return Optional.ofNullable(at);
    }

    /** A parser over the matrix, header read: the caller streams its records and closes it. */
    CSVParser openMatrix() {
        try {
            Reader in = Files.newBufferedReader(matrix, StandardCharsets.UTF_8);
            return CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get().parse(in);
        } catch (IOException e) {
            throw QuernException.data("cannot read " + matrix + ": " + e.getMessage(), e);
        }
    }

    private static String text(Path file) {
        try {
            return Files.readString(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw QuernException.data("cannot read " + file + ": " + e.getMessage(), e);
        }
    }

    private static List<Entry> entries(String name, String csv) {
        try (CSVParser parser = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get()
                .parse(new StringReader(csv))) {
            if (!parser.getHeaderNames().containsAll(List.of("column", "role", "type"))) {
                throw QuernException.data(name + ": " + DICTIONARY + " has no column, role and type columns");
            }
            List<Entry> out = new ArrayList<>();
            for (CSVRecord r : parser) {
                out.add(new Entry(r.get("column"), r.get("role"), r.get("type")));
            }
            return out;
        } catch (IOException | IllegalArgumentException | IllegalStateException e) {
            throw QuernException.data(name + ": " + DICTIONARY + " cannot be read: " + e.getMessage(), e);
        }
    }

    /** provenance.json read back: JSON is YAML, and SnakeYAML's safe constructor builds plain maps. */
    private static Map<String, Object> provenance(String name, String json) {
        try {
            Object root = new Yaml(new SafeConstructor(new LoaderOptions())).load(json);
            if (!(root instanceof Map<?, ?> map)) {
                throw QuernException.data(name + ": " + PROVENANCE + " is not a JSON object");
            }
            Map<String, Object> out = new LinkedHashMap<>();
            map.forEach((k, v) -> out.put(String.valueOf(k), v));
            return out;
        } catch (YAMLException e) {
            throw QuernException.data(name + ": " + PROVENANCE + " cannot be read: " + e.getMessage(), e);
        }
    }
}
