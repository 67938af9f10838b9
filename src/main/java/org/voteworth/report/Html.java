package org.voteworth.report;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.List;

/**
 * The pieces of the HTML report: the one escape function every value from the input passes
 * through before it reaches the page, and the sortable, filterable, paginated table.
 */
public final class Html {
    /** Rows a table shows at once; sorting and filtering cover all of its rows. */
    public static final int PAGE_SIZE = 50;
    /** Text cells longer than this get a wide column, so a long list of categories or reasons does not make a tall row. */
    private static final int LONG = 40;

    private Html() {
    }

    /**
     * Text made safe for HTML element content and quoted attribute values: {@code & < > " '}
     * become character references, so a value like {@code <script>} shows as text.
     */
    public static String escape(String s) {
        StringBuilder b = new StringBuilder(s.length() + 16);
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '&' -> b.append("&amp;");
                case '<' -> b.append("&lt;");
                case '>' -> b.append("&gt;");
                case '"' -> b.append("&quot;");
                case '\'' -> b.append("&#39;");
                default -> b.append(c);
            }
        }
        return b.toString();
    }

    /**
     * A table of {@code g}: numeric columns right-aligned in tabular figures, every header sorts,
     * a filter box searches the text columns (reviewer ids, categories, flags), and rows come
     * {@link #PAGE_SIZE} to a page (without the script, the first page shows).
     *
     * @param id the table's HTML id (letters, digits, dashes)
     * @param filterHint what the filter box searches, e.g. "reviewer id or category"
     */
    static String table(Grid g, String id, String filterHint) {
        StringBuilder b = new StringBuilder();
        b.append("<div class=\"data-table\" id=\"").append(escape(id)).append("\" data-page-size=\"").append(PAGE_SIZE)
                .append("\">\n<div class=\"controls\"><label>Filter <input type=\"search\" class=\"filter\" placeholder=\"")
                .append(escape(filterHint)).append("\" aria-label=\"filter by ").append(escape(filterHint))
                .append("\"></label><button type=\"button\" class=\"prev\">&lsaquo; previous</button>")
                .append("<button type=\"button\" class=\"next\">next &rsaquo;</button><span class=\"status\">")
                .append(g.size()).append(" rows</span></div>\n<table>\n<thead><tr>");
        List<String> h = g.headers();
        for (int i = 0; i < h.size(); i++) {
            b.append("<th").append(g.numeric(i) ? " class=\"num\"" : "").append(" aria-sort=\"none\"><button type=\"button\">")
                    .append(escape(h.get(i))).append("</button></th>");
        }
        b.append("</tr></thead>\n<tbody>\n");
        List<List<String>> rows = g.rows();
        for (int r = 0; r < rows.size(); r++) {
            List<String> row = rows.get(r);
            // Rows past the first page start hidden, so a long table costs the browser no layout before the script pages it.
            b.append(r < PAGE_SIZE ? "<tr>" : "<tr hidden>");
            for (int i = 0; i < row.size(); i++) {
                String c = row.get(i);
                b.append(g.numeric(i) ? "<td class=\"num\">" : c.length() > LONG ? "<td class=\"long\">" : "<td>")
                        .append(escape(c)).append("</td>");
            }
            b.append("</tr>\n");
        }
        return b.append("</tbody>\n</table>\n</div>\n").toString();
    }

    /** A resource of this package as text (the report's style sheet and script). */
    static String resource(String name) {
        try (InputStream in = Html.class.getResourceAsStream(name)) {
            if (in == null) {
                throw new IllegalStateException("resource " + name + " is missing from the build");
            }
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
