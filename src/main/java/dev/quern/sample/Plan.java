package dev.quern.sample;

/** The club's invented membership plans and their fixed monthly fees. */
enum Plan {
    PAY_AS_YOU_GO("pay-as-you-go", 0.0),
    COMMUTER("commuter", 19.0),
    UNLIMITED("unlimited", 34.0),
    FAMILY("family", 49.0);

    /** What a pay-as-you-go member is billed per ride, once a month for the month before. */
    static final double PRICE_PER_RIDE = 1.50;

    private final String label;
    private final double monthlyFee;

    Plan(String label, double monthlyFee) {
        this.label = label;
        this.monthlyFee = monthlyFee;
    }

    String label() {
        return label;
    }

    double monthlyFee() {
        return monthlyFee;
    }

    boolean isPaid() {
        return monthlyFee > 0;
    }
}
