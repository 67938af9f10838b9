package org.voteworth.source;

import java.util.Objects;

/**
 * How to read a dump.
 *
 * @param format TSV (default) or CSV
 * @param mapping header names → fields
 * @param categories category from the file name
 * @param maxRejectRate largest share of a file's rows that may be rejected, see {@link RejectRateLimit}
 */
public record SourceOptions(Format format, HeaderMapping mapping, CategoryFromName categories, double maxRejectRate) {
    public SourceOptions {
        Objects.requireNonNull(format, "format");
        Objects.requireNonNull(mapping, "mapping");
        Objects.requireNonNull(categories, "categories");
        new RejectRateLimit(maxRejectRate);
    }

    /** TSV, recognised header names, category from the file name, at most 5 % rejects. */
    public static SourceOptions defaults() {
        return new SourceOptions(Format.TSV, HeaderMapping.defaults(), CategoryFromName.defaults(), RejectRateLimit.DEFAULT_RATE);
    }

    public SourceOptions withFormat(Format f) {
        return new SourceOptions(f, mapping, categories, maxRejectRate);
    }

    public SourceOptions withMapping(HeaderMapping m) {
        return new SourceOptions(format, m, categories, maxRejectRate);
    }

    public SourceOptions withCategories(CategoryFromName c) {
        return new SourceOptions(format, mapping, c, maxRejectRate);
    }

    public SourceOptions withMaxRejectRate(double rate) {
        return new SourceOptions(format, mapping, categories, rate);
    }

    RejectRateLimit rejectRateLimit() {
        return new RejectRateLimit(maxRejectRate);
    }
}
