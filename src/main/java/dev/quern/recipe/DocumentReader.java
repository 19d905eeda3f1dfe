package dev.quern.recipe;

import static dev.quern.recipe.Values.forKey;
import static dev.quern.recipe.Values.in;

import dev.quern.Diagnostics;
import dev.quern.Suggestions;
import java.time.DateTimeException;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Pattern;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;

/**
 * Reads the composed YAML tree of one recipe into the model, section by section. A section or item with an
 * error is reported and skipped, and reading goes on, so that one run reports every mistake of the file;
 * the model is built only when there was none.
 */
final class DocumentReader {

    static final List<String> TOP_KEYS =
            List.of("recipe", "source", "time-zone", "entity", "cutoffs", "tables", "rules", "label", "features",
                    "encode", "split", "audit");
    static final List<String> ENTITY_KEYS = List.of("table", "key", "since", "until", "where");
    static final List<String> CUTOFF_KEYS = List.of("every", "from", "to", "dates");
    static final List<String> TABLE_KEYS =
            List.of("key", "time", "history", "links", "identifiers", "updated", "sensitive", "filled");
    static final List<String> HISTORY_KEYS = List.of("from", "to");
    static final List<String> LABEL_KEYS = List.of("name", "from", "horizon", "gap", "value", "where");
    static final List<String> BLOCK_KEYS = List.of("from", "windows", "measures", "prefix", "where");
    static final List<String> DERIVED_KEYS = List.of("name", "expr");
    static final List<String> MEASURE_KEYS = List.of("measure", "name");
    static final List<String> LOOKUP_KEYS = List.of("lookup", "name");

    private static final Pattern RECIPE_NAME = Pattern.compile("[A-Za-z0-9_-]+");

    private final Values values;
    private final Diagnostics diagnostics;
    private final References references;

    DocumentReader(String file, Diagnostics diagnostics) {
        this.values = new Values(file, diagnostics);
        this.diagnostics = diagnostics;
        this.references = new References(diagnostics);
    }

    /** The recipe, or empty when the file had an error (reported to the diagnostics). */
    Optional<Recipe> read(Node root, String text) {
        Optional<MappingReader> top = values.mapping(root, "at the top of the recipe", "the recipe", TOP_KEYS);
        if (top.isEmpty()) {
            return Optional.empty();
        }
        MappingReader m = top.get();
        Optional<Name> name = m.required("recipe", "a name for the build, e.g. member-churn")
                .flatMap(this::recipeName);
        Optional<Name> source = m.required("source", "the JDBC URL of the source, e.g. jdbc:sqlite:shop.sqlite")
                .flatMap(this::source);
        Optional<ZoneId> timeZone = m.optional("time-zone").flatMap(this::timeZone);
        Optional<EntitySpec> entity = m.required("entity", "the table and key of what one row describes")
                .flatMap(this::entity);
        Optional<CutoffSpec> cutoffs = m.required("cutoffs", "'every' with 'from' and 'to', or 'dates'")
                .flatMap(this::cutoffs);
        Optional<Map<String, TableSpec>> tables =
                m.required("tables", "the tables the recipe reads, with their keys, times and links")
                        .flatMap(this::tables);
        Optional<List<RuleSpec>> rules = m.optional("rules").map(n -> new RuleReader(values, references).rules(n))
                .orElse(Optional.of(List.of()));
        Optional<LabelSpec> label = m.optional("label").flatMap(this::label);
        Optional<List<FeatureSpec>> features = m.required("features", "the list of features to compute")
                .flatMap(this::features);
        ModellingReader modelling = new ModellingReader(values);
        Optional<List<EncodingSpec>> encodings = m.optional("encode").map(modelling::encodings)
                .orElse(Optional.of(List.of()));
        Optional<Optional<SplitSpec>> split = m.optional("split").map(n -> modelling.split(n).map(Optional::of))
                .orElse(Optional.of(Optional.empty()));
        Optional<AuditSpec> audit = m.optional("audit").map(modelling::audit).orElse(Optional.of(AuditSpec.DEFAULT));
        references.check();
        if (!diagnostics.isEmpty()) {
            return Optional.empty();
        }
        return Optional.of(new Recipe(values.file(), text, name.orElseThrow(), source.orElseThrow(), timeZone,
                entity.orElseThrow(), cutoffs.orElseThrow(), tables.orElseThrow(), rules.orElseThrow(), label,
                features.orElseThrow(), encodings.orElseThrow(), split.orElseThrow(), audit.orElseThrow()));
    }

