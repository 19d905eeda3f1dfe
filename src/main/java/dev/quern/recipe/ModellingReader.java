package dev.quern.recipe;

import static dev.quern.recipe.Values.forKey;
import static dev.quern.recipe.Values.in;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;

/**
 * Reads the sections about the model rather than the data: {@code encode}, {@code split} and
 * {@code audit}. Encoding kinds and options are kept as written; the encode stage checks them.
 */
final class ModellingReader {

    static final List<String> SPLIT_PARTS = List.of("train", "validation", "test");
    static final List<String> PART_KEYS = List.of("from", "to");
    static final List<String> AUDIT_KEYS = List.of("auc", "rho", "acknowledge");
    static final List<String> ACKNOWLEDGE_KEYS = List.of("check", "column", "reason");

    private final Values values;

    ModellingReader(Values values) {
        this.values = values;
    }

    /**
     * {@code encode: { plan: one-hot, fee: [log1p, standardise], zone: { one-hot: { top: 3 } } }}: per
     * output column, one step or a list of steps; a step is a kind, or a kind with its options.
     */
    Optional<List<EncodingSpec>> encodings(Node node) {
        Optional<MappingReader> read = values.mapping(node, forKey("encode"), "encode", List.of());
        if (read.isEmpty()) {
            return Optional.empty();
        }
        int errors = values.errorCount();
        List<EncodingSpec> out = new ArrayList<>();
        for (NodeTuple entry : read.get().entries()) {
            ScalarNode key = (ScalarNode) entry.getKeyNode();
            Optional<Name> column = Names.plain(key.getValue(), values.start(key), "column", values.diagnostics());
            Node value = entry.getValueNode();
            List<Node> stepNodes = value instanceof org.yaml.snakeyaml.nodes.SequenceNode s ? s.getValue() : List.of(value);
            List<EncodingSpec.Step> steps = new ArrayList<>();
            for (Node step : stepNodes) {
                step(step, key.getValue()).ifPresent(steps::add);
            }
            if (stepNodes.isEmpty()) {
                values.error(value, "no encoding for " + Names.quote(key.getValue()) + ": name one, e.g. one-hot");
            }
            column.ifPresent(c -> out.add(new EncodingSpec(c, steps, values.at(key))));
        }
        return values.errorCount() > errors ? Optional.empty() : Optional.of(out);
    }

    private Optional<EncodingSpec.Step> step(Node node, String column) {
        if (node instanceof ScalarNode s && !YamlNodes.isNull(node)) {
            return Optional.of(new EncodingSpec.Step(new Name(s.getValue(), values.start(s)), Map.of(), values.at(s)));
        }
        if (node instanceof MappingNode m && m.getValue().size() == 1
                && m.getValue().get(0).getKeyNode() instanceof ScalarNode kind) {
            Node optionsNode = m.getValue().get(0).getValueNode();
            Map<String, Name> options = new LinkedHashMap<>();
            if (optionsNode instanceof ScalarNode single && !YamlNodes.isNull(optionsNode)) {
                // {impute: median} or {bins: 4}: a kind with its one main value.
                options.put("", new Name(single.getValue(), values.start(single)));
            } else if (!YamlNodes.isNull(optionsNode)) {
                Optional<MappingReader> opts = values.mapping(optionsNode, "for " + Names.quote(kind.getValue()),
                        "options of " + kind.getValue(), List.of());
                opts.ifPresent(o -> {
                    for (NodeTuple option : o.entries()) {
                        ScalarNode name = (ScalarNode) option.getKeyNode();
                        values.scalar(option.getValueNode(), "a value", forKey(name.getValue()))
                                .ifPresent(v -> options.put(name.getValue(), new Name(v.getValue(), values.start(v))));
                    }
                });
            }
            return Optional.of(new EncodingSpec.Step(new Name(kind.getValue(), values.start(kind)), options,
                    values.at(node)));
        }
        values.wrongShape(node, "an encoding such as one-hot, or { one-hot: { top: 5 } }",
                "for " + Names.quote(column));
        return Optional.empty();
    }

