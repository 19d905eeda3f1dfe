package dev.quern.expr;

import dev.quern.Diagnostics;
import dev.quern.Suggestions;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;
import java.util.function.Predicate;

/**
 * Resolves every name against the scope and gives every node a type, reporting each mistake it finds
 * (not only the first) before any SQL exists. A node that cannot be typed at all (an unknown name or
 * function) is marked broken, so that the nodes above it do not repeat the same mistake in other words.
 */
final class TypeChecker {

    /** round's digits: SQLite and PostgreSQL disagree on negative digits, and doubles hold about 15. */
    private static final long MOST_DIGITS = 15;

    private final SourceText source;
    private final Scope scope;
    private final Diagnostics out;
    private final Set<Binding> columns = new LinkedHashSet<>();
    private boolean usesCutoff;
    private boolean failed;

    TypeChecker(SourceText source, Scope scope, Diagnostics out) {
        this.source = source;
        this.scope = scope;
        this.out = out;
    }

    /** The result of checking one node. */
    private record Checked(Typed node, boolean broken) {
        ExprType type() {
            return node.type();
        }

        static Checked unusable() {
            return new Checked(new Typed.Constant(null, ExprType.NULL), true);
        }
    }

    Optional<Typed> check(Syntax root, Expect expect) {
        Checked result = check(root);
        if (!failed && SqlSize.of(result.node()) > SqlSize.LIMIT) {
            error(root.start(), "the expression is too large to write as SQL: sqrt, least and greatest repeat"
                    + " their arguments on some engines, so nesting them doubles it at every level");
        } else if (!result.broken()) {
            if (result.type() == ExprType.NULL) {
                error(root.start(), "the expression is always null");
            } else if (expect == Expect.CONDITION && result.type() != ExprType.BOOLEAN) {
                error(root.start(), "expected a condition (true or false), but " + quote(root) + " is "
                        + result.type().noun());
            }
        }
        return failed ? Optional.empty() : Optional.of(result.node());
    }

    /** The columns the expression reads, in order of first use; the cutoff is not among them. */
    List<Binding> columns() {
        return List.copyOf(columns);
    }

    boolean usesCutoff() {
        return usesCutoff;
    }

    private Checked check(Syntax node) {
        if (node instanceof Syntax.NumberLiteral n) {
            return ok(new Typed.Constant(n.value(), n.value() instanceof Long ? ExprType.INTEGER : ExprType.DECIMAL));
        }
        if (node instanceof Syntax.TextLiteral t) {
            return ok(new Typed.Constant(t.value(), ExprType.TEXT));
        }
        if (node instanceof Syntax.BooleanLiteral b) {
            return ok(new Typed.Constant(b.value(), ExprType.BOOLEAN));
        }
        if (node instanceof Syntax.NullLiteral) {
            return ok(new Typed.Constant(null, ExprType.NULL));
        }
        if (node instanceof Syntax.DateLiteral d) {
            return ok(new Typed.Constant(d.value(), ExprType.DATE));
        }
        if (node instanceof Syntax.TimestampLiteral t) {
            return ok(new Typed.Constant(t.value(), ExprType.TIMESTAMP));
        }
        if (node instanceof Syntax.Group g) {
            return check(g.inner());
        }
        if (node instanceof Syntax.Name n) {
            return name(n);
        }
        if (node instanceof Syntax.Negate n) {
            return negate(n);
        }
        if (node instanceof Syntax.Not n) {
            Checked operand = check(n.operand());
            requireBoolean("'not' needs a boolean", n.operand(), operand);
            return ok(new Typed.Not(settle(operand.node(), ExprType.BOOLEAN)));
        }
        if (node instanceof Syntax.Binary b) {
            if (b.operator().isArithmetic()) {
                return arithmetic(b);
            }
            if (b.operator().isComparison()) {
                return comparison(b);
            }
            return logical(b);
        }
        if (node instanceof Syntax.Between b) {
            return between(b);
        }
        if (node instanceof Syntax.In in) {
            return in(in);
        }
        if (node instanceof Syntax.IsNull i) {
            return ok(new Typed.IsNull(check(i.value()).node(), i.negated()));
        }
        if (node instanceof Syntax.Call c) {
            return call(c);
        }
        throw new IllegalStateException("unknown syntax node " + node);
    }

