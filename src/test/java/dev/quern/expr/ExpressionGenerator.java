package dev.quern.expr;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;

/**
 * Writes random well-typed expressions over the columns of {@link SqliteAgreementTest}'s table: whole and
 * decimal numbers, booleans, nulls, every operator, and the numeric functions (division and modulo by zero
 * included, logarithms and roots of negative numbers included). Seeded, so that a failure can be replayed.
 */
final class ExpressionGenerator {

    /** What the checker will make of a number expression: whole, decimal, or a bare null. */
    enum Kind { WHOLE, DECIMAL, NULL }

    record Num(String text, Kind kind) {
    }

    private static final String[] WHOLE_COLUMNS = {"i1", "i2"};
    private static final String[] DECIMAL_COLUMNS = {"d1", "d2"};
    private static final String[] BOOLEAN_COLUMNS = {"b1", "b2"};
    private static final String[] COMPARISONS = {"=", "!=", "<>", "<", "<=", ">", ">="};

    private final Random random;

    ExpressionGenerator(long seed) {
        this.random = new Random(seed);
    }

    /** A number expression that is not a bare null (the checker refuses a value that is always null). */
    Num number() {
        Num n;
        do {
            n = number(4);
        } while (n.kind() == Kind.NULL);
        return n;
    }

    /** A condition that is not a bare null, for the same reason. */
    String condition() {
        String text;
        do {
            text = bool(4);
        } while (text.equals("null"));
        return text;
    }

    private Num number(int depth) {
        if (depth == 0 || random.nextInt(4) == 0) {
            return leaf();
        }
        int d = depth - 1;
        return switch (random.nextInt(14)) {
            case 0, 1, 2 -> arithmetic(pick("+", "-", "*"), number(d), number(d));
            case 3, 4 -> new Num("(" + number(d).text() + " / " + number(d).text() + ")", Kind.DECIMAL);
            case 5 -> {
                Num a = whole(d);
                Num b = whole(d);
                yield new Num("(" + a.text() + " % " + b.text() + ")", Kind.WHOLE);
            }
            case 6 -> {
                Num a = number(d);
                yield new Num(pick("(-(", "abs((") + a.text() + "))", a.kind() == Kind.DECIMAL ? Kind.DECIMAL : Kind.WHOLE);
            }
            case 7 -> new Num(random.nextBoolean()
                    ? "round(" + number(d).text() + ")"
                    : "round(" + number(d).text() + ", " + random.nextInt(4) + ")", Kind.DECIMAL);
            case 8 -> new Num(pick("ln", "sqrt", "log10") + "(" + number(d).text() + ")", Kind.DECIMAL);
            case 9, 10 -> several(pick("coalesce", "least", "greatest"), d);
            case 11 -> {
                Num a = number(d);
                Num b = number(d);
                Kind kind = a.kind() != Kind.NULL ? a.kind() : b.kind();
                yield new Num("nullif(" + a.text() + ", " + b.text() + ")", kind);
            }
            default -> leaf();
        };
    }

    private Num leaf() {
        return switch (random.nextInt(9)) {
            case 0, 1 -> new Num(pick(WHOLE_COLUMNS), Kind.WHOLE);
            case 2, 3 -> new Num(pick(DECIMAL_COLUMNS), Kind.DECIMAL);
            case 4, 5 -> new Num(String.valueOf(random.nextInt(13) - 3), Kind.WHOLE);
            case 6, 7 -> new Num(pick("2.5", "0.5", "0.125", "1e-3", "0.0", "3.75", "1.1", "-0.3", "2.675"), Kind.DECIMAL);
            default -> new Num("null", Kind.NULL);
        };
    }

    /** A whole-number expression, for '%': columns, literals and whole arithmetic only. */
    private Num whole(int depth) {
        if (depth == 0 || random.nextInt(3) == 0) {
            return random.nextBoolean() ? new Num(pick(WHOLE_COLUMNS), Kind.WHOLE)
                    : new Num(String.valueOf(random.nextInt(9) - 2), Kind.WHOLE);
        }
        return arithmetic(pick("+", "-", "*"), whole(depth - 1), whole(depth - 1));
    }

