package dev.quern.run;

import dev.quern.QuernException;
import dev.quern.schema.Engine;
import dev.quern.schema.Source;
import java.sql.Connection;
import java.sql.SQLException;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ExecutionException;
import java.util.function.Function;
import java.util.function.Supplier;

/**
 * A read of the source that does not depend on the matrix, taken on a connection and a thread of its own
 * while the build writes the matrix, so that a second core works on it instead of the build waiting for it
 * afterwards. The leakage audit's reads of the source are such a read, and so is fingerprinting the source's
 * database file.
 *
 * <p>The connection is opened as every source connection is, read-only, and closed when the read ends,
 * whether or not anyone still wants its result. On Spark, whose session already spreads one query over the
 * cluster, the read waits and runs on the build's own connection when asked for.
 *
 * <pre>{@code
 * ReadAside<Evidence> evidence = ReadAside.start(source, connection, audit::readSource);
 * ... write the matrix ...
 * audit.run(evidence.get(), matrix);
 * }</pre>
 */
public final class ReadAside<T> {

    /** The running read; null when the read waits to run on the build's connection. */
    private final CompletableFuture<T> running;
    private final Supplier<T> deferred;

    private ReadAside(CompletableFuture<T> running, Supplier<T> deferred) {
        this.running = running;
        this.deferred = deferred;
    }

    /** Starts {@code read} on a connection of its own to {@code source}; {@code main} is the build's connection. */
    public static <T> ReadAside<T> start(Source source, Connection main, Function<Connection, T> read) {
        if (source.engine() == Engine.SPARK) {
            return new ReadAside<>(null, () -> read.apply(main));
        }
        Connection own = separate(source, main);
        // The result is handed over only once the connection is closed: whoever has it has nothing left open.
        return start(() -> {
            try (own) {
                return read.apply(own);
            } catch (SQLException e) {
                throw QuernException.data("closing the second connection to " + source.display() + " failed: "
                        + e.getMessage(), e);
            }
        });
    }

    /** Starts {@code read}, which needs no connection (reading a file, say), on a thread of its own. */
    public static <T> ReadAside<T> start(Supplier<T> read) {
        CompletableFuture<T> running = new CompletableFuture<>();
        Thread thread = new Thread(() -> {
            try {
                running.complete(read.get());
            } catch (Throwable t) {
                running.completeExceptionally(t);
            }
        }, "quern-read-aside");
        // A build that fails ends the JVM without waiting for a read nobody will use.
        thread.setDaemon(true);
        thread.start();
        return new ReadAside<>(running, null);
    }

    /** The read's result, waiting for it if need be; its failure is thrown here, as it was thrown there. Once. */
    public T get() {
        if (running == null) {
            return deferred.get();
        }
        try {
            return running.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted while waiting for a read of the source", e);
        } catch (ExecutionException e) {
            throw ThrownElsewhere.rethrow(e.getCause(), "a read of the source");
        }
    }

    /**
     * DuckDB shares its database between a connection and its duplicates, and lets one process open a file
     * only with one configuration; every other engine takes a second connection like the first.
     */
    private static Connection separate(Source source, Connection main) {
        if (source.engine() == Engine.DUCKDB) {
            try {
                return ConcurrentReads.another(main, Engine.DUCKDB);
            } catch (SQLException e) {
                throw QuernException.data("cannot open a second connection to " + source.display() + ": "
                        + e.getMessage(), e);
            }
        }
        return source.open();
    }
}
