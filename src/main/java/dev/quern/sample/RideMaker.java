package dev.quern.sample;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.SplittableRandom;

/**
 * Draws a member's rides over a stretch of time: how many each day (appetite, season, weather, weekday,
 * fading interest), when (commuting peaks on weekdays, leisure on weekends), where and how far.
 */
final class RideMaker {

    /** Share of rides whose speed gives away that the bike travelled on a train or in a car. */
    private static final double ON_A_TRAIN = 0.003;
    /** Chance, per member and month end, of a ride pinned to an instant around that month end's midnight. */
    private static final double PINNED_PER_MONTH_END = 0.008;

    private final StationMap stations;
    private final Seasons seasons;

    RideMaker(StationMap stations, Seasons seasons) {
        this.stations = stations;
        this.seasons = seasons;
    }

    /**
     * Rides starting in {@code [from, to)} that also end before {@code deadline}, in start order, none
     * overlapping {@code busyUntil} or one another.
     */
    List<Ride> between(MemberProfile member, long from, long to, long deadline, long busyUntil,
            SplittableRandom random) {
        List<Ride> drawn = new ArrayList<>();
        LocalDate last = Timeline.dayOf(to - 1);
        for (LocalDate day = Timeline.dayOf(from); !day.isAfter(last); day = day.plusDays(1)) {
            long midnight = Timeline.secondOf(day);
            double mean = member.ridesPerDay() * seasons.riding(day) * weekdayFactor(member, day)
                    * member.interestAt(midnight + 12 * Timeline.HOUR);
            int count = Draws.poisson(random, mean);
            for (int i = 0; i < count; i++) {
                drawn.add(ordinary(member, day, random));
            }
            if (day.getDayOfMonth() == day.lengthOfMonth() && Draws.chance(random, PINNED_PER_MONTH_END)) {
                drawn.add(pinned(member, day, random));
            }
        }
        drawn.removeIf(r -> r.startedAt() < from || r.startedAt() >= to || r.endedAt() >= deadline);
        drawn.sort(Comparator.comparingLong(Ride::startedAt));
        return withoutOverlaps(drawn, busyUntil);
    }

    private static double weekdayFactor(MemberProfile member, LocalDate day) {
        boolean weekend = Seasons.isWeekend(day);
        if (member.commuter()) {
            return weekend ? 0.55 : 1.2;
        }
        return weekend ? 1.35 : 0.9;
    }

    /** A member cannot ride two bikes at once; a pinned ride displaces the ordinary one in its way. */
    private static List<Ride> withoutOverlaps(List<Ride> sorted, long busyUntil) {
        List<Ride> kept = new ArrayList<>();
        long freeFrom = busyUntil;
        for (Ride ride : sorted) {
            if (ride.startedAt() >= freeFrom) {
                kept.add(ride);
                freeFrom = ride.endedAt();
            } else if (ride.pinned() && !kept.isEmpty() && !kept.get(kept.size() - 1).pinned()
                    && (kept.size() < 2 || kept.get(kept.size() - 2).endedAt() <= ride.startedAt())) {
                kept.set(kept.size() - 1, ride);
                freeFrom = ride.endedAt();
            }
        }
        return kept;
    }

    private Ride ordinary(MemberProfile member, LocalDate day, SplittableRandom random) {
        boolean weekend = Seasons.isWeekend(day);
        double commuteShare = weekend ? 0.0 : member.commuter() ? 0.75 : 0.25;
        long midnight = Timeline.secondOf(day);
        if (Draws.chance(random, commuteShare)) {
            boolean morning = Draws.chance(random, 0.5);
            long at = morning ? clockTime(random, 8 * 60 + 5, 45) : clockTime(random, 17 * 60 + 40, 55);
            Station home = stations.anyIn(member.homeZone(), random);
            Station work = stations.anyIn(member.workZone(), random);
            if (work.id() == home.id()) {
                work = stations.anyIn(member.workZone(), random);
            }
            return morning
                    ? ride(member, midnight + at, home, work, 13, 22, random)
                    : ride(member, midnight + at, work, home, 13, 22, random);
        }
        long at = weekend ? weekendTime(random) : weekdayLeisureTime(random);
        Station start = Draws.chance(random, 0.65) ? stations.anyIn(member.homeZone(), random) : stations.any(random);
        double where = random.nextDouble();
        Station end = where < 0.15 ? start
                : where < 0.6 ? stations.anyIn(start.zone(), random)
                : stations.any(random);
        return ride(member, midnight + at, start, end, 8, 18, random);
    }

