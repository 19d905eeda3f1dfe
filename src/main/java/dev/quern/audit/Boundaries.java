package dev.quern.audit;

import dev.quern.plan.Boundary;
import dev.quern.recipe.Span;
import java.time.LocalDate;

/**
 * The day boundaries the audit restates the plan's windows with. The default takes them from
 * {@link Boundary}, the one place where the compiled query gets them too; tests replace it with boundaries
 * that are off by a day, to show that the audit's independent comparisons catch rows a faulty window would
 * admit.
 */
interface Boundaries {

    /** The start of the day after the cutoff: rows strictly before it are visible. */
    LocalDate visibleUntil(LocalDate cutoff);

    /** The first day of a window that ends with the cutoff day. */
    LocalDate windowStart(Span window, LocalDate cutoff);

    Boundaries PLAN = new Boundaries() {
        @Override
        public LocalDate visibleUntil(LocalDate cutoff) {
            return new Boundary.CutoffEnd().at(cutoff);
        }

        @Override
        public LocalDate windowStart(Span window, LocalDate cutoff) {
            return new Boundary.WindowStart(window).at(cutoff);
        }
    };
}
