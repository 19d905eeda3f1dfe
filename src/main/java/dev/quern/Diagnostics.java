package dev.quern;

import java.util.ArrayList;
import java.util.List;

/** Collects the diagnostics of one stage so that they can be reported together. */
public final class Diagnostics {

    private final List<Diagnostic> found = new ArrayList<>();

    public void error(Position at, String message) {
        found.add(Diagnostic.at(at, message));
    }

    public boolean isEmpty() {
        return found.isEmpty();
    }

    public List<Diagnostic> all() {
        return List.copyOf(found);
    }

    /** Stops the stage with every diagnostic found so far, if there is one. */
    public void throwIfAny(Failure failure) {
        if (!found.isEmpty()) {
            found.sort(java.util.Comparator.comparing((Diagnostic d) -> d.position().file())
                    .thenComparingInt(d -> d.position().line())
                    .thenComparingInt(d -> d.position().column()));
            throw new QuernException(failure, found);
        }
    }
}
