package org.voteworth.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.voteworth.tally.Csv;

/** The one escape function of the HTML report, and the tables built on it, against hostile values. */
class HtmlTest {
    private static final List<String> HOSTILE = List.of("<script>alert(1)</script>", "\"><img src=x onerror=alert(1)>",
            "' onmouseover='alert(1)", "</textarea><svg onload=alert(1)>", "a & b", "<!-- -->");

    @Test
    void markupInAValueComesOutAsText() {
        // The five characters HTML gives meaning to in content and quoted attributes (HTML Living Standard, 13.1.2 and 13.2.5).
        assertThat(Html.escape("<script>alert('x') & \"y\"</script>"))
                .isEqualTo("&lt;script&gt;alert(&#39;x&#39;) &amp; &quot;y&quot;&lt;/script&gt;");
        for (String s : HOSTILE) {
            assertThat(Html.escape(s)).doesNotContain("<", ">", "\"", "'");
        }
        assertThat(Html.escape("Kitchen & Dining")).isEqualTo("Kitchen &amp; Dining");
        assertThat(Html.escape("plain-id_42")).isEqualTo("plain-id_42");
    }

    @Test
    void tablesEscapeEveryCellAndHeaderAndMarkNumericColumns() {
        Grid g = new Grid(List.of("reviewer", "score>"));
        HOSTILE.forEach(s -> g.add(List.of(s, "0.5000")));
        String html = Html.table(g, "t", "reviewer id");
        assertThat(html).doesNotContain("<script", "<img", "<svg", "'alert", "<!--");
        assertThat(html).contains("<td>&lt;script&gt;alert(1)&lt;/script&gt;</td>").contains("<td class=\"num\">0.5000</td>")
                .contains("<th class=\"num\" aria-sort=\"none\">");
    }

    @Test
    void csvCellsThatASpreadsheetWouldRunAreNeutralised() {
        // Formula injection: cells starting = + - @, tab or carriage return run as formulas (OWASP, "CSV Injection").
        for (String s : List.of("=cmd|' /C calc'!A0", "+1+1", "-2+3", "@SUM(A1)", "\tx", "\rx")) {
            assertThat(Csv.text(s)).as(s).matches("(?s)\"?'.*");
            assertThat(Csv.parseLine(Csv.text(s).replace("\r", ""))).hasSize(1);
        }
        Grid g = new Grid(List.of("reviewer", "score>"));
        g.add(List.of("=HYPERLINK(\"x\")", "-0.5"));
        assertThat(g.toCsv()).contains("\"'=HYPERLINK(\"\"x\"\")\",-0.5");
    }
}
