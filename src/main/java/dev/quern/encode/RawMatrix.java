package dev.quern.encode;

import dev.quern.QuernException;
import dev.quern.run.MatrixWriter;
import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.function.Consumer;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

/** The raw matrix the run stage wrote, read back one row at a time: every pass streams it from disk. */
final class RawMatrix {

    private final Path file;
    private final List<String> header;

    RawMatrix(Path file, List<String> header) {
        this.file = file;
        this.header = List.copyOf(header);
    }

    /** Calls {@code row} with each row after the header, in file order. */
    void forEachRow(Consumer<CSVRecord> row) {
        try (Reader in = Files.newBufferedReader(file, StandardCharsets.UTF_8);
             CSVParser parser = MatrixWriter.FORMAT.parse(in)) {
            boolean first = true;
            for (CSVRecord record : parser) {
                if (first) {
                    first = false;
                    if (!record.toList().equals(header)) {
                        throw new IllegalStateException("the raw matrix's header is not the plan's: " + record.toList());
                    }
                    continue;
                }
                row.accept(record);
            }
        } catch (IOException e) {
            throw QuernException.output("reading the raw matrix " + file + " back failed: " + e.getMessage(), e);
        }
    }
}
