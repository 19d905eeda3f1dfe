package dev.quern.spark;

import java.sql.SQLException;

/** What every proxy of the facade answers alike: its identity, its name, and that it wraps nothing. */
final class ObjectMethods {

    /** Returned for a method that is not one of these: the proxy's own handler answers it. */
    static final Object NOT_COMMON = new Object();

    private ObjectMethods() {
    }

    static Object answer(String name, Object proxy, Object[] args, String label) throws SQLException {
        return switch (name) {
            case "unwrap" -> throw new SQLException("not a wrapper");
            case "isWrapperFor" -> false;
            case "hashCode" -> System.identityHashCode(proxy);
            case "equals" -> proxy == args[0];
            case "toString" -> label;
            default -> NOT_COMMON;
        };
    }
}
