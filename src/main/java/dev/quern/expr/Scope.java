package dev.quern.expr;

import dev.quern.Suggestions;
import dev.quern.schema.ValueType;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import java.util.stream.Collectors;

/**
 * The names an expression may use where it is written: columns (qualified by a table or alias, or not) and
 * the row's cutoff. Names match exactly; a bare name matches a column of any qualifier and must be
 * unambiguous. The bare name {@code cutoff}, in any case, means the cutoff when the scope has one.
 */
public final class Scope {

    /** The name under which the cutoff is written, and its key in an evaluator's row. */
    public static final String CUTOFF = "cutoff";

    private final Map<String, Binding> byKey;
    /** The columns in the order they were declared, so that hints and listings are stable. */
    private final List<Binding> order;
    private final Optional<Binding> cutoff;

    private Scope(Map<String, Binding> byKey, Optional<Binding> cutoff) {
        this.byKey = Map.copyOf(byKey);
        this.order = List.copyOf(byKey.values());
        this.cutoff = cutoff;
    }

    public static Builder builder() {
        return new Builder();
    }

    /** The declared columns, in declaration order, without the cutoff. */
    public List<Binding> columns() {
        return order;
    }

    public Optional<Binding> cutoff() {
        return cutoff;
    }

    /** What a written name resolves to: the binding, or the message that says why it does not. */
    sealed interface Lookup {
        record Found(Binding binding) implements Lookup {
        }

        record Missing(String message) implements Lookup {
        }
    }

    Lookup lookup(Optional<String> qualifier, String name) {
        if (qualifier.isEmpty() && name.equalsIgnoreCase(CUTOFF) && cutoff.isPresent()) {
            return new Lookup.Found(cutoff.get());
        }
        if (qualifier.isPresent()) {
            return lookupQualified(qualifier.get(), name);
        }
        List<Binding> matches = order.stream().filter(b -> b.name().equals(name)).toList();
        if (matches.size() == 1) {
            return new Lookup.Found(matches.get(0));
        }
        if (matches.size() > 1) {
            String choices = matches.stream().map(Binding::key).collect(Collectors.joining(" or "));
            return new Lookup.Missing("'" + name + "' is a column of more than one table; write " + choices);
        }
        if (name.equalsIgnoreCase(CUTOFF)) {
            return new Lookup.Missing("the cutoff cannot be used here");
        }
        Set<String> names = order.stream().map(Binding::name).collect(Collectors.toCollection(LinkedHashSet::new));
        cutoff.ifPresent(c -> names.add(CUTOFF));
        return new Lookup.Missing("unknown column '" + name + "'" + Suggestions.hint(name, names));
    }

    private Lookup lookupQualified(String qualifier, String name) {
        Binding found = byKey.get(qualifier + "." + name);
        if (found != null) {
            return new Lookup.Found(found);
        }
        List<String> inQualifier = order.stream().filter(b -> b.qualifier().equals(qualifier))
                .map(Binding::name).toList();
        if (inQualifier.isEmpty()) {
            Set<String> qualifiers = order.stream().map(Binding::qualifier).filter(q -> !q.isEmpty())
                    .collect(Collectors.toCollection(LinkedHashSet::new));
            return new Lookup.Missing("unknown table '" + qualifier + "'" + Suggestions.hint(qualifier, qualifiers));
        }
        return new Lookup.Missing("unknown column '" + name + "' in " + qualifier
                + Suggestions.hint(name, inQualifier));
    }

    /** Collects the names of a scope; each qualifier and name pair may be declared once. */
    public static final class Builder {

        private final Map<String, Binding> byKey = new LinkedHashMap<>();
        private Binding cutoff;

        private Builder() {
        }

        /** A column written {@code qualifier.name}, or just {@code name} where that is unambiguous. */
        public Builder column(String qualifier, String name, ValueType type, Object handle) {
            Objects.requireNonNull(qualifier, "qualifier");
            if (qualifier.isEmpty()) {
                throw new IllegalArgumentException("a qualified column needs a qualifier; use column(name, ...)");
            }
            return add(new Binding(qualifier, name, type, handle));
        }

        /** A column written without a qualifier, such as a feature column in a derived column's formula. */
        public Builder column(String name, ValueType type, Object handle) {
            return add(new Binding("", name, type, handle));
        }

        /** The row's cutoff, written {@code cutoff}. */
        public Builder cutoff(ValueType type, Object handle) {
            this.cutoff = new Binding("", CUTOFF, type, handle);
            return this;
        }

        private Builder add(Binding binding) {
            if (byKey.putIfAbsent(binding.key(), binding) != null) {
                throw new IllegalArgumentException("declared twice in one scope: " + binding.key());
            }
            return this;
        }

        public Scope build() {
            return new Scope(new LinkedHashMap<>(byKey), Optional.ofNullable(cutoff));
        }
    }

    @Override
    public String toString() {
        List<String> keys = new ArrayList<>(byKey.keySet());
        cutoff.ifPresent(c -> keys.add(CUTOFF));
        return "Scope" + keys;
    }
}
