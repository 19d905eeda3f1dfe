package dev.quern.sample;

/**
 * One ride; times are {@link Timeline} seconds. {@code pinned} marks a ride placed on purpose at a
 * boundary instant (midnight, one second before it): it wins over ordinary rides it would overlap.
 */
record Ride(int memberId, long startedAt, long endedAt, int startStationId, int endStationId,
        double distanceKm, double durationMin, boolean pinned) {

    /** Average speed; above about 45 km/h the bike cannot have been ridden. */
    double kilometresPerHour() {
        return distanceKm / (durationMin / 60.0);
    }
}
