package dev.quern.sample;

import java.time.LocalDate;
import java.util.SplittableRandom;

/**
 * What a member brings when they join: who they are and the habits that drive everything they do later.
 * None of the habits is stored; they only shape the events.
 *
 * @param ridesPerDay   riding appetite in midsummer weather before any fading; heavily skewed
 * @param fadeFrom      when a fading member starts to lose interest, or {@link Long#MAX_VALUE}
 * @param fadeDays      how quickly interest then decays (e-folding time in days)
 * @param failureChance chance that any one charge bounces
 * @param temper        0 grumpy .. 1 easy-going; colours how tickets are rated
 * @param billingTime   second of the day at which the monthly billing run charges this member
 */
record MemberProfile(
        int id,
        long joinedAt,
        Zone homeZone,
        Zone workZone,
        Integer birthYear,
        String channel,
        double ridesPerDay,
        boolean commuter,
        long fadeFrom,
        double fadeDays,
        double failureChance,
        double temper,
        long billingTime) {

    private static final String[] CHANNELS = {"friend", "poster", "event", "search", "workplace"};
    private static final double[] CHANNEL_WEIGHTS = {0.28, 0.14, 0.12, 0.30, 0.16};

    static MemberProfile draw(int id, long joinedAt, SplittableRandom random) {
        Zone home = Zone.values()[Draws.weighted(random, residentShares())];
        // Most commuters work in the centre; the rest cross to another district.
        Zone work = Draws.chance(random, 0.6) ? Zone.CENTRE : Zone.values()[random.nextInt(Zone.values().length)];
        Integer birthYear = Draws.chance(random, 0.02) ? null : birthYear(random);
        String channel = CHANNELS[Draws.weighted(random, CHANNEL_WEIGHTS)];
        double ridesPerDay = Math.min(2.0, Draws.logNormal(random, 0.09, 0.95));
        boolean commuter = Draws.chance(random, 0.4);
        long fadeFrom = Long.MAX_VALUE;
        double fadeDays = 0;
        if (Draws.chance(random, 0.35)) {
            fadeFrom = joinedAt + Draws.uniform(random, 20, 360) * Timeline.DAY;
            fadeDays = Draws.uniform(random, 30, 180);
        }
        double failureChance = Draws.chance(random, 0.15) ? 0.18 : 0.012;
        double temper = random.nextDouble();
        long billingTime = Draws.uniform(random, 2 * Timeline.HOUR, 6 * Timeline.HOUR);
        return new MemberProfile(id, joinedAt, home, work, birthYear, channel, ridesPerDay, commuter, fadeFrom,
                fadeDays, failureChance, temper, billingTime);
    }

    private static double[] residentShares() {
        Zone[] zones = Zone.values();
        double[] shares = new double[zones.length];
        for (int i = 0; i < zones.length; i++) {
            shares[i] = zones[i].residents();
        }
        return shares;
    }

    private static int birthYear(SplittableRandom random) {
        while (true) {
            long year = Math.round(Draws.normal(random, 1987, 12));
            if (year >= 1950 && year <= 2007) {
                return (int) year;
            }
        }
    }

    LocalDate joinedOn() {
        return Timeline.dayOf(joinedAt);
    }

    /** 1 until the member starts to fade, then decaying towards 0. */
    double interestAt(long second) {
        if (second <= fadeFrom) {
            return 1.0;
        }
        return StrictMath.exp(-(second - fadeFrom) / (fadeDays * Timeline.DAY));
    }

    /** The plan a member picks on joining, matched loosely to how much they expect to ride. */
    Plan firstPlan(SplittableRandom random) {
        if (ridesPerDay > 0.25) {
            return Plan.values()[Draws.weighted(random, 0.12, 0.30, 0.48, 0.10)];
        }
        if (commuter) {
            return Plan.values()[Draws.weighted(random, 0.24, 0.54, 0.14, 0.08)];
        }
        return Plan.values()[Draws.weighted(random, 0.52, 0.20, 0.10, 0.18)];
    }
}