    private Optional<Name> recipeName(Node node) {
        return values.scalar(node, "a name", forKey("recipe")).flatMap(s -> {
            if (RECIPE_NAME.matcher(s.getValue()).matches()) {
                return Optional.of(new Name(s.getValue(), values.start(s)));
            }
            values.error(s, "recipe name " + Names.quote(s.getValue()) + " may hold only letters, digits, - and _");
            return Optional.empty();
        });
    }

    /** Kept as written: environment variables are put in by a later stage, so that no secret is stored. */
    private Optional<Name> source(Node node) {
        return values.scalar(node, "a JDBC URL", forKey("source")).flatMap(s -> {
            if (s.getValue().isBlank()) {
                values.error(s, "source is empty: write a JDBC URL, e.g. jdbc:sqlite:shop.sqlite");
                return Optional.empty();
            }
            return Optional.of(new Name(s.getValue(), values.start(s)));
        });
    }

    private Optional<ZoneId> timeZone(Node node) {
        return values.scalar(node, "a time zone such as Europe/Amsterdam", forKey("time-zone")).flatMap(s -> {
            String text = s.getValue();
            try {
                return Optional.of(ZoneId.of(text));
            } catch (DateTimeException e) {
                String hint = Suggestions.hint(text, new TreeSet<>(ZoneId.getAvailableZoneIds()));
                diagnostics.error(values.start(s), "unknown time zone " + Names.quote(text)
                        + (hint.isEmpty() ? ": write an IANA zone id such as Europe/Amsterdam" : hint));
                return Optional.empty();
            }
        });
    }

    // ---------------------------------------------------------------------------------------- entity

    private Optional<EntitySpec> entity(Node node) {
        int errors = values.errorCount();
        Optional<MappingReader> read = values.mapping(node, forKey("entity"), "entity", ENTITY_KEYS);
        if (read.isEmpty()) {
            return Optional.empty();
        }
        MappingReader m = read.get();
        Optional<Name> table = m.required("table", "the table of what one row describes, e.g. members")
                .flatMap(n -> values.name(n, "table", forKey("table")));
        Optional<Name> key = m.required("key", "the column that identifies one row of "
                        + table.map(Name::text).orElse("the entity table"))
                .flatMap(n -> values.name(n, "column", forKey("key")));
        Optional<Name> since = m.optional("since").flatMap(n -> values.name(n, "column", forKey("since")));
        List<Name> until = m.optional("until").map(this::until).orElse(List.of());
        Optional<Expression> where = m.optional("where").flatMap(n -> expression(n, "where"));
        table.ifPresent(t -> references.entity(t, key));
        until.forEach(references::until);
        if (values.errorCount() > errors) {
            return Optional.empty();
        }
        return Optional.of(new EntitySpec(table.orElseThrow(), key.orElseThrow(), since, until, where,
                m.position()));
    }

    /** One table or a list of tables. */
    private List<Name> until(Node node) {
        if (node instanceof ScalarNode && !YamlNodes.isNull(node)) {
            return values.name(node, "table", forKey("until")).stream().toList();
        }
        Optional<List<Node>> items = values.list(node, "a table or a list of tables", forKey("until"));
        List<Name> out = new ArrayList<>();
        items.ifPresent(list -> list.forEach(item -> values.name(item, "table", in("until")).ifPresent(out::add)));
        return out;
    }

    // ---------------------------------------------------------------------------------------- cutoffs

