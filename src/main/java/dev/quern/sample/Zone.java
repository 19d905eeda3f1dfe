package dev.quern.sample;

/**
 * The club's invented districts. Each sits at a notional place on a flat map (kilometres from the centre),
 * so that ride distances between stations in different zones come out longer than within one.
 */
enum Zone {
    CENTRE("centre", 0.0, 0.0, 0.30),
    NORTH("north", 0.5, 5.5, 0.20),
    RIVER("river", -4.5, -1.0, 0.20),
    EAST("east", 5.0, 0.5, 0.15),
    HILLS("hills", 2.0, -6.0, 0.15);

    private final String label;
    private final double x;
    private final double y;
    /** Share of members living there; the centre is densest. */
    private final double residents;

    Zone(String label, double x, double y, double residents) {
        this.label = label;
        this.x = x;
        this.y = y;
        this.residents = residents;
    }

    String label() {
        return label;
    }

    double x() {
        return x;
    }

    double y() {
        return y;
    }

    double residents() {
        return residents;
    }
}
