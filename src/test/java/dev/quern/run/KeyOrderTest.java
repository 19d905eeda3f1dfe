package dev.quern.run;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The merge of the ordered scan relies on sorting keys as the engine does. The reference is SQLite's own
 * ORDER BY ("Datatypes In SQLite", section 4.1, sqlite.org: numbers before text, numbers by value, text by
 * the BINARY collation, which compares the UTF-8 bytes with memcmp).
 */
class KeyOrderTest {

    @Test
    void sortsMixedValuesAsSqliteOrdersThem() throws SQLException {
        SplittableRandom random = new SplittableRandom(7);
        int[] pool = {'a', 'B', 'z', 'é', 0x7FF, 0x800, 0xFFFD, 0xE000, 0x1F6B2, 0x10348, '0', ' '};
        List<Object> values = new ArrayList<>();
        for (int i = 0; i < 2_000; i++) {
            switch (i % 4) {
                case 0 -> values.add(random.nextLong(-1_000_000, 1_000_000));
                case 1 -> values.add(random.nextInt(-50, 50) + random.nextInt(0, 4) * 0.5);
                default -> {
                    StringBuilder text = new StringBuilder();
                    for (int c = random.nextInt(0, 4); c >= 0; c--) {
                        text.appendCodePoint(pool[random.nextInt(pool.length)]);
                    }
                    values.add(text.toString());
                }
            }
        }
        try (Connection c = DriverManager.getConnection("jdbc:sqlite::memory:")) {
            try (Statement s = c.createStatement()) {
                s.execute("create table keys (k)");
            }
            try (PreparedStatement insert = c.prepareStatement("insert into keys values (?)")) {
                for (Object v : values) {
                    insert.setObject(1, v);
                    insert.addBatch();
                }
                insert.executeBatch();
            }
            List<Object> sqlite = new ArrayList<>();
            try (Statement s = c.createStatement(); ResultSet rs = s.executeQuery("select k from keys order by k")) {
                while (rs.next()) {
                    sqlite.add(rs.getObject(1));
                }
            }
            List<Object> ours = new ArrayList<>(sqlite);
            java.util.Collections.shuffle(ours, new java.util.Random(11));
            ours.sort(KeyOrder.INSTANCE);
            for (int i = 1; i < sqlite.size(); i++) {
                // Equal keys (1 and 1.0) may come in either order; every neighbour must be in order.
                int order = KeyOrder.INSTANCE.compare(sqlite.get(i - 1), sqlite.get(i));
                assertEquals(true, order <= 0, sqlite.get(i - 1) + " before " + sqlite.get(i));
            }
            assertEquals(sqlite.stream().map(KeyOrderTest::text).toList(), ours.stream().map(KeyOrderTest::text).toList());
        }
    }

    /**
     * Whole numbers compare exactly, as SQLite compares two integers, even where doubles could not tell them
     * apart; reals by value, with 0.0 and -0.0 equal (IEEE 754: they compare equal).
     */
    @Test
    void wholeNumbersCompareExactlyAndZerosAreEqual() {
        assertEquals(1, Integer.signum(KeyOrder.INSTANCE.compare(Long.MAX_VALUE, Long.MAX_VALUE - 1)));
        assertEquals(-1, Integer.signum(KeyOrder.INSTANCE.compare((1L << 53) + 1, (1L << 53) + 2)));
        assertEquals(0, KeyOrder.INSTANCE.compare(-0.0, 0.0));
        assertEquals(-1, Integer.signum(KeyOrder.INSTANCE.compare(1.5, 2.5)));
        assertEquals(0, KeyOrder.INSTANCE.compare(3L, 3.0));
    }

    /** Whole-valued reals print as whole numbers, so that 3 and 3.0, equal keys, compare as the same text. */
    private static String text(Object v) {
        if (v instanceof Double d && d == Math.rint(d)) {
            return Long.toString(d.longValue());
        }
        return String.valueOf(v);
    }
}
