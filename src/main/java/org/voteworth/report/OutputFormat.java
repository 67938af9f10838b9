package org.voteworth.report;

import java.util.Locale;

/** The output formats every command offers: a terminal table for people, the rest for files and tools. */
public enum OutputFormat {
    TABLE("txt"), MD("md"), CSV("csv"), JSON("json");

    private final String extension;

    OutputFormat(String extension) {
        this.extension = extension;
    }

    /** File extension without the dot. */
    public String extension() {
        return extension;
    }

    public static OutputFormat parse(String s) {
        try {
            return valueOf(s.trim().toUpperCase(Locale.ROOT));
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("unknown format '" + s + "': use table, md, csv or json");
        }
    }
}
