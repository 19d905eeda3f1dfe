package dev.quern.testing;

import java.io.IOException;
import java.io.Reader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

/** A matrix.csv read back as rows of column name to text, in file order. */
public record Matrix(List<String> columns, List<Map<String, String>> rows) {

    public static Matrix read(Path csv) {
        try (Reader in = Files.newBufferedReader(csv);
             CSVParser parser = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get().parse(in)) {
            List<Map<String, String>> rows = new ArrayList<>();
            for (CSVRecord r : parser) {
                rows.add(new LinkedHashMap<>(r.toMap()));
            }
            return new Matrix(parser.getHeaderNames(), rows);
        } catch (IOException e) {
            throw new IllegalStateException(e);
        }
    }

    /** The row of one entity at one cutoff. */
    public Map<String, String> row(String key, String cutoff) {
        String keyColumn = columns.get(0);
        return rows.stream().filter(r -> r.get(keyColumn).equals(key) && r.get("cutoff").equals(cutoff))
                .findFirst().orElseThrow(() -> new AssertionError("no row for " + key + " at " + cutoff));
    }

    public boolean has(String key, String cutoff) {
        String keyColumn = columns.get(0);
        return rows.stream().anyMatch(r -> r.get(keyColumn).equals(key) && r.get("cutoff").equals(cutoff));
    }
}