    /** {@code split: { train: { to: 2025-03-31 }, test: { from: 2025-06-30 } }}. */
    Optional<SplitSpec> split(Node node) {
        Optional<MappingReader> read = values.mapping(node, forKey("split"), "split", SPLIT_PARTS);
        if (read.isEmpty()) {
            return Optional.empty();
        }
        int errors = values.errorCount();
        List<SplitSpec.Part> parts = new ArrayList<>();
        for (NodeTuple entry : read.get().entries()) {
            ScalarNode key = (ScalarNode) entry.getKeyNode();
            if (!SPLIT_PARTS.contains(key.getValue())) {
                continue;
            }
            values.mapping(entry.getValueNode(), forKey(key.getValue()), "split part " + key.getValue(), PART_KEYS)
                    .ifPresent(m -> {
                        Optional<LocalDate> from = m.optional("from").flatMap(n -> values.date(n, forKey("from")));
                        Optional<LocalDate> to = m.optional("to").flatMap(n -> values.date(n, forKey("to")));
                        parts.add(new SplitSpec.Part(new Name(key.getValue(), values.start(key)), from, to,
                                m.position()));
                    });
        }
        if (parts.stream().noneMatch(p -> p.name().text().equals("train"))) {
            values.diagnostics().error(read.get().position(), "split needs a 'train' part: the cutoffs encodings are"
                    + " fitted on");
        }
        return values.errorCount() > errors ? Optional.empty()
                : Optional.of(new SplitSpec(parts, read.get().position()));
    }

    /** {@code audit: { auc: 0.95, rho: 0.95, acknowledge: [ { check, column, reason } ] }}. */
    Optional<AuditSpec> audit(Node node) {
        Optional<MappingReader> read = values.mapping(node, forKey("audit"), "audit", AUDIT_KEYS);
        if (read.isEmpty()) {
            return Optional.empty();
        }
        int errors = values.errorCount();
        MappingReader m = read.get();
        OptionalDouble auc = m.optional("auc").map(n -> threshold(n, "auc", 0.5)).orElse(OptionalDouble.empty());
        OptionalDouble rho = m.optional("rho").map(n -> threshold(n, "rho", 0.0)).orElse(OptionalDouble.empty());
        List<Acknowledgement> acknowledgements = new ArrayList<>();
        Set<String> seen = new HashSet<>();
        m.optional("acknowledge").flatMap(n -> values.list(n, "a list of acknowledgements", forKey("acknowledge")))
                .ifPresent(items -> items.forEach(item -> acknowledgement(item).ifPresent(a -> {
                    if (!seen.add(a.check().text() + "/" + a.column().text())) {
                        values.diagnostics().error(a.position(), "finding " + a.check().text() + " of "
                                + a.column().text() + " is acknowledged twice: keep one");
                    } else {
                        acknowledgements.add(a);
                    }
                })));
        return values.errorCount() > errors ? Optional.empty() : Optional.of(new AuditSpec(acknowledgements, auc, rho));
    }

    private Optional<Acknowledgement> acknowledgement(Node item) {
        int errors = values.errorCount();
        Optional<MappingReader> read = values.mapping(item, in("acknowledge"), "acknowledgement", ACKNOWLEDGE_KEYS);
        if (read.isEmpty()) {
            return Optional.empty();
        }
        MappingReader m = read.get();
        Optional<Name> check = m.required("check", "the audit check acknowledged, e.g. current-state")
                .flatMap(n -> values.scalar(n, "a check name", forKey("check")))
                .map(s -> new Name(s.getValue(), values.start(s)));
        Optional<Name> column = m.required("column", "the output column the finding is about")
                .flatMap(n -> values.name(n, "output", forKey("column")));
        Optional<String> reason = m.required("reason", "why the column is safe all the same")
                .flatMap(n -> values.text(n, "a sentence", forKey("reason")));
        reason.filter(String::isBlank).ifPresent(r -> values.diagnostics().error(m.position(),
                "an acknowledgement needs a reason that says why the column is safe"));
        if (values.errorCount() > errors) {
            return Optional.empty();
        }
        return Optional.of(new Acknowledgement(check.get(), column.get(), reason.get(), m.position()));
    }

    private OptionalDouble threshold(Node node, String key, double lowest) {
        return values.scalar(node, "a number between " + lowest + " and 1", forKey(key)).map(s -> {
            try {
                double v = Double.parseDouble(s.getValue());
                if (v > lowest && v <= 1.0) {
                    return OptionalDouble.of(v);
                }
            } catch (NumberFormatException e) {
                // reported below
            }
            values.error(s, key + " must be a number above " + lowest + " and at most 1, not "
                    + Names.quote(s.getValue()));
            return OptionalDouble.empty();
        }).orElse(OptionalDouble.empty());
    }
}