    private Checked name(Syntax.Name n) {
        Scope.Lookup lookup = scope.lookup(n.qualifier(), n.name());
        if (lookup instanceof Scope.Lookup.Missing missing) {
            error(n.start(), missing.message());
            return Checked.unusable();
        }
        Binding binding = ((Scope.Lookup.Found) lookup).binding();
        Optional<ExprType> type = ExprType.of(binding.type());
        if (type.isEmpty()) {
            error(n.start(), "column " + binding.key() + " has a type that expressions cannot use ("
                    + binding.type().label() + ")");
            return Checked.unusable();
        }
        if (scope.cutoff().filter(c -> c == binding).isPresent()) {
            usesCutoff = true;
        } else {
            columns.add(binding);
        }
        return ok(new Typed.Column(binding, type.get()));
    }

    private Checked negate(Syntax.Negate n) {
        Checked operand = check(n.operand());
        if (!operand.broken() && !isNumberOrNull(operand.type())) {
            error(n.operand().start(), "'-' needs a number, but " + quote(n.operand()) + " is " + operand.type().noun());
        }
        ExprType type = operand.type() == ExprType.DECIMAL ? ExprType.DECIMAL : ExprType.INTEGER;
        return ok(new Typed.Negate(settle(operand.node(), type), type));
    }

    private Checked arithmetic(Syntax.Binary b) {
        Checked left = check(b.left());
        Checked right = check(b.right());
        boolean whole = b.operator() == Operator.MODULO;
        for (var side : List.of(new Side(b.left(), left), new Side(b.right(), right))) {
            ExprType t = side.checked().type();
            if (side.checked().broken()) {
                continue;
            }
            if (whole && t != ExprType.INTEGER && t != ExprType.NULL) {
                error(side.syntax().start(), "'" + b.symbol() + "' needs whole numbers, but " + quote(side.syntax())
                        + " is " + (t == ExprType.DECIMAL ? "a decimal number" : t.noun()));
            } else if (!whole && !isNumberOrNull(t)) {
                String hint = t.isTemporal() && (b.operator() == Operator.PLUS || b.operator() == Operator.MINUS)
                        ? " (days_between(a, b) counts the days from a to b)" : "";
                error(side.syntax().start(), "'" + b.symbol() + "' needs numbers, but " + quote(side.syntax())
                        + " is " + t.noun() + hint);
            }
        }
        ExprType type;
        if (b.operator() == Operator.DIVIDE) {
            type = ExprType.DECIMAL;
        } else if (whole || (wholeOrNull(left.type()) && wholeOrNull(right.type()))) {
            type = ExprType.INTEGER;
        } else {
            type = ExprType.DECIMAL;
        }
        return ok(new Typed.Arithmetic(b.operator(), settle(left.node(), type), settle(right.node(), type), type));
    }

    private record Side(Syntax syntax, Checked checked) {
    }

    private Checked logical(Syntax.Binary b) {
        Checked left = check(b.left());
        Checked right = check(b.right());
        String what = "'" + b.symbol().toLowerCase(Locale.ROOT) + "' needs booleans";
        requireBoolean(what, b.left(), left);
        requireBoolean(what, b.right(), right);
        return ok(new Typed.Logical(b.operator(), settle(left.node(), ExprType.BOOLEAN),
                settle(right.node(), ExprType.BOOLEAN)));
    }

    private Checked comparison(Syntax.Binary b) {
        Checked left = check(b.left());
        Checked right = check(b.right());
        requireComparable("'" + b.symbol() + "'", b.at(), b.left(), left, b.right(), right);
        return ok(new Typed.Comparison(b.operator(), settle(left.node(), right.type()),
                settle(right.node(), left.type())));
    }

    private Checked between(Syntax.Between b) {
        Checked value = check(b.value());
        Checked low = check(b.low());
        Checked high = check(b.high());
        requireComparable("'between'", b.low().start(), b.value(), value, b.low(), low);
        requireComparable("'between'", b.high().start(), b.value(), value, b.high(), high);
        ExprType known = firstKnown(List.of(value, low, high));
        return ok(new Typed.Between(settle(value.node(), known), settle(low.node(), known), settle(high.node(), known),
                b.negated()));
    }

