package dev.quern.plan;

import dev.quern.recipe.Span;
import java.time.LocalDate;
import java.util.Objects;

/**
 * A day boundary computed from each cutoff: the start of a window, the end of the cutoff day, the start
 * or end of the label horizon. Every boundary is the start of a day, and a row belongs to
 * {@code [from, until)}: a cutoff date means the end of that day, so a 30d window at 2025-03-31 holds rows
 * from 2025-03-02 00:00 up to, not including, 2025-04-01 00:00.
 */
public sealed interface Boundary {

    /** A fixed day to order spans by length: months and years differ in days, so compare at one point. */
    LocalDate REFERENCE = LocalDate.of(2001, 1, 1);

    /** The name of the column that carries this boundary for each cutoff. */
    String column();

    LocalDate at(LocalDate cutoff);

    /** The start of the day after the cutoff: rows strictly before it are visible. */
    record CutoffEnd() implements Boundary {
        @Override
        public String column() {
            return "visible_until";
        }

        @Override
        public LocalDate at(LocalDate cutoff) {
            return cutoff.plusDays(1);
        }
    }

    /** The first day of a window that ends with the cutoff day. */
    record WindowStart(Span window) implements Boundary {
        public WindowStart {
            Objects.requireNonNull(window, "window");
        }

        @Override
        public String column() {
            return "from_" + window.label();
        }

        @Override
        public LocalDate at(LocalDate cutoff) {
            return window.before(cutoff.plusDays(1));
        }
    }

    /** The first day of the label horizon: the day after the cutoff, moved on by the gap. */
    record HorizonStart(Span gap) implements Boundary {
        public HorizonStart {
            Objects.requireNonNull(gap, "gap");
        }

        @Override
        public String column() {
            return "label_from";
        }

        @Override
        public LocalDate at(LocalDate cutoff) {
            return gap.after(cutoff.plusDays(1));
        }
    }

    /** The day after the label horizon's last day. */
    record HorizonEnd(Span gap, Span horizon) implements Boundary {
        public HorizonEnd {
            Objects.requireNonNull(gap, "gap");
            Objects.requireNonNull(horizon, "horizon");
        }

        @Override
        public String column() {
            return "label_until";
        }

        @Override
        public LocalDate at(LocalDate cutoff) {
            return horizon.after(gap.after(cutoff.plusDays(1)));
        }
    }
}
