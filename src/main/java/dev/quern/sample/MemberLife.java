package dev.quern.sample;

import java.util.List;
import java.util.Optional;

/**
 * Everything one simulated member did from joining to the end of the data, ready to be written:
 * the member row's current state ({@code status}, {@code updatedAt}) and their rows in every other table.
 */
record MemberLife(
        MemberProfile profile,
        String status,
        long updatedAt,
        List<PlanPeriod> plans,
        List<Ride> rides,
        List<Payment> payments,
        List<Ticket> tickets,
        Optional<Cancellation> cancellation) {

    static final String ACTIVE = "active";
    static final String PAUSED = "paused";
    static final String CANCELLED = "cancelled";

    MemberLife {
        plans = List.copyOf(plans);
        rides = List.copyOf(rides);
        payments = List.copyOf(payments);
        tickets = List.copyOf(tickets);
    }
}