    private Num arithmetic(String operator, Num a, Num b) {
        boolean whole = a.kind() != Kind.DECIMAL && b.kind() != Kind.DECIMAL;
        return new Num("(" + a.text() + " " + operator + " " + b.text() + ")", whole ? Kind.WHOLE : Kind.DECIMAL);
    }

    private Num several(String function, int depth) {
        List<Num> arguments = new ArrayList<>();
        int count = 2 + random.nextInt(2);
        for (int i = 0; i < count; i++) {
            arguments.add(number(depth));
        }
        Kind kind = Kind.NULL;
        for (Num a : arguments) {
            if (a.kind() == Kind.DECIMAL) {
                kind = Kind.DECIMAL;
            } else if (a.kind() == Kind.WHOLE && kind == Kind.NULL) {
                kind = Kind.WHOLE;
            }
        }
        return new Num(function + "(" + String.join(", ", arguments.stream().map(Num::text).toList()) + ")", kind);
    }

    private String bool(int depth) {
        if (depth == 0 || random.nextInt(5) == 0) {
            return boolLeaf(depth);
        }
        int d = depth - 1;
        return switch (random.nextInt(10)) {
            case 0, 1 -> "(" + bool(d) + " " + pick("and", "or", "AND", "Or") + " " + bool(d) + ")";
            case 2 -> "(not " + bool(d) + ")";
            case 3, 4 -> "(" + number(d).text() + " " + pick(COMPARISONS) + " " + number(d).text() + ")";
            case 5 -> "(" + number(d).text() + pick(" between ", " not between ") + number(d).text() + " and "
                    + number(d).text() + ")";
            case 6 -> {
                List<String> items = new ArrayList<>();
                int count = 1 + random.nextInt(3);
                for (int i = 0; i < count; i++) {
                    items.add(number(d).text());
                }
                yield "(" + number(d).text() + pick(" in (", " not in (") + String.join(", ", items) + "))";
            }
            case 7 -> "(" + (random.nextBoolean() ? number(d).text() : bool(d)) + pick(" is null", " is not null") + ")";
            case 8 -> "(" + bool(d) + " " + pick("=", "!=", "<") + " " + bool(d) + ")";
            default -> boolLeaf(d);
        };
    }

    private String boolLeaf(int depth) {
        return switch (random.nextInt(5)) {
            case 0, 1 -> pick(BOOLEAN_COLUMNS);
            case 2 -> pick("true", "false", "null", "TRUE");
            default -> "(" + number(Math.min(depth, 1)).text() + " " + pick(COMPARISONS) + " "
                    + number(Math.min(depth, 1)).text() + ")";
        };
    }

    @SafeVarargs
    private <T> T pick(T... choices) {
        return choices[random.nextInt(choices.length)];
    }

    /** Random rows: small whole numbers around zero, decimals with a few or many digits, a fifth null. */
    static List<List<Object>> rows(long seed, int count) {
        Random random = new Random(seed);
        List<List<Object>> rows = new ArrayList<>();
        for (int id = 1; id <= count; id++) {
            List<Object> row = new ArrayList<>();
            row.add(id);
            row.add(maybeNull(random, (long) (random.nextInt(11) - 4)));
            row.add(maybeNull(random, (long) (random.nextInt(7) - 2)));
            row.add(maybeNull(random, decimal(random)));
            row.add(maybeNull(random, decimal(random)));
            row.add(maybeNull(random, random.nextInt(2)));
            row.add(maybeNull(random, random.nextInt(2)));
            rows.add(row);
        }
        return rows;
    }

    private static double decimal(Random random) {
        return switch (random.nextInt(4)) {
            case 0 -> 0.0;
            case 1 -> Math.round((random.nextDouble() * 40 - 20) * 100) / 100.0;
            case 2 -> random.nextDouble() * 1000 - 500;
            default -> Double.parseDouble(String.format(Locale.ROOT, "%.3f", random.nextDouble() * 10 - 5));
        };
    }

    private static Object maybeNull(Random random, Object value) {
        return random.nextInt(5) == 0 ? null : value;
    }
}
