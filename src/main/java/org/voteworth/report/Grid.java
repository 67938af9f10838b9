package org.voteworth.report;

import java.util.ArrayList;
import java.util.List;
import java.util.StringJoiner;
import org.voteworth.tally.Csv;

/**
 * A table of text cells that renders as an aligned terminal table, a Markdown table or CSV, so
 * every command shows the same columns in every format. Numeric columns are right-aligned.
 */
public final class Grid {
    private final List<String> headers;
    private final boolean[] numeric;
    private final List<List<String>> rows = new ArrayList<>();

    /** Headers ending in {@code >} mark right-aligned (numeric) columns; the marker is not shown. */
    public Grid(List<String> headers) {
        this.headers = new ArrayList<>();
        this.numeric = new boolean[headers.size()];
        for (int i = 0; i < headers.size(); i++) {
            String h = headers.get(i);
            numeric[i] = h.endsWith(">");
            this.headers.add(numeric[i] ? h.substring(0, h.length() - 1) : h);
        }
    }

    public Grid add(List<String> row) {
        if (row.size() != headers.size()) {
            throw new IllegalArgumentException("row has " + row.size() + " cells, table has " + headers.size() + " columns");
        }
        rows.add(List.copyOf(row));
        return this;
    }

    public int size() {
        return rows.size();
    }

    public List<String> headers() {
        return List.copyOf(headers);
    }

    /** Whether column {@code i} holds numbers (its header was marked with {@code >}). */
    public boolean numeric(int i) {
        return numeric[i];
    }

    public List<List<String>> rows() {
        return List.copyOf(rows);
    }

    /** Aligned columns separated by two spaces, a rule under the header. */
    public String toText() {
        int[] w = widths();
        StringBuilder b = new StringBuilder();
        line(b, headers, w, "  ");
        StringJoiner rule = new StringJoiner("  ");
        for (int x : w) {
            rule.add("-".repeat(x));
        }
        b.append(rule).append('\n');
        rows.forEach(r -> line(b, r, w, "  "));
        return b.toString();
    }

    /** A GitHub-flavoured Markdown table; pipes in cells are escaped. */
    public String toMarkdown() {
        StringBuilder b = new StringBuilder();
        b.append('|');
        headers.forEach(h -> b.append(' ').append(md(h)).append(" |"));
        b.append("\n|");
        for (boolean n : numeric) {
            b.append(n ? "---:|" : "---|");
        }
        b.append('\n');
        for (List<String> r : rows) {
            b.append('|');
            r.forEach(c -> b.append(' ').append(md(c)).append(" |"));
            b.append('\n');
        }
        return b.toString();
    }

    /** CSV with a header row; text cells are quoted and neutralised against spreadsheet formulas. */
    public String toCsv() {
        StringBuilder b = new StringBuilder();
        csvLine(b, headers, false);
        rows.forEach(r -> csvLine(b, r, true));
        return b.toString();
    }

    private void csvLine(StringBuilder b, List<String> cells, boolean typed) {
        StringJoiner j = new StringJoiner(",");
        for (int i = 0; i < cells.size(); i++) {
            String c = cells.get(i);
            j.add(typed && numeric[i] && isNumber(c) ? c : Csv.text(c));
        }
        b.append(j).append('\n');
    }

    private static boolean isNumber(String c) {
        return c.matches("-?[0-9]+(\\.[0-9]+)?([eE]-?[0-9]+)?");
    }

    private int[] widths() {
        int[] w = new int[headers.size()];
        for (int i = 0; i < w.length; i++) {
            w[i] = headers.get(i).length();
        }
        for (List<String> r : rows) {
            for (int i = 0; i < w.length; i++) {
                w[i] = Math.max(w[i], r.get(i).length());
            }
        }
        return w;
    }

    private void line(StringBuilder b, List<String> cells, int[] w, String sep) {
        StringBuilder l = new StringBuilder();
        for (int i = 0; i < cells.size(); i++) {
            if (i > 0) {
                l.append(sep);
            }
            String c = cells.get(i);
            String pad = " ".repeat(w[i] - c.length());
            l.append(numeric[i] ? pad + c : c + pad);
        }
        b.append(l.toString().stripTrailing()).append('\n');
    }

    private static String md(String s) {
        return s.replace("\\", "\\\\").replace("|", "\\|").replace("\n", " ");
    }
}
