package dev.quern.recipe;

import dev.quern.Diagnostics;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Reads a path: {@code rides}, {@code rides -> stations}, {@code rides.end_station_id -> stations}. Steps
 * are separated by {@code ->} (spaces around it optional); a step other than the last may name the link
 * column it leaves by, after a dot.
 */
final class PathParser {

    static final String FORMS = "write table, table -> table or table.link_column -> table";

    private PathParser() {
    }

    /** One step as written, and where its text starts in the path. */
    private record Step(String text, int offset) {
    }

    static Optional<PathSpec> parse(String text, Locator at, Diagnostics diagnostics) {
        if (text.isBlank()) {
            diagnostics.error(at.at(0), "a path needs a table, e.g. rides or rides -> stations");
            return Optional.empty();
        }
        List<Step> steps = split(text);
        int errors = diagnostics.all().size();
        List<Name> tables = new ArrayList<>();
        List<Optional<Name>> vias = new ArrayList<>();
        for (int i = 0; i < steps.size(); i++) {
            Step step = steps.get(i);
            boolean last = i == steps.size() - 1;
            if (step.text().isEmpty()) {
                diagnostics.error(at.at(step.offset()), Names.quote(text)
                        + " is not a path: write a table on both sides of each '->'");
                return Optional.empty();
            }
            String[] parts = step.text().split("\\.", -1);
            if (parts.length > 2) {
                diagnostics.error(at.at(step.offset()), Names.quote(step.text()) + " is not a path step: " + FORMS);
                continue;
            }
            if (!Names.isPlain(parts[0]) && looksLikeArrow(parts[0])) {
                diagnostics.error(at.at(step.offset()), Names.quote(text) + " is not a path: " + FORMS);
                return Optional.empty();
            }
            Names.plain(parts[0], at.at(step.offset()), "table", diagnostics).ifPresent(tables::add);
            if (parts.length == 2) {
                int viaOffset = step.offset() + parts[0].length() + 1;
                if (last) {
                    diagnostics.error(at.at(step.offset()), "a path ends at a table, not at "
                            + Names.quote(step.text()) + ": a link column goes before '->'");
                    continue;
                }
                vias.add(Names.plain(parts[1], at.at(viaOffset), "link column", diagnostics));
            } else {
                vias.add(Optional.empty());
            }
        }
        if (diagnostics.all().size() > errors) {
            return Optional.empty();
        }
        List<Hop> hops = new ArrayList<>();
        for (int i = 0; i < tables.size(); i++) {
            hops.add(new Hop(tables.get(i), i == 0 ? Optional.empty() : vias.get(i - 1)));
        }
        return Optional.of(new PathSpec(hops, at.at(0)));
    }

    private static List<Step> split(String text) {
        List<Step> steps = new ArrayList<>();
        int start = 0;
        while (true) {
            int arrow = text.indexOf("->", start);
            int end = arrow < 0 ? text.length() : arrow;
            String raw = text.substring(start, end);
            int lead = raw.length() - raw.stripLeading().length();
            // an empty step is placed at the arrow next to it
            steps.add(new Step(raw.strip(), raw.isBlank() ? (arrow >= 0 ? arrow : start - 2) : start + lead));
            if (arrow < 0) {
                return steps;
            }
            start = arrow + 2;
        }
    }

    /** Text that was meant as several steps but is not joined by {@code ->}: spaces, a lone >. */
    private static boolean looksLikeArrow(String part) {
        return part.chars().anyMatch(c -> Character.isWhitespace(c) || c == '>' || c == '<' || c == '=');
    }
}
