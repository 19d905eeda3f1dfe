package dev.quern.plan;

/**
 * The handle of the name {@code cutoff} in an expression's scope: the row's cutoff date. Rendering maps it
 * to the cutoff column of whatever query the expression is placed in.
 */
public enum Cutoff {
    ROW
}
