package dev.quern.report;

import java.util.Collection;
import java.util.Map;

/**
 * A small JSON writer for Quern's own reports: maps keep their insertion order and output is indented,
 * so reports diff well between runs. Values are maps, collections, strings, numbers, booleans and null.
 */
public final class Json {

    private Json() {
    }

    public static String write(Object value) {
        StringBuilder out = new StringBuilder();
        write(value, out, 0);
        return out.append('\n').toString();
    }

    private static void write(Object value, StringBuilder out, int depth) {
        if (value == null) {
            out.append("null");
        } else if (value instanceof Map<?, ?> map) {
            writeMap(map, out, depth);
        } else if (value instanceof Collection<?> list) {
            writeList(list, out, depth);
        } else if (value instanceof Boolean || value instanceof Integer || value instanceof Long) {
            out.append(value);
        } else if (value instanceof Number n) {
            double d = n.doubleValue();
            out.append(Double.isFinite(d) ? java.math.BigDecimal.valueOf(d).stripTrailingZeros().toPlainString()
                    : "null");
        } else {
            string(value.toString(), out);
        }
    }

    private static void writeMap(Map<?, ?> map, StringBuilder out, int depth) {
        if (map.isEmpty()) {
            out.append("{}");
            return;
        }
        out.append('{');
        boolean first = true;
        for (Map.Entry<?, ?> e : map.entrySet()) {
            out.append(first ? "\n" : ",\n");
            first = false;
            indent(out, depth + 1);
            string(String.valueOf(e.getKey()), out);
            out.append(": ");
            write(e.getValue(), out, depth + 1);
        }
        out.append('\n');
        indent(out, depth);
        out.append('}');
    }

    private static void writeList(Collection<?> list, StringBuilder out, int depth) {
        if (list.isEmpty()) {
            out.append("[]");
            return;
        }
        boolean simple = list.stream().noneMatch(v -> v instanceof Map || v instanceof Collection);
        if (simple) {
            out.append('[');
            boolean first = true;
            for (Object v : list) {
                if (!first) {
                    out.append(", ");
                }
                first = false;
                write(v, out, depth);
            }
            out.append(']');
            return;
        }
        out.append('[');
        boolean first = true;
        for (Object v : list) {
            out.append(first ? "\n" : ",\n");
            first = false;
            indent(out, depth + 1);
            write(v, out, depth + 1);
        }
        out.append('\n');
        indent(out, depth);
        out.append(']');
    }

    private static void indent(StringBuilder out, int depth) {
        out.append("  ".repeat(depth));
    }

    static void string(String s, StringBuilder out) {
        out.append('"');
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '"' -> out.append("\\\"");
                case '\\' -> out.append("\\\\");
                case '\n' -> out.append("\\n");
                case '\r' -> out.append("\\r");
                case '\t' -> out.append("\\t");
                default -> {
                    if (c < 0x20) {
                        out.append(String.format("\\u%04x", (int) c));
                    } else {
                        out.append(c);
                    }
                }
            }
        }
        out.append('"');
    }
}
