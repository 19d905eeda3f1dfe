package dev.quern.expr;

import dev.quern.Position;
import java.util.Objects;

/**
 * An expression's text and the recipe position of its first character: turns offsets into recipe
 * positions and draws the caret line under a mistake.
 */
final class SourceText {

    private final String text;
    private final Position start;

    SourceText(String text, Position start) {
        this.text = Objects.requireNonNull(text, "text");
        this.start = Objects.requireNonNull(start, "start");
    }

    String text() {
        return text;
    }

    Position start() {
        return start;
    }

    String slice(int from, int to) {
        return text.substring(from, to);
    }

    /**
     * The recipe position of the character at {@code offset}. On the first line that is the start column
     * plus the offset (counted in characters as the reader sees them, not UTF-16 units). On later lines of a
     * multi-line expression it is the column within that line of the text: a YAML block scalar strips its
     * indentation, which this class cannot know.
     */
    Position positionAt(int offset) {
        if (!start.isKnown()) {
            return start;
        }
        int lineStart = lineStart(offset);
        int newlines = 0;
        for (int i = 0; i < lineStart; i++) {
            if (text.charAt(i) == '\n') {
                newlines++;
            }
        }
        int column = text.codePointCount(lineStart, offset);
        return newlines == 0
                ? new Position(start.file(), start.line(), start.column() + column)
                : new Position(start.file(), start.line() + newlines, 1 + column);
    }

    /** The message, then the expression's line holding {@code offset}, then a caret under that offset. */
    String pointAt(int offset, String message) {
        int lineStart = lineStart(offset);
        int lineEnd = text.indexOf('\n', offset);
        String line = text.substring(lineStart, lineEnd < 0 ? text.length() : lineEnd);
        if (line.endsWith("\r")) {
            line = line.substring(0, line.length() - 1);
        }
        StringBuilder caret = new StringBuilder();
        // A tab stays a tab, so that the caret lines up however wide the terminal draws tabs.
        text.substring(lineStart, offset).codePoints()
                .forEach(c -> caret.append(c == '\t' ? '\t' : ' '));
        return message + "\n" + line + "\n" + caret + "^";
    }

    private int lineStart(int offset) {
        return offset == 0 ? 0 : text.lastIndexOf('\n', offset - 1) + 1;
    }
}