    private Optional<CutoffSpec> cutoffs(Node node) {
        int errors = values.errorCount();
        Optional<MappingReader> read = values.mapping(node, forKey("cutoffs"), "cutoffs", CUTOFF_KEYS);
        if (read.isEmpty()) {
            return Optional.empty();
        }
        MappingReader m = read.get();
        boolean schedule = m.has("every") || m.has("from") || m.has("to");
        if (schedule && m.has("dates")) {
            diagnostics.error(m.position(), "cutoffs take either 'every' with 'from' and 'to', or 'dates', not both");
            return Optional.empty();
        }
        if (m.has("dates")) {
            return cutoffDates(m);
        }
        if (!schedule) {
            diagnostics.error(m.position(), "cutoffs need 'every' with 'from' and 'to', or 'dates'");
            return Optional.empty();
        }
        Optional<Every> every = m.required("every", "month-end or week-end").flatMap(this::every);
        Optional<Node> fromNode = m.required("from", "the first cutoff date, YYYY-MM-DD");
        Optional<LocalDate> from = fromNode.flatMap(n -> values.date(n, forKey("from")));
        Optional<LocalDate> to = m.required("to", "the last cutoff date, YYYY-MM-DD")
                .flatMap(n -> values.date(n, forKey("to")));
        if (values.errorCount() > errors) {
            return Optional.empty();
        }
        if (from.get().isAfter(to.get())) {
            values.error(fromNode.get(), "cutoffs: 'from' " + from.get() + " is after 'to' " + to.get()
                    + "; put the earlier date in 'from'");
            return Optional.empty();
        }
        CutoffSpec.Schedule spec = new CutoffSpec.Schedule(every.get(), from.get(), to.get(), m.position());
        if (spec.dates().isEmpty()) {
            diagnostics.error(m.position(), "cutoffs: no " + every.get().spelling() + " falls between " + from.get()
                    + " and " + to.get() + ": widen 'from' and 'to'");
            return Optional.empty();
        }
        return Optional.of(spec);
    }

    private Optional<CutoffSpec> cutoffDates(MappingReader m) {
        Node node = m.optional("dates").orElseThrow();
        Optional<List<Node>> items = values.list(node, "a list of dates", forKey("dates"));
        if (items.isEmpty()) {
            return Optional.empty();
        }
        if (items.get().isEmpty()) {
            values.error(node, "cutoffs 'dates' is empty: list at least one date, e.g. [2025-03-31]");
            return Optional.empty();
        }
        int errors = values.errorCount();
        List<LocalDate> dates = new ArrayList<>();
        for (Node item : items.get()) {
            values.date(item, in("dates")).ifPresent(dates::add);
        }
        if (values.errorCount() > errors) {
            return Optional.empty();
        }
        return Optional.of(new CutoffSpec.Dates(dates, m.position()));
    }

    private Optional<Every> every(Node node) {
        return values.text(node, "month-end or week-end", forKey("every")).flatMap(text -> {
            for (Every every : Every.values()) {
                if (every.spelling().equals(text)) {
                    return Optional.of(every);
                }
            }
            List<String> known = Arrays.stream(Every.values()).map(Every::spelling).toList();
            values.error(node, "unknown schedule " + Names.quote(text) + Suggestions.hint(text, known)
                    + ": write month-end or week-end");
            return Optional.empty();
        });
    }

    // ---------------------------------------------------------------------------------------- tables

    private Optional<Map<String, TableSpec>> tables(Node node) {
        Optional<MappingReader> read = values.mapping(node, forKey("tables"), "tables", List.of());
        if (read.isEmpty()) {
            return Optional.empty();
        }
        references.tablesRead();
        Map<String, TableSpec> out = new LinkedHashMap<>();
        for (NodeTuple entry : read.get().entries()) {
            ScalarNode key = (ScalarNode) entry.getKeyNode();
            Optional<Name> name = Names.plain(key.getValue(), values.start(key), "table", diagnostics);
            if (name.isEmpty()) {
                continue;
            }
            int errors = values.errorCount();
            Optional<TableSpec> spec = table(name.get(), entry.getValueNode());
            if (spec.isPresent()) {
                out.put(name.get().text(), spec.get());
                references.table(spec.get(), values.errorCount() == errors);
            } else {
                references.brokenTable(name.get());
            }
        }
        return Optional.of(out);
    }

