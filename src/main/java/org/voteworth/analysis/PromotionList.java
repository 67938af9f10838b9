package org.voteworth.analysis;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.voteworth.tally.Csv;

/**
 * A list of reviewer ids someone promoted, read from a file: one id per line (blank lines and
 * lines starting with {@code #} skipped), or a CSV whose header has a {@code reviewer_id} column.
 *
 * @param source where it came from, for reports
 * @param ids distinct ids in file order
 * @param duplicates ids listed more than once (each named once)
 */
public record PromotionList(String source, List<String> ids, List<String> duplicates) {
    public PromotionList {
        ids = List.copyOf(ids);
        duplicates = List.copyOf(duplicates);
    }

    public static PromotionList of(String source, List<String> ids) {
        Set<String> seen = new LinkedHashSet<>();
        Set<String> dup = new LinkedHashSet<>();
        for (String id : ids) {
            if (!seen.add(id)) {
                dup.add(id);
            }
        }
        return new PromotionList(source, new ArrayList<>(seen), new ArrayList<>(dup));
    }

    public static PromotionList read(Path file) throws IOException {
        List<String> lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        List<String> ids = new ArrayList<>();
        int column = -1;
        boolean first = true;
        for (int n = 0; n < lines.size(); n++) {
            String line = lines.get(n).strip();
            if (n == 0 && line.startsWith("\uFEFF")) {
                line = line.substring(1);
            }
            if (line.isEmpty() || line.startsWith("#")) {
                continue;
            }
            if (first) {
                first = false;
                List<String> cells = Csv.parseLine(line);
                for (int c = 0; c < cells.size(); c++) {
                    if (cells.get(c).strip().toLowerCase(Locale.ROOT).equals("reviewer_id")) {
                        column = c;
                    }
                }
                if (column >= 0) {
                    continue;
                }
                if (cells.size() > 1) {
                    throw new IllegalArgumentException(file + " line " + (n + 1) + ": a CSV promotion list needs a header with a"
                            + " reviewer_id column; this line has " + cells.size() + " cells and none is reviewer_id."
                            + " Give one id per line, or add the header.");
                }
            }
            if (column >= 0) {
                List<String> cells = Csv.parseLine(line);
                if (column >= cells.size() || cells.get(column).isBlank()) {
                    throw new IllegalArgumentException(file + " line " + (n + 1) + ": no reviewer_id in column " + (column + 1)
                            + " ('" + line + "'); fill it in or delete the line.");
                }
                ids.add(cells.get(column).strip());
            } else {
                ids.add(line);
            }
        }
        if (ids.isEmpty()) {
            throw new IllegalArgumentException(file + ": the promotion list has no reviewer ids (only blank or # lines)");
        }
        return of(file.toString(), ids);
    }
}
