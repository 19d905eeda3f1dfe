package dev.quern.sample;

/**
 * One support ticket. {@code closedAt} and {@code satisfaction} are both null while the ticket is open:
 * members rate the answer only once they have it.
 */
record Ticket(int memberId, long openedAt, Long closedAt, String topic, Integer satisfaction) {

    Ticket {
        if ((closedAt == null) != (satisfaction == null)) {
            throw new IllegalArgumentException("a satisfaction score belongs to a closed ticket");
        }
    }

    static Ticket open(int memberId, long openedAt, String topic) {
        return new Ticket(memberId, openedAt, null, topic, null);
    }

    Ticket closed(long at, int score) {
        return new Ticket(memberId, openedAt, at, topic, score);
    }

    boolean isOpenAt(long second) {
        return closedAt == null || closedAt > second;
    }
}
