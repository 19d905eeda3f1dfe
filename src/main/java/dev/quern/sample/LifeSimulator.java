package dev.quern.sample;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.SplittableRandom;

/**
 * Lives one member's membership forward, one billing month at a time. Each month opens on the billing
 * day with the decisions a member makes then (pause, resume, change plan), the charges, and whether this
 * is the month they leave; then come the rides and tickets. Leaving depends only on what happened before
 * that decision: fading interest, bounced charges, badly rated tickets, months without a ride. That is
 * what gives a churn model something honest to learn.
 */
final class LifeSimulator {

    private static final String[] REASONS = {"moved away", "too expensive", "bought own bike", "rarely used", "other"};
    private static final double[] CALM_WEIGHTS = {0.35, 0.20, 0.20, 0.05, 0.20};
    private static final double[] IDLE_WEIGHTS = {0.10, 0.05, 0.30, 0.45, 0.10};
    private static final long LATE_TOUCH_FROM = Timeline.secondOf(LocalDate.of(2025, 10, 1));
    private static final int MOST_PLANS = 4;

    private final RideMaker rideMaker;
    private final TicketDesk desk = new TicketDesk();

    LifeSimulator(RideMaker rideMaker) {
        this.rideMaker = rideMaker;
    }

    MemberLife simulate(MemberProfile member, SplittableRandom random) {
        Membership membership = new Membership(member, random);
        for (int month = 0; billingInstant(member, month) < Timeline.END && !membership.hasEnded(); month++) {
            membership.live(month);
        }
        return membership.settle();
    }

    /** The first month starts at the moment of joining; later ones at the billing run on the same day of the month. */
    static long billingInstant(MemberProfile member, int month) {
        if (month == 0) {
            return member.joinedAt();
        }
        return Timeline.secondOf(member.joinedOn().plusMonths(month)) + member.billingTime();
    }

    /** One member's state while their months are lived through. */
    private final class Membership {

        private final MemberProfile member;
        private final SplittableRandom random;
        private final List<PlanPeriod> plans = new ArrayList<>();
        private final List<Ride> rides = new ArrayList<>();
        private final List<Payment> payments = new ArrayList<>();
        private final List<Ticket> tickets = new ArrayList<>();
        private final List<Long> failures = new ArrayList<>();
        private final List<Long> badRatings = new ArrayList<>();
        private Plan plan;
        private boolean paused;
        private long statusChangedAt;
        private long busyUntil;
        private int ridesLastMonth;
        private Plan planLastMonth;
        private boolean pausedLastMonth;
        private Cancellation cancellation;

        Membership(MemberProfile member, SplittableRandom random) {
            this.member = member;
            this.random = random;
            this.plan = member.firstPlan(random);
            this.planLastMonth = plan;
            plans.add(new PlanPeriod(member.id(), plan, member.joinedOn(), null));
            // The account is switched on once the sign-up has been checked, minutes to a day and a half later.
            this.statusChangedAt = Math.min(Timeline.END - 1,
                    member.joinedAt() + Draws.uniform(random, 2 * Timeline.MINUTE, 36 * Timeline.HOUR));
            this.busyUntil = member.joinedAt();
        }

        boolean hasEnded() {
            return cancellation != null;
        }

        void live(int month) {
            long start = billingInstant(member, month);
            long next = Math.min(billingInstant(member, month + 1), Timeline.END);
            if (month > 0) {
                reconsiderPause(start);
                reconsiderPlan(start);
            }
            List<Payment> failedCharges = bill(month, start);
            considerLeaving(month, start, next);
            long activeUntil = hasEnded() ? cancellation.cancelledAt() : next;
            long deadline = hasEnded() ? cancellation.cancelledAt() : Timeline.END;
            List<Ride> monthRides = paused
                    ? List.of()
                    : rideMaker.between(member, start, activeUntil, deadline, busyUntil, random);
            if (!monthRides.isEmpty()) {
                busyUntil = monthRides.get(monthRides.size() - 1).endedAt();
            }
            rides.addAll(monthRides);
            for (Ticket ticket : desk.opened(member, start, activeUntil, monthRides.size(), failedCharges, random)) {
                tickets.add(ticket);
                if (ticket.satisfaction() != null && ticket.satisfaction() <= 2) {
                    badRatings.add(ticket.closedAt());
                }
            }
            ridesLastMonth = monthRides.size();
            planLastMonth = plan;
            pausedLastMonth = paused;
        }

        /** Fading members pause more often; a pause lasts about half a year on average. */
        private void reconsiderPause(long start) {
            double odds = paused ? 0.15 : 0.004 + 0.03 * (1 - member.interestAt(start));
            if (Draws.chance(random, odds)) {
                paused = !paused;
                // Asked for in the last days of the month, effective from the billing day.
                statusChangedAt = start - Draws.uniform(random, Timeline.HOUR, 3 * Timeline.DAY);
            }
        }

        private void reconsiderPlan(long start) {
            if (paused || plans.size() >= MOST_PLANS || !Draws.chance(random, 0.03)) {
                return;
            }
            plan = switchFrom(plan, ridesLastMonth, random);
            LocalDate day = Timeline.dayOf(start);
            plans.set(plans.size() - 1, plans.get(plans.size() - 1).endingOn(day));
            plans.add(new PlanPeriod(member.id(), plan, day, null));
        }

