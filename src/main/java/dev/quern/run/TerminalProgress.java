package dev.quern.run;

import java.io.PrintStream;

/** Progress on a terminal: one line rewritten in place, at most a few times a second. */
public final class TerminalProgress implements Progress {

    private static final long INTERVAL_NANOS = 250_000_000L;

    private final PrintStream out;
    private final long started = System.nanoTime();
    private long lastShown;
    private String stage = "";

    public TerminalProgress(PrintStream out) {
        this.out = out;
    }

    /** Progress on standard error when it is a terminal, else silence. */
    public static Progress forConsole() {
        return System.console() != null ? new TerminalProgress(System.err) : Progress.SILENT;
    }

    @Override
    public void stage(String name) {
        stage = name;
        show(stage);
    }

    @Override
    public void rows(long written) {
        long now = System.nanoTime();
        if (now - lastShown >= INTERVAL_NANOS) {
            lastShown = now;
            show(stage + ": " + written + " rows");
        }
    }

    @Override
    public void done() {
        out.print("\r\033[K");
        out.flush();
    }

    private void show(String text) {
        double seconds = (System.nanoTime() - started) / 1e9;
        out.printf("\r\033[K[%5.1fs] %s", seconds, text);
        out.flush();
    }
}
