package dev.quern.bench;

import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.lang.reflect.InvocationTargetException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;

/**
 * Runs another program's {@code main} in this JVM and, when the JVM exits (also through
 * {@code System.exit}, which the quern command line calls), writes how long it ran and the peak heap it
 * used to a report file: {@code elapsed_s=...} and {@code peak_heap_mb=...}.
 *
 * <p>The peak heap is the sum of every heap pool's own peak: an upper bound of the true peak, since the
 * pools need not peak at the same moment. With {@code -Xmx256m} a finished run proves the bound anyway.
 *
 * <pre>{@code java -Xmx256m -cp ... dev.quern.bench.Measured REPORT_FILE MAIN_CLASS ARGS...}</pre>
 */
public final class Measured {

    private Measured() {
    }

    public static void main(String[] args) throws Exception {
        Path report = Path.of(args[0]);
        String mainClass = args[1];
        String[] rest = Arrays.copyOfRange(args, 2, args.length);
        long started = System.nanoTime();
        Runtime.getRuntime().addShutdownHook(new Thread(() -> write(report, System.nanoTime() - started)));
        try {
            Class.forName(mainClass).getMethod("main", String[].class).invoke(null, (Object) rest);
        } catch (InvocationTargetException e) {
            throw e.getCause() instanceof Exception cause ? cause : e;
        }
    }

    private static void write(Path report, long nanos) {
        long peak = 0;
        for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
            if (pool.getType() == MemoryType.HEAP && pool.getPeakUsage() != null) {
                peak += pool.getPeakUsage().getUsed();
            }
        }
        String text = "elapsed_s=" + nanos / 1e9 + "\npeak_heap_mb=" + peak / (1024.0 * 1024.0) + "\n";
        try {
            Files.writeString(report, text, StandardCharsets.UTF_8);
        } catch (IOException e) {
            System.err.println("cannot write " + report + ": " + e.getMessage());
        }
    }
}
