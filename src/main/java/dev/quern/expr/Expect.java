package dev.quern.expr;

/** What the place an expression is written in needs from it. */
public enum Expect {
    /** A filter or rule: the expression must be true or false (rows where it is null are dropped, as in SQL). */
    CONDITION,
    /** A derived column: any type but a constant null. */
    VALUE
}
