package dev.quern.sample;

/** One charge to a member; {@code status} is paid, failed or refunded. */
record Payment(int memberId, long paidAt, double amount, String status) {

    static final String PAID = "paid";
    static final String FAILED = "failed";
    static final String REFUNDED = "refunded";

    boolean failed() {
        return FAILED.equals(status);
    }
}
