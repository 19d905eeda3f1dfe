package dev.quern.recipe;

import dev.quern.Position;

/** Finds the position of a character inside a value written in the recipe, by its offset in the value. */
@FunctionalInterface
interface Locator {

    Position at(int offset);

    /** A locator for a value whose inner places are unknown: every offset points at the value itself. */
    static Locator fixed(Position position) {
        return offset -> position;
    }

    /** A locator for a value written exactly as it reads, starting at {@code start}. */
    static Locator from(Position start) {
        return start::shifted;
    }
}
