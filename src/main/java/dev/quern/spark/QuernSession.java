package dev.quern.spark;

import org.apache.spark.sql.classic.SparkSession;

/**
 * The Spark session a Quern connection runs in: a new session of the running Spark application (its own
 * temporary views and settings, the cluster's context), or of a local one when none runs.
 */
final class QuernSession {

    private QuernSession() {
    }

    static SparkSession fresh() {
        SparkSession.Builder builder = SparkSession.builder().appName("quern");
        // spark-submit passes the master as a system property; anything else (java -cp, an IDE) runs locally,
        // where Spark's INFO lines (thousands for one build) would bury Quern's own progress and messages.
        // Under spark-submit the cluster's logging settings stand.
        if (System.getProperty("spark.master") == null) {
            builder = builder.master("local[*]").config("spark.ui.enabled", "false").config("spark.log.level", "WARN");
        }
        SparkSession session = builder.getOrCreate().newSession();
        // The compiled query quotes names with double quotes (jOOQ's rendering); Spark reads them as
        // identifiers only with this setting, and as string literals without it.
        session.conf().set("spark.sql.ansi.doubleQuotedIdentifiers", "true");
        // java.time values: dates decode without reflective access to sun.util.calendar on Java 17, and never
        // pass through the JVM's time zone.
        session.conf().set("spark.sql.datetime.java8API.enabled", "true");
        // Times without a zone are read as written; the day boundaries are computed in UTC-free dates.
        session.conf().set("spark.sql.session.timeZone", "UTC");
        // jOOQ casts to varchar(n) (time columns kept as text, day boundaries as text). Spark 4 treats such a
        // cast as a cast to string anyway, and warns on every query unless told to do so as Spark 3.0 did.
        session.conf().set("spark.sql.legacy.charVarcharAsString", "true");
        // ANSI mode (Spark 4's default) makes a bad cast or an overflow an error rather than a silent null.
        session.conf().set("spark.sql.ansi.enabled", "true");
        return session;
    }
}
