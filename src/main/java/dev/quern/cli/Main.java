package dev.quern.cli;

/** Placeholder until the commands land. */
public final class Main {
    private Main() {
    }

    public static void main(String[] args) {
        System.exit(0);
    }
}
