package dev.quern.recipe;

import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.error.MarkedYAMLException;

/** Turns SnakeYAML's syntax errors into messages that say what is wrong in the words of a recipe writer. */
final class YamlErrors {

    private YamlErrors() {
    }

    static String message(MarkedYAMLException e) {
        String problem = e.getProblem() == null ? "" : e.getProblem().strip();
        String context = e.getContext() == null ? "" : e.getContext().strip();
        if (problem.contains("\\t(TAB)") || problem.contains("\t")) {
            return "a tab here: indent YAML with spaces";
        }
        if (problem.equals("mapping values are not allowed here")) {
            return "a ':' is not allowed here: check the indentation, or quote a value that holds ': '";
        }
        if (problem.equals("but found another document")) {
            return "a second YAML document: a recipe is one document; remove the '---' and what follows";
        }
        if (problem.startsWith("found undefined alias")) {
            return "'*" + problem.substring("found undefined alias".length()).strip()
                    + "' refers to no anchor: define it with & before using it";
        }
        if (problem.equals("found unexpected end of stream") && context.contains("quoted scalar")) {
            return "a quoted value is not closed" + started(e.getContextMark()) + ": add the closing quote";
        }
        if (problem.startsWith("expected <block end>")) {
            return "this line does not line up with the lines above it: check its indentation";
        }
        if (context.contains("flow sequence")) {
            return "a list in [ ] is not closed" + started(e.getContextMark()) + ": expected ',' or ']'";
        }
        if (context.contains("flow mapping")) {
            return "a mapping in { } is not closed" + started(e.getContextMark()) + ": expected ',' or '}'";
        }
        String words = tidy(problem);
        if (!context.isEmpty()) {
            Mark mark = e.getContextMark();
            words += " (" + tidy(context) + (mark == null ? "" : " at line " + (mark.getLine() + 1) + ", column "
                    + (mark.getColumn() + 1)) + ")";
        }
        return "invalid YAML: " + words;
    }

    private static String started(Mark mark) {
        return mark == null
                ? ""
                : " (opened at line " + (mark.getLine() + 1) + ", column " + (mark.getColumn() + 1) + ")";
    }

    private static String tidy(String text) {
        return text.replace("<stream end>", "the end of the file")
                .replace("<block end>", "the end of the block")
                .replace("<block mapping start>", "a mapping")
                .replace("<block sequence start>", "a list")
                .replace("<document start>", "the start of the document");
    }
}
