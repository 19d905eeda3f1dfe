package dev.quern.sample;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

/** The club's stations, a handful per zone, with invented street-like names. */
final class StationMap {

    private static final int STATIONS_PER_ZONE = 9;

    private static final String[] FIRST_WORDS = {
        "Mill", "Harbour", "Copper", "Willow", "Lantern", "Orchard", "Foundry", "Heron", "Tanner", "Bell",
        "Granary", "Kestrel", "Ropewalk", "Salt", "Weaver", "Cobble", "Ferry", "Larch", "Brewer", "Chalk",
        "Signal", "Quarry", "Meadow", "Tollgate", "Pebble", "Rook", "Clockhouse", "Thistle", "Marsh", "Beacon"
    };
    private static final String[] SECOND_WORDS = {
        "Lane", "Steps", "Yard", "Green", "Square", "Row", "Quay", "Gate", "Cross", "Walk", "Court", "Bridge"
    };

    private final List<Station> stations;
    private final List<List<Station>> byZone;

    private StationMap(List<Station> stations) {
        this.stations = List.copyOf(stations);
        List<List<Station>> grouped = new ArrayList<>();
        for (Zone zone : Zone.values()) {
            grouped.add(stations.stream().filter(s -> s.zone() == zone).toList());
        }
        this.byZone = List.copyOf(grouped);
    }

    static StationMap draw(SplittableRandom random) {
        List<String> names = new ArrayList<>();
        List<Station> stations = new ArrayList<>();
        int id = 1;
        for (Zone zone : Zone.values()) {
            for (int i = 0; i < STATIONS_PER_ZONE; i++) {
                String name = freshName(random, names);
                // The centre has the busiest, largest stations.
                int docks = zone == Zone.CENTRE ? 18 + random.nextInt(23) : 10 + random.nextInt(17);
                double x = zone.x() + (random.nextDouble() * 2 - 1) * 1.8;
                double y = zone.y() + (random.nextDouble() * 2 - 1) * 1.8;
                stations.add(new Station(id++, name, zone, docks, x, y));
            }
        }
        return new StationMap(stations);
    }

    private static String freshName(SplittableRandom random, List<String> taken) {
        while (true) {
            String name = FIRST_WORDS[random.nextInt(FIRST_WORDS.length)] + " "
                    + SECOND_WORDS[random.nextInt(SECOND_WORDS.length)];
            if (!taken.contains(name)) {
                taken.add(name);
                return name;
            }
        }
    }

    List<Station> all() {
        return stations;
    }

    Station anyIn(Zone zone, SplittableRandom random) {
        List<Station> candidates = byZone.get(zone.ordinal());
        return candidates.get(random.nextInt(candidates.size()));
    }

    Station any(SplittableRandom random) {
        return stations.get(random.nextInt(stations.size()));
    }
}
