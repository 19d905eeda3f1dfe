package dev.quern.run;

/** The file format of the modelling table. */
public enum MatrixFormat {
    /** RFC 4180 text, one header line: {@code matrix.csv}. */
    CSV("matrix.csv"),
    /** Apache Parquet with typed columns, written by DuckDB from the CSV: {@code matrix.parquet}. */
    PARQUET("matrix.parquet");

    private final String fileName;

    MatrixFormat(String fileName) {
        this.fileName = fileName;
    }

    public String fileName() {
        return fileName;
    }
}
