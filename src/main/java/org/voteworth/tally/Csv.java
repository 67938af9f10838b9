package org.voteworth.tally;

import java.util.ArrayList;
import java.util.List;

/**
 * The one CSV dialect voteworth writes and reads back: RFC 4180 quoting, comma separated.
 *
 * <p>Text cells that a spreadsheet would run as a formula (first character {@code = + - @}, tab
 * or carriage return) are written with a leading apostrophe, and {@link #parseLine} removes it
 * again, so ids round-trip exactly while a spreadsheet shows them as text.
 */
public final class Csv {
    private Csv() {
    }

    /** A text cell, quoted when needed and neutralised against formula injection. */
    public static String text(String s) {
        String v = s;
        if (!v.isEmpty() && (isTrigger(v.charAt(0)) || v.charAt(0) == '\'' && v.length() > 1 && isTrigger(v.charAt(1)))) {
            v = "'" + v;
        }
        boolean quote = false;
        for (int i = 0; i < v.length() && !quote; i++) {
            char c = v.charAt(i);
            quote = c == ',' || c == '"' || c == '\n' || c == '\r';
        }
        return quote ? '"' + v.replace("\"", "\"\"") + '"' : v;
    }

    /** Splits one CSV line into unquoted, un-neutralised cells. Quoted line breaks are not supported. */
    public static List<String> parseLine(String line) {
        List<String> cells = new ArrayList<>();
        StringBuilder cur = new StringBuilder();
        boolean quoted = false;
        boolean wasQuoted = false;
        for (int i = 0; i < line.length(); i++) {
            char c = line.charAt(i);
            if (quoted) {
                if (c == '"') {
                    if (i + 1 < line.length() && line.charAt(i + 1) == '"') {
                        cur.append('"');
                        i++;
                    } else {
                        quoted = false;
                    }
                } else {
                    cur.append(c);
                }
            } else if (c == '"' && cur.length() == 0) {
                quoted = true;
                wasQuoted = true;
            } else if (c == ',') {
                cells.add(unneutralise(cur.toString()));
                cur.setLength(0);
                wasQuoted = false;
            } else {
                cur.append(c);
            }
        }
        if (quoted) {
            throw new IllegalArgumentException("unterminated quoted cell");
        }
        cells.add(unneutralise(cur.toString()));
        return cells;
    }

    private static String unneutralise(String v) {
        return v.length() > 1 && v.charAt(0) == '\'' && (isTrigger(v.charAt(1)) || v.length() > 2 && v.charAt(1) == '\'' && isTrigger(v.charAt(2)))
                ? v.substring(1) : v;
    }

    private static boolean isTrigger(char c) {
        return c == '=' || c == '+' || c == '-' || c == '@' || c == '\t' || c == '\r';
    }
}
