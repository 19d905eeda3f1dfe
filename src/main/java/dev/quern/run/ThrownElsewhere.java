package dev.quern.run;

/** A failure on another thread, thrown again on the thread that waited for its work, as it was thrown there. */
final class ThrownElsewhere {

    private ThrownElsewhere() {
    }

    /**
     * Throws {@code failure} itself when it is unchecked; a checked one, which the waiting code cannot
     * declare, inside an {@code IllegalStateException} that says {@code what} failed.
     */
    static RuntimeException rethrow(Throwable failure, String what) {
        if (failure instanceof RuntimeException r) {
            throw r;
        }
        if (failure instanceof Error e) {
            throw e;
        }
        throw new IllegalStateException(what + " failed", failure);
    }
}
