package dev.quern.recipe;

import dev.quern.Position;
import java.time.LocalDate;
import java.util.Objects;

/**
 * A length of time written as {@code 30d}, {@code 12w}, {@code 6m} or {@code 1y}: a window, a gap or a
 * label horizon. Lengths are measured between day boundaries, so they are exact in days, weeks and
 * calendar months alike.
 */
public record Span(int amount, WindowUnit unit, Position position) {

    public Span {
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(position, "position");
        if (amount < 0) {
            throw new IllegalArgumentException("a span cannot be negative: " + amount);
        }
    }

    public static Span days(int n) {
        return new Span(n, WindowUnit.DAY, Position.NONE);
    }

    /** The spelling used in recipes and in generated column names: {@code 30d}. */
    public String label() {
        return amount + String.valueOf(unit.suffix());
    }

    /** The day boundary this span before {@code boundary}. */
    public LocalDate before(LocalDate boundary) {
        return switch (unit) {
            case DAY -> boundary.minusDays(amount);
            case WEEK -> boundary.minusWeeks(amount);
            case MONTH -> boundary.minusMonths(amount);
            case YEAR -> boundary.minusYears(amount);
        };
    }

    /** The day boundary this span after {@code boundary}. */
    public LocalDate after(LocalDate boundary) {
        return switch (unit) {
            case DAY -> boundary.plusDays(amount);
            case WEEK -> boundary.plusWeeks(amount);
            case MONTH -> boundary.plusMonths(amount);
            case YEAR -> boundary.plusYears(amount);
        };
    }

    /** Same length, ignoring where it was written. */
    public boolean sameLength(Span other) {
        return amount == other.amount && unit == other.unit;
    }

    @Override
    public String toString() {
        return label();
    }
}