    private Checked in(Syntax.In in) {
        Checked value = check(in.value());
        List<Checked> items = new ArrayList<>();
        for (Syntax item : in.items()) {
            Checked checked = check(item);
            requireComparable("'in'", item.start(), in.value(), value, item, checked);
            items.add(checked);
        }
        List<Checked> all = new ArrayList<>(items);
        all.add(0, value);
        ExprType known = firstKnown(all);
        return ok(new Typed.In(settle(value.node(), known),
                items.stream().map(i -> settle(i.node(), known)).toList(), in.negated()));
    }

    private Checked call(Syntax.Call c) {
        List<Checked> arguments = c.arguments().stream().map(this::check).toList();
        Optional<BuiltIn> found = BuiltIn.named(c.function());
        if (found.isEmpty()) {
            error(c.start(), "unknown function '" + c.function() + "'" + Suggestions.hint(c.function(), BuiltIn.names()));
            return Checked.unusable();
        }
        BuiltIn function = found.get();
        if (!function.accepts(arguments.size())) {
            error(c.start(), function.arity() + ", but got " + arguments.size());
            return Checked.unusable();
        }
        return switch (function) {
            case ABS -> {
                need(function, "a number", ExprType::isNumber, c, arguments, 0);
                ExprType type = arguments.get(0).type() == ExprType.DECIMAL ? ExprType.DECIMAL : ExprType.INTEGER;
                yield call(function, type, List.of(settle(arguments.get(0).node(), type)));
            }
            case ROUND -> round(c, arguments);
            case LN, LOG10, EXP, SQRT -> {
                need(function, "a number", ExprType::isNumber, c, arguments, 0);
                yield call(function, ExprType.DECIMAL, List.of(settle(arguments.get(0).node(), ExprType.DECIMAL)));
            }
            case COALESCE, NULLIF, LEAST, GREATEST -> oneType(function, c, arguments);
            case LOWER, UPPER, LENGTH -> {
                need(function, "text", t -> t == ExprType.TEXT, c, arguments, 0);
                ExprType type = function == BuiltIn.LENGTH ? ExprType.INTEGER : ExprType.TEXT;
                yield call(function, type, List.of(settle(arguments.get(0).node(), ExprType.TEXT)));
            }
            case YEAR, MONTH, DAY_OF_WEEK -> {
                need(function, "a date or a timestamp", ExprType::isTemporal, c, arguments, 0);
                yield call(function, ExprType.INTEGER, List.of(settle(arguments.get(0).node(), ExprType.DATE)));
            }
            case HOUR -> {
                need(function, "a timestamp", t -> t == ExprType.TIMESTAMP, c, arguments, 0);
                yield call(function, ExprType.INTEGER, List.of(settle(arguments.get(0).node(), ExprType.TIMESTAMP)));
            }
            case DAYS_BETWEEN -> {
                need(function, "dates or timestamps", ExprType::isTemporal, c, arguments, 0);
                need(function, "dates or timestamps", ExprType::isTemporal, c, arguments, 1);
                yield call(function, ExprType.INTEGER, arguments.stream()
                        .map(a -> settle(a.node(), ExprType.DATE)).toList());
            }
        };
    }

    private Checked round(Syntax.Call c, List<Checked> arguments) {
        need(BuiltIn.ROUND, "a number", ExprType::isNumber, c, arguments, 0);
        List<Typed> typed = new ArrayList<>();
        typed.add(settle(arguments.get(0).node(), ExprType.DECIMAL));
        if (arguments.size() == 2) {
            Syntax digits = c.arguments().get(1);
            if (digits instanceof Syntax.NumberLiteral n && n.value() instanceof Long d && d >= 0 && d <= MOST_DIGITS) {
                typed.add(new Typed.Constant(d, ExprType.INTEGER));
            } else {
                error(digits.start(), "the digits of round must be a whole number from 0 to " + MOST_DIGITS
                        + ", like round(x, 2)");
            }
        }
        return call(BuiltIn.ROUND, ExprType.DECIMAL, typed);
    }

