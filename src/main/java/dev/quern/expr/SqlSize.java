package dev.quern.expr;

import java.util.ArrayList;
import java.util.List;

/**
 * An upper bound on the number of parts the SQL for a checked tree has once written out, on whichever
 * engine writes the most. Most nodes write each child once, but a few must name an argument twice (sqrt
 * and least/greatest on PostgreSQL and DuckDB, a between or in that mixes dates with timestamps), and
 * nesting those doubles the text at every level: without a bound, forty nested sqrt calls would be a
 * trillion-part query.
 */
final class SqlSize {

    /** Far above any expression a person writes, far below what slows jOOQ or an engine's parser. */
    static final long LIMIT = 10_000;

    private SqlSize() {
    }

    static long of(Typed node) {
        if (node instanceof Typed.Constant || node instanceof Typed.Column) {
            return 1;
        }
        if (node instanceof Typed.Negate n) {
            return add(1, of(n.operand()));
        }
        if (node instanceof Typed.Not n) {
            return add(1, of(n.operand()));
        }
        if (node instanceof Typed.IsNull i) {
            return add(1, of(i.value()));
        }
        if (node instanceof Typed.Arithmetic a) {
            return add(1, add(of(a.left()), of(a.right())));
        }
        if (node instanceof Typed.Comparison c) {
            return add(1, add(of(c.left()), of(c.right())));
        }
        if (node instanceof Typed.Logical l) {
            return add(1, add(of(l.left()), of(l.right())));
        }
        if (node instanceof Typed.Between b) {
            // Mixing dates and timestamps, it is written as two comparisons, naming the value twice.
            long copies = Rendering.mixesDayAndTime(List.of(b.value(), b.low(), b.high())) ? 2 : 1;
            return add(1, add(times(copies, of(b.value())), add(of(b.low()), of(b.high()))));
        }
        if (node instanceof Typed.In in) {
            // Mixing dates and timestamps, it is written as one equality per item, naming the value each time.
            List<Typed> all = new ArrayList<>(in.items());
            all.add(in.value());
            long copies = Rendering.mixesDayAndTime(all) ? in.items().size() : 1;
            long size = times(copies, of(in.value()));
            for (Typed item : in.items()) {
                size = add(size, of(item));
            }
            return add(1, size);
        }
        Typed.Call call = (Typed.Call) node;
        long arguments = 0;
        for (Typed argument : call.arguments()) {
            arguments = add(arguments, of(argument));
        }
        boolean repeats = switch (call.function()) {
            case SQRT, LEAST, GREATEST -> true;
            default -> false;
        };
        return add(1, repeats ? times(2, arguments) : arguments);
    }

    /** Saturating, so that a hostile tree cannot wrap a long around to a small number. */
    private static long add(long a, long b) {
        return Math.min(LIMIT + 1, a + b);
    }

    private static long times(long a, long b) {
        return Math.min(LIMIT + 1, a * b);
    }
}
