package dev.quern.sample;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.SplittableRandom;

/**
 * Support tickets: when members write in, what about, how long the answer takes and how they rate it.
 * Ratings are the member's temper minus what went wrong, so grumpy members rate low, and a low rating
 * in turn makes a member likelier to leave.
 */
final class TicketDesk {

    private static final String[] TOPICS = {"bike fault", "app", "station full", "billing", "other"};
    private static final double[] TOPIC_WEIGHTS = {0.32, 0.25, 0.18, 0.10, 0.15};
    /** Some tickets fall through the cracks and are never answered. */
    private static final double NEVER_ANSWERED = 0.06;
    private static final long LONGEST_WAIT = 10 * Timeline.DAY;

    /**
     * Tickets opened in {@code [from, to)}: ordinary ones at a rate growing with use, and a likely billing
     * complaint a few days after each failed charge.
     */
    List<Ticket> opened(MemberProfile member, long from, long to, int rides, List<Payment> failedCharges,
            SplittableRandom random) {
        List<Ticket> tickets = new ArrayList<>();
        if (to <= from) {
            return tickets;
        }
        double mean = Math.min(0.25, 0.03 + 0.005 * rides);
        int count = Draws.poisson(random, mean);
        for (int i = 0; i < count; i++) {
            String topic = TOPICS[Draws.weighted(random, TOPIC_WEIGHTS)];
            tickets.add(answer(member, Draws.uniform(random, from, to), topic, random));
        }
        for (Payment failed : failedCharges) {
            long at = failed.paidAt() + Draws.uniform(random, Timeline.HOUR, 3 * Timeline.DAY);
            if (at >= from && at < to && Draws.chance(random, 0.35)) {
                tickets.add(answer(member, at, "billing", random));
            }
        }
        tickets.sort(Comparator.comparingLong(Ticket::openedAt));
        return tickets;
    }

    private static Ticket answer(MemberProfile member, long openedAt, String topic, SplittableRandom random) {
        Ticket ticket = Ticket.open(member.id(), openedAt, topic);
        if (Draws.chance(random, NEVER_ANSWERED)) {
            return ticket;
        }
        long wait = Math.max(10 * Timeline.MINUTE,
                Math.min(LONGEST_WAIT, Math.round(Draws.exponential(random, 2.0 * Timeline.DAY))));
        long closedAt = openedAt + wait;
        if (closedAt >= Timeline.END) {
            return ticket;
        }
        double days = (double) wait / Timeline.DAY;
        double score = 3.7 + 1.6 * (member.temper() - 0.5) - ("billing".equals(topic) ? 0.6 : 0.0) - 0.12 * days
                + Draws.normal(random, 0, 0.8);
        return ticket.closed(closedAt, clampScore(score));
    }

    /** A ticket still open when its member leaves is closed with the account, rated by a departing member. */
    static Ticket closedOnLeaving(Ticket ticket, long cancelledAt, SplittableRandom random) {
        return ticket.closed(cancelledAt, 1 + random.nextInt(2));
    }

    private static int clampScore(double score) {
        return (int) Math.max(1, Math.min(5, Math.round(score)));
    }
}
