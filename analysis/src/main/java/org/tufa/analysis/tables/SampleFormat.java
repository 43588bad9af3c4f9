package org.tufa.analysis.tables;

import java.util.Locale;

/** How per-sample tables are written. */
public enum SampleFormat {
    /** Apache Parquet, gzip-compressed pages: the default, a fraction of the CSV's size. */
    PARQUET("parquet"),
    /** Comma-separated text with a header row, for tools that read nothing else. */
    CSV("csv");

    private final String extension;

    SampleFormat(String extension) {
        this.extension = extension;
    }

    /** The file name extension, without the dot. */
    public String extension() {
        return extension;
    }

    /**
     * @throws IllegalArgumentException for another name
     */
    public static SampleFormat fromName(String name) {
        for (SampleFormat f : values()) {
            if (f.extension.equals(name.toLowerCase(Locale.ROOT))) {
                return f;
            }
        }
        throw new IllegalArgumentException(name);
    }
}
