package dev.quern.engines;

import dev.quern.Position;
import dev.quern.recipe.Name;
import dev.quern.run.ValueFormat;
import dev.quern.schema.Engine;
import dev.quern.schema.Source;
import java.math.BigDecimal;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.format.DateTimeFormatter;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * A fingerprint of every row of some tables: per table the row count and the sum of each row's SHA-256
 * (first 8 bytes), which does not depend on the order rows come back in. Values are written the same way
 * whatever the engine returns (a DATE and SQLite's '2025-01-31' text alike), so that a table loaded into
 * another engine has the fingerprint of the SQLite original. Read through Quern's own read-only
 * connection, so that taking it changes nothing either.
 */
final class Checksums {

    private static final DateTimeFormatter SECONDS = DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm:ss");

    private Checksums() {
    }

    static Map<String, String> of(String url, List<String> tables) throws SQLException {
        Map<String, String> sums = new TreeMap<>();
        Source source = Source.of(new Name(url, Position.NONE), Path.of("").toAbsolutePath());
        try (Connection c = source.open()) {
            for (String table : tables) {
                sums.put(table, of(c, source.engine(), table));
            }
        }
        return sums;
    }

    private static String of(Connection c, Engine engine, String table) throws SQLException {
        MessageDigest sha = sha256();
        long rows = 0;
        long sum = 0;
        try (Statement s = c.createStatement(); ResultSet rs = s.executeQuery("select * from " + table)) {
            int[] types = ValueFormat.readTypes(rs.getMetaData(), engine);
            while (rs.next()) {
                StringBuilder row = new StringBuilder();
                for (int i = 1; i <= types.length; i++) {
                    row.append(text(ValueFormat.read(rs, i, types[i - 1]))).append('\u0001');
                }
                byte[] h = sha.digest(row.toString().getBytes(StandardCharsets.UTF_8));
                long v = 0;
                for (int i = 0; i < 8; i++) {
                    v = (v << 8) | (h[i] & 0xff);
                }
                sum += v;
                rows++;
            }
        }
        return rows + " rows, " + Long.toHexString(sum);
    }

    static String text(Object value) {
        if (value == null) {
            return "\u0000";
        }
        if (value instanceof java.sql.Timestamp t) {
            value = t.toLocalDateTime();
        }
        if (value instanceof java.sql.Date d) {
            value = d.toLocalDate();
        }
        if (value instanceof LocalDateTime t) {
            String seconds = SECONDS.format(t);
            return t.getNano() == 0 ? seconds : seconds + "." + String.format("%09d", t.getNano()).replaceAll("0+$", "");
        }
        if (value instanceof LocalDate d) {
            return d.toString();
        }
        if (value instanceof Double || value instanceof Float) {
            return BigDecimal.valueOf(((Number) value).doubleValue()).stripTrailingZeros().toPlainString();
        }
        if (value instanceof BigDecimal b) {
            return b.stripTrailingZeros().toPlainString();
        }
        if (value instanceof byte[] bytes) {
            return HexFormat.of().formatHex(bytes);
        }
        return value.toString();
    }

    private static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }
}
