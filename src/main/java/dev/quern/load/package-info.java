/**
 * Loading: copies every table of a SQLite database (the sample, or a user's) into a PostgreSQL, MariaDB,
 * MySQL or DuckDB database, with proper column types and indexes on keys and times, so that the same
 * recipe can be built there. This is the only place Quern writes to a database, and only to the target
 * the user names; it refuses to overwrite a table unless asked to replace it. Entry: {@link
 * dev.quern.load.DatabaseLoader}.
 */
package dev.quern.load;
