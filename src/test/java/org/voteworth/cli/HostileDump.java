package org.voteworth.cli;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * A tiny dump whose reviewer ids and categories carry markup and spreadsheet formulas, to show
 * that no output runs what the data holds. Invented for these tests.
 */
final class HostileDump {
    /** Set by any script from the data that runs in the page; it must stay undefined. */
    static final String MARKER = "__injected";
    static final String SCRIPT_ID = "<script>window." + MARKER + "=1</script>";
    static final String IMG_ID = "\"><img src=x onerror=\"window." + MARKER + "=2\">";
    static final String FORMULA_ID = "=HYPERLINK(\"http://example.invalid\",\"x\")";
    static final String SCRIPT_CATEGORY = "<script>window." + MARKER + "=3</script>";
    static final List<String> IDS = List.of(SCRIPT_ID, IMG_ID, FORMULA_ID, "+plain-41", "@reviewer-7", "reviewer-8");

    private HostileDump() {
    }

    /** Writes {@code dir/hostile.tsv}: each reviewer a few reviews with votes, half in the hostile category. */
    static Path write(Path dir) throws IOException {
        Files.createDirectories(dir);
        List<String> lines = new ArrayList<>();
        lines.add("reviewer_id\treview_id\titem_id\tcategory\tstar_rating\thelpful_votes\ttotal_votes\tverified_purchase"
                + "\tincentivised\theadline\tbody\treview_date");
        int review = 0;
        for (int r = 0; r < IDS.size(); r++) {
            for (int i = 0; i < 4; i++) {
                String category = i % 2 == 0 ? SCRIPT_CATEGORY : "Garden & Outdoors";
                int total = 3 + 5 * r + i;
                int helpful = Math.max(0, total - r - i % 2);
                lines.add(String.join("\t", IDS.get(r), "RV" + review++, "IT" + i, category, Integer.toString(1 + (r + i) % 5),
                        Integer.toString(helpful), Integer.toString(total), "Y", "N", "<b>headline</b>", "body", "2025-0" + (1 + i) + "-15"));
            }
        }
        Path f = dir.resolve("hostile.tsv");
        Files.write(f, lines);
        return f;
    }
}
