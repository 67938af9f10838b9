package org.voteworth.api;

import java.util.Objects;

/**
 * An analysis result together with how a person reads it: {@link #result()} is the value to
 * compute with (e.g. a {@link org.voteworth.analysis.SweepResult}), the rest is the report the
 * project's writers make of it, in Markdown with its cautions and as a plain text table.
 *
 * @param result the result value
 * @param mimeType {@code text/markdown}
 * @param content the Markdown report
 * @param text the terminal report
 * @param <T> the result's type
 */
public record Report<T>(T result, String mimeType, String content, String text) implements Display {
    public Report {
        Objects.requireNonNull(result, "result");
        Objects.requireNonNull(mimeType, "mimeType");
        Objects.requireNonNull(content, "content");
        Objects.requireNonNull(text, "text");
    }

    static <T> Report<T> markdown(T result, String markdown, String text) {
        return new Report<>(result, "text/markdown", markdown, text);
    }

    @Override
    public String toString() {
        return text;
    }
}