    /** coalesce, nullif, least, greatest: all arguments share one type, which is the result's. */
    private Checked oneType(BuiltIn function, Syntax.Call c, List<Checked> arguments) {
        ExprType common = ExprType.NULL;
        int setBy = -1;
        for (int i = 0; i < arguments.size(); i++) {
            Checked argument = arguments.get(i);
            if (argument.broken()) {
                continue;
            }
            Optional<ExprType> shared = ExprType.common(common, argument.type());
            if (shared.isEmpty()) {
                Syntax first = c.arguments().get(setBy);
                Syntax here = c.arguments().get(i);
                error(here.start(), function.written() + " needs arguments of one type, but " + quote(first) + " is "
                        + arguments.get(setBy).type().noun() + " and " + quote(here) + " is " + argument.type().noun());
                continue;
            }
            if (common == ExprType.NULL && shared.get() != ExprType.NULL) {
                setBy = i;
            }
            common = shared.get();
        }
        if (common == ExprType.NULL) {
            // Every argument is null: so is the call, and a plain null can take the type of its context.
            return ok(new Typed.Constant(null, ExprType.NULL));
        }
        ExprType settled = common;
        List<Typed> typed = arguments.stream().map(a -> settle(a.node(), settled)).toList();
        ExprType first = arguments.get(0).type();
        ExprType type = function == BuiltIn.NULLIF && first != ExprType.NULL ? first : common;
        return call(function, type, typed);
    }

    private void need(BuiltIn function, String what, Predicate<ExprType> fits, Syntax.Call c,
                      List<Checked> arguments, int index) {
        Checked argument = arguments.get(index);
        if (!argument.broken() && argument.type() != ExprType.NULL && !fits.test(argument.type())) {
            Syntax syntax = c.arguments().get(index);
            error(syntax.start(), function.written() + " needs " + what + ", but " + quote(syntax) + " is "
                    + argument.type().noun());
        }
    }

    private void requireBoolean(String what, Syntax syntax, Checked checked) {
        if (!checked.broken() && checked.type() != ExprType.BOOLEAN && checked.type() != ExprType.NULL) {
            error(syntax.start(), what + ", but " + quote(syntax) + " is " + checked.type().noun());
        }
    }

    private void requireComparable(String what, int at, Syntax leftSyntax, Checked left, Syntax rightSyntax,
                                   Checked right) {
        if (left.broken() || right.broken() || left.type().comparableWith(right.type())) {
            return;
        }
        boolean textForTime = (left.type().isTemporal() && right.type() == ExprType.TEXT)
                || (right.type().isTemporal() && left.type() == ExprType.TEXT);
        String hint = textForTime ? " (write date 'YYYY-MM-DD' for a date)" : "";
        error(at, what + " cannot compare " + quote(leftSyntax) + " (" + left.type().noun() + ") with "
                + quote(rightSyntax) + " (" + right.type().noun() + ")" + hint);
    }

    private static Checked call(BuiltIn function, ExprType type, List<Typed> arguments) {
        return ok(new Typed.Call(function, arguments, type));
    }

    private static ExprType firstKnown(List<Checked> checked) {
        return checked.stream().map(Checked::type).filter(t -> t != ExprType.NULL).findFirst().orElse(ExprType.NULL);
    }

    /** A bare null takes the type its context expects, so that engines that type nulls (PostgreSQL) can. */
    private static Typed settle(Typed node, ExprType type) {
        if (type != ExprType.NULL && node instanceof Typed.Constant c && c.type() == ExprType.NULL) {
            return new Typed.Constant(null, type);
        }
        return node;
    }

    private static boolean isNumberOrNull(ExprType type) {
        return type.isNumber() || type == ExprType.NULL;
    }

    private static boolean wholeOrNull(ExprType type) {
        return type == ExprType.INTEGER || type == ExprType.NULL;
    }

    private static Checked ok(Typed node) {
        return new Checked(node, false);
    }

    private String quote(Syntax node) {
        return source.slice(node.start(), node.end());
    }

    private void error(int offset, String message) {
        failed = true;
        out.error(source.positionAt(offset), source.pointAt(offset, message));
    }
}