    /** A table's description; an empty one ({@code stations:}) declares the table and nothing more. */
    private Optional<TableSpec> table(Name name, Node node) {
        if (YamlNodes.isNull(node)) {
            return Optional.of(new TableSpec(name, Optional.empty(), Optional.empty(), Optional.empty(), List.of(),
                    List.of(), name.position()));
        }
        String owner = "table " + name.text();
        Optional<MappingReader> read = values.mapping(node, forKey(name.text()), owner, TABLE_KEYS);
        if (read.isEmpty()) {
            return Optional.empty();
        }
        MappingReader m = read.get();
        Optional<Name> key = m.optional("key").flatMap(n -> values.name(n, "column", forKey("key")));
        Optional<Name> time = m.optional("time").flatMap(n -> values.name(n, "column", forKey("time")));
        Optional<History> history = m.optional("history").flatMap(n -> history(name, n));
        if (m.has("time") && m.has("history")) {
            diagnostics.error(m.keyPosition("history"), owner + " has both 'time' and 'history': an event table"
                    + " has a 'time', a table of rows in force from/to has a 'history'; keep one");
        }
        List<Link> links = m.optional("links").map(n -> links(name, n)).orElse(List.of());
        List<Name> identifiers = m.optional("identifiers").map(n -> columns(n, "identifiers")).orElse(List.of());
        Optional<Name> updated = m.optional("updated").flatMap(n -> values.name(n, "column", forKey("updated")));
        List<Name> sensitive = m.optional("sensitive").map(n -> columns(n, "sensitive")).orElse(List.of());
        List<FilledAt> filled = m.optional("filled").map(n -> filled(name, n)).orElse(List.of());
        return Optional.of(new TableSpec(name, key, time, history, links, identifiers, updated, sensitive, filled,
                name.position()));
    }

    private Optional<History> history(Name table, Node node) {
        Optional<MappingReader> read =
                values.mapping(node, forKey("history"), "history of table " + table.text(), HISTORY_KEYS);
        if (read.isEmpty()) {
            return Optional.empty();
        }
        MappingReader m = read.get();
        Optional<Name> from = m.required("from", "the column from which a row is in force")
                .flatMap(n -> values.name(n, "column", forKey("from")));
        Optional<Name> to = m.required("to", "the column from which a row is no longer in force (empty: still)")
                .flatMap(n -> values.name(n, "column", forKey("to")));
        return from.isPresent() && to.isPresent() ? Optional.of(new History(from.get(), to.get())) : Optional.empty();
    }

    private List<Link> links(Name table, Node node) {
        Optional<MappingReader> read =
                values.mapping(node, forKey("links"), "links of table " + table.text(), List.of());
        List<Link> out = new ArrayList<>();
        read.ifPresent(m -> {
            for (NodeTuple entry : m.entries()) {
                ScalarNode key = (ScalarNode) entry.getKeyNode();
                Optional<Name> column = Names.plain(key.getValue(), values.start(key), "link column", diagnostics);
                Optional<Name> target =
                        values.name(entry.getValueNode(), "table", "for link " + Names.quote(key.getValue()));
                if (column.isPresent() && target.isPresent()) {
                    out.add(new Link(column.get(), target.get()));
                }
            }
        });
        return out;
    }

    private List<Name> columns(Node node, String key) {
        List<Name> out = new ArrayList<>();
        values.list(node, "a list of columns", forKey(key)).ifPresent(items -> items.forEach(
                item -> values.name(item, "column", in(key)).ifPresent(out::add)));
        return out;
    }

    /** {@code filled: { satisfaction: closed_at }}: each column with the time it is written at. */
    private List<FilledAt> filled(Name table, Node node) {
        Optional<MappingReader> read =
                values.mapping(node, forKey("filled"), "filled columns of table " + table.text(), List.of());
        List<FilledAt> out = new ArrayList<>();
        read.ifPresent(m -> {
            for (NodeTuple entry : m.entries()) {
                ScalarNode key = (ScalarNode) entry.getKeyNode();
                Optional<Name> column = Names.plain(key.getValue(), values.start(key), "column", diagnostics);
                Optional<Name> at = values.name(entry.getValueNode(), "column",
                        "for the time " + Names.quote(key.getValue()) + " is filled at");
                if (column.isPresent() && at.isPresent()) {
                    out.add(new FilledAt(column.get(), at.get()));
                }
            }
        });
        return out;
    }

