package dev.quern.run;

import dev.quern.QuernException;
import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The folder a build writes to. Every output goes first to a hidden temporary file beside its final name;
 * only when all are complete are they renamed into place, so a failed build leaves no half-written output
 * (and an earlier build's files stay as they were).
 */
public final class OutputFolder implements AutoCloseable {

    /** How the name of a folder still being written ends. */
    public static final String PENDING_FOLDER = ".pending";

    private final Path folder;
    private final Map<String, Path> pending = new LinkedHashMap<>();
    private boolean committed;

    public OutputFolder(Path folder) {
        this.folder = folder;
        try {
            Files.createDirectories(folder);
        } catch (IOException e) {
            throw QuernException.output("cannot create the output folder " + folder + ": " + e.getMessage(), e);
        }
    }

    public Path folder() {
        return folder;
    }

    /** A writer to the temporary file that becomes {@code name} on commit. */
    public Writer open(String name) {
        Path temp = reserve(name);
        try {
            return Files.newBufferedWriter(temp, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw cannotWrite(e);
        }
    }

    /** A stream of bytes to the temporary file that becomes {@code name} on commit; the caller buffers. */
    public OutputStream openBytes(String name) {
        Path temp = reserve(name);
        try {
            return Files.newOutputStream(temp);
        } catch (IOException e) {
            throw cannotWrite(e);
        }
    }

    /**
     * The temporary file that becomes {@code name} on commit, for writers that need a path rather than a
     * stream (DuckDB's COPY).
     */
    public Path reserve(String name) {
        try {
            Path temp = Files.createTempFile(folder, "." + name + ".", ".tmp");
            pending.put(name, temp);
            return temp;
        } catch (IOException e) {
            throw cannotWrite(e);
        }
    }

    private QuernException cannotWrite(IOException e) {
        return QuernException.output("cannot write in " + folder + ": " + e.getMessage(), e);
    }

    /**
     * A path, not yet created, that becomes the folder {@code name} on commit: for writers that make a
     * folder of part files themselves (Spark's Parquet writer refuses a folder that exists). Unlike the
     * files, it is not hidden: Spark's readers skip a path whose name starts with '.' or '_' ("All paths
     * were ignored"), and the build reads the folder back.
     */
    public Path reserveFolder(String name) {
        Path temp = folder.resolve(name + "." + java.util.UUID.randomUUID() + PENDING_FOLDER);
        pending.put(name, temp);
        return temp;
    }

    /** Writes a whole text output. */
    public void write(String name, String text) {
        try (Writer w = open(name)) {
            w.write(text);
        } catch (IOException e) {
            throw QuernException.output("cannot write " + name + " in " + folder + ": " + e.getMessage(), e);
        }
    }

    /**
     * The temporary file that holds {@code name} until commit, to read back an output already written and
     * closed (the leakage audit reads the matrix; the build compares it with an earlier one).
     */
    public Path pending(String name) {
        Path temp = pending.get(name);
        if (temp == null) {
            throw new IllegalStateException(name + " is not a pending output of " + folder);
        }
        return temp;
    }

    /** Drops a pending output: its temporary file is removed and it is not committed. */
    public void discard(String name) {
        Path temp = pending.remove(name);
        if (temp == null) {
            return;
        }
        try {
            delete(temp);
        } catch (IOException e) {
            throw QuernException.output("cannot remove the temporary file " + temp + ": " + e.getMessage(), e);
        }
    }

    /** Moves every pending file to its final name; returns the final paths in the order written. */
    public List<Path> commit() {
        List<Path> done = new ArrayList<>();
        try {
            for (Map.Entry<String, Path> e : pending.entrySet()) {
                Path target = folder.resolve(e.getKey());
                if (Files.isDirectory(e.getValue()) || Files.isDirectory(target)) {
                    // A folder cannot replace another in one move: an earlier build's folder goes first.
                    delete(target);
                }
                try {
                    Files.move(e.getValue(), target, StandardCopyOption.ATOMIC_MOVE,
                            StandardCopyOption.REPLACE_EXISTING);
                } catch (AtomicMoveNotSupportedException notAtomic) {
                    Files.move(e.getValue(), target, StandardCopyOption.REPLACE_EXISTING);
                }
                done.add(target);
            }
        } catch (IOException e) {
            throw QuernException.output("cannot move outputs into " + folder + ": " + e.getMessage(), e);
        }
        pending.clear();
        committed = true;
        return done;
    }

    /** Removes whatever was not committed. */
    @Override
    public void close() {
        if (committed) {
            return;
        }
        for (Path temp : pending.values()) {
            try {
                delete(temp);
            } catch (IOException e) {
                throw new UncheckedIOException("cannot remove the temporary file " + temp, e);
            }
        }
        pending.clear();
    }

    private static void delete(Path path) throws IOException {
        if (Files.isDirectory(path, java.nio.file.LinkOption.NOFOLLOW_LINKS)) {
            try (java.util.stream.Stream<Path> inside = Files.list(path)) {
                for (Path p : inside.toList()) {
                    delete(p);
                }
            }
        }
        Files.deleteIfExists(path);
    }
}
