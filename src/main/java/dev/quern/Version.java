package dev.quern;

import java.io.IOException;
import java.io.InputStream;
import java.util.Properties;

/** The version of this build of Quern, as Maven stamped it. */
public final class Version {

    private static final String VERSION = load();

    private Version() {
    }

    public static String current() {
        return VERSION;
    }

    private static String load() {
        try (InputStream in = Version.class.getResourceAsStream("version.properties")) {
            if (in == null) {
                return "unknown";
            }
            Properties p = new Properties();
            p.load(in);
            return p.getProperty("version", "unknown");
        } catch (IOException e) {
            return "unknown";
        }
    }
}