    // ---------------------------------------------------------------------------------------- label

    private Optional<LabelSpec> label(Node node) {
        int errors = values.errorCount();
        Optional<MappingReader> read = values.mapping(node, forKey("label"), "label", LABEL_KEYS);
        if (read.isEmpty()) {
            return Optional.empty();
        }
        MappingReader m = read.get();
        Optional<Name> name = m.required("name", "the column name of the label, e.g. cancels_in_60d")
                .flatMap(n -> values.name(n, "output", forKey("name")));
        Optional<PathSpec> from = m.required("from", "the path of the rows that make the label, e.g. cancellations")
                .flatMap(n -> path(n, "from"));
        Optional<Span> horizon = m.required("horizon", "how far after the cutoff the label looks, e.g. 60d")
                .flatMap(n -> values.span(n, forKey("horizon")));
        horizon.filter(h -> h.amount() == 0).ifPresent(h -> diagnostics.error(h.position(),
                "horizon " + h.label() + " is empty: a label horizon must be longer than zero, e.g. 60d"));
        Optional<Span> gap = m.optional("gap")
                .map(n -> values.span(n, forKey("gap")))
                .orElse(Optional.of(Span.days(0)));
        Optional<MeasureParser.LabelValue> value = m.required("value", "exists, count or sum(column)")
                .flatMap(n -> values.scalar(n, "exists, count or sum(column)", forKey("value")))
                .flatMap(s -> MeasureParser.label(s.getValue(), values.locator(s), diagnostics));
        Optional<Expression> where = m.optional("where").flatMap(n -> expression(n, "where"));
        from.ifPresent(references::path);
        if (values.errorCount() > errors) {
            return Optional.empty();
        }
        return Optional.of(new LabelSpec(name.get(), from.get(), horizon.get(), gap.get(), value.get().kind(),
                value.get().column(), where, m.position()));
    }

    private Optional<PathSpec> path(Node node, String key) {
        return values.scalar(node, "a path such as rides -> stations", forKey(key))
                .flatMap(s -> PathParser.parse(s.getValue(), values.locator(s), diagnostics));
    }

    // ---------------------------------------------------------------------------------------- features

    private Optional<List<FeatureSpec>> features(Node node) {
        Optional<List<Node>> items = values.list(node, "a list of features", forKey("features"));
        if (items.isEmpty()) {
            return Optional.empty();
        }
        if (items.get().isEmpty()) {
            values.error(node, "features is empty: list at least one feature");
            return Optional.empty();
        }
        List<FeatureSpec> out = new ArrayList<>();
        for (Node item : items.get()) {
            feature(item).ifPresent(out::add);
        }
        return Optional.of(out);
    }

    private Optional<FeatureSpec> feature(Node item) {
        if (!(item instanceof MappingNode mapping)) {
            values.wrongShape(item, "a feature (a mapping with 'from', 'lookup' or 'expr')", in("features"));
            return Optional.empty();
        }
        Set<String> keys = new HashSet<>();
        for (NodeTuple entry : mapping.getValue()) {
            if (entry.getKeyNode() instanceof ScalarNode key) {
                keys.add(key.getValue());
            }
        }
        boolean block = keys.contains("from");
        boolean lookup = keys.contains("lookup");
        boolean derived = keys.contains("expr");
        if ((block || lookup) && derived) {
            values.error(item, "a feature with 'expr' is a column computed from other columns; it takes no"
                    + " 'from' or 'lookup': write two features");
            return Optional.empty();
        }
        if (block && lookup) {
            values.error(item, "a feature is either measures over windows ('from') or a lookup ('lookup'), not both:"
                    + " write two features");
            return Optional.empty();
        }
        int errors = values.errorCount();
        if (block) {
            return aggregates(new MappingReader(values.file(), diagnostics, mapping, "feature block", BLOCK_KEYS),
                    errors);
        }
        if (lookup) {
            return lookup(new MappingReader(values.file(), diagnostics, mapping, "lookup", LOOKUP_KEYS), errors);
        }
        if (derived) {
            return derived(new MappingReader(values.file(), diagnostics, mapping, "derived column", DERIVED_KEYS),
                    errors);
        }
        values.error(item, "a feature needs 'from' (measures over windows of a path), 'lookup' (a value as of"
                + " the cutoff) or 'name' with 'expr' (a column computed from other columns)");
        return Optional.empty();
    }

