package dev.quern.sample;

/** A member leaving the club; there is at most one per member. */
record Cancellation(int memberId, long cancelledAt, String reason) {
}
