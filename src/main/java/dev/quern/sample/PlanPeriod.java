package dev.quern.sample;

import java.time.LocalDate;

/** One row of a member's plan history: in force from {@code validFrom} up to, not including, {@code validTo}. */
record PlanPeriod(int memberId, Plan plan, LocalDate validFrom, LocalDate validTo) {

    PlanPeriod endingOn(LocalDate day) {
        return new PlanPeriod(memberId, plan, validFrom, day);
    }
}