    /** A block of measures; {@code errors} is the error count before its mapping was read. */
    private Optional<FeatureSpec> aggregates(MappingReader m, int errors) {
        Optional<PathSpec> from = m.optional("from").flatMap(n -> path(n, "from"));
        Optional<List<Span>> windows = m.required("windows", "the lookback spans, e.g. [30d, 90d]")
                .flatMap(this::windows);
        Optional<List<MeasureSpec>> measures = m.required("measures", "what to compute, e.g. [count, sum(amount)]")
                .flatMap(this::measures);
        Optional<Name> prefix = m.optional("prefix").flatMap(n -> values.name(n, "prefix", forKey("prefix")));
        Optional<Expression> where = m.optional("where").flatMap(n -> expression(n, "where"));
        if (windows.isPresent() && windows.get().size() > 1) {
            measures.ifPresent(list -> list.forEach(measure -> measure.name()
                    .filter(name -> !name.text().contains(Names.WINDOW))
                    .ifPresent(name -> diagnostics.error(name.position(), "measure name " + Names.quote(name.text())
                            + " would repeat for each of the " + windows.get().size()
                            + " windows: add {window} to it, e.g. " + name.text() + "_{window}"))));
        }
        if (values.errorCount() > errors) {
            from.ifPresent(references::path);
            return Optional.empty();
        }
        FeatureSpec.Aggregates spec =
                new FeatureSpec.Aggregates(from.get(), windows.get(), measures.get(), prefix, where, m.position());
        references.path(spec.from());
        references.block(spec);
        return Optional.of(spec);
    }

    private Optional<List<Span>> windows(Node node) {
        Optional<List<Node>> items = values.list(node, "a list of spans", forKey("windows"));
        if (items.isEmpty()) {
            return Optional.empty();
        }
        if (items.get().isEmpty()) {
            values.error(node, "'windows' is empty: list at least one span, e.g. [30d]");
            return Optional.empty();
        }
        int errors = values.errorCount();
        List<Span> out = new ArrayList<>();
        for (Node item : items.get()) {
            values.span(item, in("windows")).ifPresent(span -> {
                if (span.amount() == 0) {
                    diagnostics.error(span.position(), "window " + span.label()
                            + " is empty: a window must be longer than zero, e.g. 30d");
                } else if (out.stream().anyMatch(span::sameLength)) {
                    diagnostics.error(span.position(), "window " + span.label() + " is listed twice: keep one");
                } else {
                    out.add(span);
                }
            });
        }
        return values.errorCount() > errors ? Optional.empty() : Optional.of(out);
    }

    private Optional<List<MeasureSpec>> measures(Node node) {
        Optional<List<Node>> items = values.list(node, "a list of measures", forKey("measures"));
        if (items.isEmpty()) {
            return Optional.empty();
        }
        if (items.get().isEmpty()) {
            values.error(node, "'measures' is empty: list at least one measure, e.g. [count]");
            return Optional.empty();
        }
        int errors = values.errorCount();
        List<MeasureSpec> out = new ArrayList<>();
        for (Node item : items.get()) {
            measure(item).ifPresent(measure -> {
                if (out.stream().anyMatch(o -> o.text().equals(measure.text())
                        && o.name().map(Name::text).equals(measure.name().map(Name::text)))) {
                    diagnostics.error(measure.position(), "measure " + measure.text()
                            + " is listed twice: keep one, or give each its own name");
                } else {
                    out.add(measure);
                }
            });
        }
        return values.errorCount() > errors ? Optional.empty() : Optional.of(out);
    }

