package dev.quern.recipe;

import dev.quern.Position;
import java.time.DayOfWeek;
import java.time.LocalDate;
import java.time.temporal.TemporalAdjusters;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/** The cutoff dates a recipe asks for: a regular schedule or an explicit list. */
public sealed interface CutoffSpec {

    Position position();

    /** The cutoff dates in ascending order, without repeats. */
    List<LocalDate> dates();

    /** Every month end or week end from {@code from} to {@code to}, both included when they fall on one. */
    record Schedule(Every every, LocalDate from, LocalDate to, Position position) implements CutoffSpec {
        public Schedule {
            Objects.requireNonNull(every, "every");
            Objects.requireNonNull(from, "from");
            Objects.requireNonNull(to, "to");
            Objects.requireNonNull(position, "position");
        }

        @Override
        public List<LocalDate> dates() {
            List<LocalDate> out = new ArrayList<>();
            LocalDate d = switch (every) {
                case MONTH_END -> from.with(TemporalAdjusters.lastDayOfMonth());
                case WEEK_END -> from.with(TemporalAdjusters.nextOrSame(DayOfWeek.SUNDAY));
            };
            while (!d.isAfter(to)) {
                out.add(d);
                d = switch (every) {
                    case MONTH_END -> d.plusMonths(1).with(TemporalAdjusters.lastDayOfMonth());
                    case WEEK_END -> d.plusWeeks(1);
                };
            }
            return List.copyOf(out);
        }
    }

    /** Cutoffs named one by one. */
    record Dates(List<LocalDate> dates, Position position) implements CutoffSpec {
        public Dates {
            dates = List.copyOf(new java.util.TreeSet<>(dates));
            Objects.requireNonNull(position, "position");
        }
    }
}
