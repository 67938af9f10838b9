package org.voteworth.api;

import java.util.Objects;

/**
 * Something a notebook shows: its content in one MIME type (Markdown, HTML or SVG) and a plain
 * text form for terminals and for {@link Object#toString()}. The notebook runner writes both into
 * the cell's outputs; a Jupyter front end shows the rich one.
 */
public interface Display {
    /** The MIME type of {@link #content()}, e.g. {@code text/markdown}, {@code text/html}, {@code image/svg+xml}. */
    String mimeType();

    /** The rich form. */
    String content();

    /** The plain text form. */
    String text();

    /** Markdown with its plain text form. */
    static Display markdown(String markdown, String text) {
        return new Shown("text/markdown", markdown, text);
    }

    /** An HTML fragment with its plain text form. */
    static Display html(String html, String text) {
        return new Shown("text/html", html, text);
    }

    /** An SVG image with a plain text description. */
    static Display svg(String svg, String text) {
        return new Shown("image/svg+xml", svg, text);
    }

    /** A display that is only text. */
    static Display text(String text) {
        return new Shown("text/plain", text, text);
    }

    /** The plain display record behind the factories. */
    record Shown(String mimeType, String content, String text) implements Display {
        public Shown {
            Objects.requireNonNull(mimeType, "mimeType");
            Objects.requireNonNull(content, "content");
            Objects.requireNonNull(text, "text");
        }

        @Override
        public String toString() {
            return text;
        }
    }
}