        /** Last month's rides for pay-as-you-go, this month's fee in advance for a paid plan; returns what bounced. */
        private List<Payment> bill(int month, long start) {
            List<Payment> charges = new ArrayList<>();
            if (month > 0 && planLastMonth == Plan.PAY_AS_YOU_GO && ridesLastMonth > 0) {
                charge(start, Plan.PRICE_PER_RIDE * ridesLastMonth, charges);
            }
            if (plan.isPaid() && !paused) {
                long at = month == 0 ? start + Draws.uniform(random, Timeline.MINUTE, 10 * Timeline.MINUTE) : start;
                charge(at, plan.monthlyFee(), charges);
            }
            payments.addAll(charges);
            List<Payment> failed = charges.stream().filter(Payment::failed).toList();
            failed.forEach(p -> failures.add(p.paidAt()));
            return failed;
        }

        /** A charge that bounces is retried once three days later. */
        private void charge(long at, double amount, List<Payment> out) {
            if (Draws.chance(random, member.failureChance())) {
                out.add(new Payment(member.id(), at, amount, Payment.FAILED));
                long retryAt = at + 3 * Timeline.DAY + Draws.uniform(random, 0, 6 * Timeline.HOUR);
                out.add(new Payment(member.id(), retryAt, amount, Draws.chance(random, 0.7) ? Payment.PAID : Payment.FAILED));
            } else {
                out.add(new Payment(member.id(), at, amount, Draws.chance(random, 0.006) ? Payment.REFUNDED : Payment.PAID));
            }
        }

        private void considerLeaving(int month, long start, long next) {
            boolean failedRecently = happenedWithin(failures, start, 45 * Timeline.DAY);
            boolean idle = month > 0 && ridesLastMonth == 0 && (planLastMonth.isPaid() || pausedLastMonth);
            double interest = member.interestAt(start);
            double hazard = 0.010 + 0.05 * (1 - interest)
                    + (failedRecently ? 0.09 : 0)
                    + (happenedWithin(badRatings, start, 60 * Timeline.DAY) ? 0.07 : 0)
                    + (idle ? 0.03 : 0)
                    + (paused ? 0.04 : 0);
            long earliest = start + Timeline.DAY;
            if (earliest < next && Draws.chance(random, hazard)) {
                long at = Draws.uniform(random, earliest, next);
                cancellation = new Cancellation(member.id(), at,
                        reason(failedRecently, idle || paused || interest < 0.5, random));
            }
        }

        /** Drops what would fall after leaving and works out the member row's current state. */
        MemberLife settle() {
            if (cancellation == null) {
                payments.removeIf(p -> p.paidAt() >= Timeline.END);
                String status = paused ? MemberLife.PAUSED : MemberLife.ACTIVE;
                long updatedAt = statusChangedAt;
                if (!paused && Draws.chance(random, 0.2)) {
                    // An account clean-up late in 2025 rewrote many member rows: updated_at is not history.
                    updatedAt = Math.max(updatedAt,
                            Draws.uniform(random, Math.max(member.joinedAt(), LATE_TOUCH_FROM), Timeline.END));
                }
                return new MemberLife(member, status, updatedAt, plans, rides, payments, tickets, Optional.empty());
            }
            long leftAt = cancellation.cancelledAt();
            payments.removeIf(p -> p.paidAt() >= leftAt);
            List<Ticket> settled = new ArrayList<>();
            for (Ticket ticket : tickets) {
                settled.add(ticket.isOpenAt(leftAt) ? TicketDesk.closedOnLeaving(ticket, leftAt, random) : ticket);
            }
            plans.set(plans.size() - 1, plans.get(plans.size() - 1).endingOn(Timeline.dayOf(leftAt).plusDays(1)));
            return new MemberLife(member, MemberLife.CANCELLED, leftAt, plans, rides, payments, settled,
                    Optional.of(cancellation));
        }
    }

    /** Members move to the plan that last month's riding would have made cheapest, or to a family plan. */
    private static Plan switchFrom(Plan current, int ridesLastMonth, SplittableRandom random) {
        double payAsYouGo = Plan.PRICE_PER_RIDE * ridesLastMonth;
        Plan pick = Draws.chance(random, 0.1) ? Plan.FAMILY
                : payAsYouGo > Plan.UNLIMITED.monthlyFee() ? Plan.UNLIMITED
                : payAsYouGo > Plan.COMMUTER.monthlyFee() ? Plan.COMMUTER
                : Plan.PAY_AS_YOU_GO;
        while (pick == current) {
            pick = Plan.values()[random.nextInt(Plan.values().length)];
        }
        return pick;
    }

    private static String reason(boolean failedRecently, boolean idle, SplittableRandom random) {
        if (failedRecently && Draws.chance(random, 0.7)) {
            return "too expensive";
        }
        return REASONS[Draws.weighted(random, idle ? IDLE_WEIGHTS : CALM_WEIGHTS)];
    }

    private static boolean happenedWithin(List<Long> instants, long now, long span) {
        for (long at : instants) {
            if (at <= now && at > now - span) {
                return true;
            }
        }
        return false;
    }
}
