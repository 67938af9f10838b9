package org.voteworth.source;

/**
 * How the fields of a dump row are separated.
 *
 * <p>{@link #TSV} is the default: fields end at a tab, a quote is ordinary data (review text
 * quotes freely). {@link #CSV} follows RFC 4180 (https://www.rfc-editor.org/rfc/rfc4180):
 * comma-separated, a field may be enclosed in double quotes, {@code ""} inside stands for one
 * quote and a quoted field may contain commas. A line break inside quotes is not supported: such
 * a row is rejected (reason {@code bad-quote}), see {@link RowParser}.
 */
public enum Format {
    TSV((byte) '\t'),
    CSV((byte) ',');

    private final byte delimiter;

    Format(byte delimiter) {
        this.delimiter = delimiter;
    }

    /** The byte that ends a field. */
    public byte delimiter() {
        return delimiter;
    }
}
