package dev.quern.sample;

/**
 * One ride; times are {@link Timeline} seconds. {@code pinned} marks a ride placed on purpose at a
 * boundary instant (midnight, one second before it): it wins over ordinary rides it would overlap.
 */
record Ride(int memberId, long startedAt, long endedAt, int startStationId, int endStationId,
        double distanceKm, double durationMin, boolean pinned) {
}