    /** Rides at 00:00:00 and 23:59:59 of month ends and 00:00:00 of the next day: the instants cutoffs split. */
    private Ride pinned(MemberProfile member, LocalDate monthEnd, SplittableRandom random) {
        long at = switch (random.nextInt(3)) {
            case 0 -> Timeline.secondOf(monthEnd);
            case 1 -> Timeline.secondOf(monthEnd.plusDays(1)) - 1;
            default -> Timeline.secondOf(monthEnd.plusDays(1));
        };
        Station start = stations.anyIn(member.homeZone(), random);
        Station end = stations.any(random);
        Ride ride = ride(member, at, start, end, 9, 18, random);
        return new Ride(ride.memberId(), ride.startedAt(), ride.endedAt(), ride.startStationId(),
                ride.endStationId(), ride.distanceKm(), ride.durationMin(), true);
    }

    private Ride ride(MemberProfile member, long startedAt, Station start, Station end, double slowest,
            double fastest, SplittableRandom random) {
        boolean onATrain = Draws.chance(random, ON_A_TRAIN);
        if (onATrain) {
            // A train or car trip only shows when the distance is long enough to read a speed off it.
            while (end.zone() == start.zone() || start.kilometresTo(end) < 2.0) {
                end = stations.any(random);
            }
        }
        double km = start.id() == end.id()
                ? Math.min(25.0, Math.max(1.0, Draws.logNormal(random, 5.5, 0.6)))
                : Math.min(25.0, Math.max(0.3, start.kilometresTo(end) * Draws.uniform(random, 1.15, 1.5)));
        km = Draws.roundTo(km, 2);
        double speed = onATrain ? Draws.uniform(random, 60, 120) : Draws.uniform(random, slowest, fastest);
        double minutes = Math.max(0.5, Draws.roundTo(km / speed * 60.0, 1));
        long endedAt = startedAt + Math.round(minutes * 60.0);
        return new Ride(member.id(), startedAt, endedAt, start.id(), end.id(), km, minutes, false);
    }

    /** A time of day in seconds around a peak given in minutes after midnight. */
    private static long clockTime(SplittableRandom random, double peakMinute, double spreadMinutes) {
        double minute = Draws.normal(random, peakMinute, spreadMinutes);
        return clampToDay(Math.round(minute * 60.0) + random.nextInt(60) - 30);
    }

    private static long weekendTime(SplittableRandom random) {
        if (Draws.chance(random, 0.02)) {
            return Draws.uniform(random, 0, 6 * Timeline.HOUR);
        }
        return clockTime(random, 14 * 60, 180);
    }

    private static long weekdayLeisureTime(SplittableRandom random) {
        double kind = random.nextDouble();
        if (kind < 0.02) {
            return Draws.uniform(random, 0, 6 * Timeline.HOUR);
        }
        if (kind < 0.75) {
            return Draws.uniform(random, 9 * Timeline.HOUR, 21 * Timeline.HOUR);
        }
        return Draws.chance(random, 0.5)
                ? Draws.uniform(random, 6 * Timeline.HOUR, 9 * Timeline.HOUR)
                : Draws.uniform(random, 21 * Timeline.HOUR, Timeline.DAY);
    }

    private static long clampToDay(long second) {
        return Math.max(0, Math.min(Timeline.DAY - 1, second));
    }
}