    /** {@code sum(distance_km)}, or {@code { measure: sum(distance_km), name: distance_{window} }}. */
    private Optional<MeasureSpec> measure(Node item) {
        if (item instanceof ScalarNode scalar && !YamlNodes.isNull(item)) {
            return MeasureParser.parse(scalar.getValue(), values.locator(scalar), Optional.empty(), diagnostics);
        }
        if (!(item instanceof MappingNode)) {
            values.wrongShape(item, "a measure such as count or sum(amount)", in("measures"));
            return Optional.empty();
        }
        int errors = values.errorCount();
        MappingReader m = values.mapping(item, in("measures"), "measure", MEASURE_KEYS).orElseThrow();
        Optional<ScalarNode> measure = m.required("measure", "what to compute, e.g. sum(amount)")
                .flatMap(n -> values.scalar(n, "a measure such as count or sum(amount)", forKey("measure")));
        Optional<Name> name = m.optional("name")
                .flatMap(n -> values.scalar(n, "an output name", forKey("name")))
                .flatMap(s -> Names.output(s.getValue(), values.start(s), diagnostics));
        if (measure.isEmpty() || values.errorCount() > errors) {
            return Optional.empty();
        }
        return MeasureParser.parse(measure.get().getValue(), values.locator(measure.get()), name, diagnostics)
                .map(spec -> new MeasureSpec(spec.kind(), spec.column(), spec.name(), m.position()));
    }

    /** A lookup; {@code errors} is the error count before its mapping was read. */
    private Optional<FeatureSpec> lookup(MappingReader m, int errors) {
        Optional<ScalarNode> target = m.optional("lookup")
                .flatMap(n -> values.scalar(n, "table.column, e.g. plans.plan", forKey("lookup")));
        Optional<TableColumn> parts = target.flatMap(this::tableColumn);
        Optional<Name> name = m.optional("name").flatMap(n -> values.name(n, "output", forKey("name")));
        if (values.errorCount() > errors) {
            return Optional.empty();
        }
        FeatureSpec.Lookup spec = new FeatureSpec.Lookup(parts.get().table(), parts.get().column(), name,
                m.position());
        references.lookup(spec);
        return Optional.of(spec);
    }

    /** A derived column; {@code errors} is the error count before its mapping was read. */
    private Optional<FeatureSpec> derived(MappingReader m, int errors) {
        Optional<Name> name = m.required("name", "the column name, e.g. spend_trend")
                .flatMap(n -> values.name(n, "output", forKey("name")));
        Optional<Expression> expression = m.optional("expr").flatMap(n -> expression(n, "expr"));
        if (values.errorCount() > errors) {
            return Optional.empty();
        }
        return Optional.of(new FeatureSpec.Derived(name.get(), expression.get(), m.position()));
    }

    /** The text of an expression, kept for the plan stage to parse against the schema. */
    private Optional<Expression> expression(Node node, String key) {
        return values.expression(node, forKey(key));
    }

    private record TableColumn(Name table, Name column) {
    }

    /** {@code plans.plan}: a table and a column, each a plain name. */
    private Optional<TableColumn> tableColumn(ScalarNode scalar) {
        String text = scalar.getValue();
        Locator at = values.locator(scalar);
        String[] parts = text.split("\\.", -1);
        if (parts.length != 2 || parts[0].isEmpty() || parts[1].isEmpty()) {
            values.error(scalar, "'lookup' takes table.column, e.g. plans.plan, not " + Names.quote(text));
            return Optional.empty();
        }
        Optional<Name> table = Names.plain(parts[0], at.at(0), "table", diagnostics);
        Optional<Name> column = Names.plain(parts[1], at.at(parts[0].length() + 1), "column", diagnostics);
        return table.isPresent() && column.isPresent()
                ? Optional.of(new TableColumn(table.get(), column.get()))
                : Optional.empty();
    }
}
