package dev.quern.sample;

/** One docking station, with its place on the notional map that ride distances are measured on. */
record Station(int id, String name, Zone zone, int docks, double x, double y) {

    double kilometresTo(Station other) {
        return StrictMath.hypot(x - other.x, y - other.y);
    }
}
