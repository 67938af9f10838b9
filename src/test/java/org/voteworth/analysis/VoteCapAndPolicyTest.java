package org.voteworth.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The promotion-list reader and the --fail-if grammar. */
class VoteCapAndPolicyTest {
    @TempDir
    Path dir;

    @Test
    void readsOneIdPerLineWithCommentsAndReportsDuplicates() throws IOException {
        Path f = dir.resolve("list.txt");
        Files.writeString(f, "# promoted in March\nplanted-expert\n\n12345678\nplanted-expert\n");
        PromotionList l = PromotionList.read(f);
        assertThat(l.ids()).containsExactly("planted-expert", "12345678");
        assertThat(l.duplicates()).containsExactly("planted-expert");
    }

    @Test
    void readsTheReviewerIdColumnOfACsv() throws IOException {
        Path f = dir.resolve("list.csv");
        Files.writeString(f, "rank,reviewer_id,note\n1,planted-expert,\"strong, steady\"\n2,777,\n");
        assertThat(PromotionList.read(f).ids()).containsExactly("planted-expert", "777");
    }

    @Test
    void aCsvWithoutTheColumnIsAnErrorNamingTheLine() throws IOException {
        Path f = dir.resolve("bad.csv");
        Files.writeString(f, "rank,id\n1,x\n");
        assertThatThrownBy(() -> PromotionList.read(f)).hasMessageContaining("line 1").hasMessageContaining("reviewer_id");
    }

    @Test
    void policyConditionsParseAndFail() {
        FailPolicy p = FailPolicy.parse("expected-below>1, min-probability<0.5,precision<=0.8");
        AuditResult.Summary passing = new AuditResult.Summary(10, 10, 0, 0.4, 0, 0.7, 0.9, 0, 0.01);
        AuditResult.Summary failing = new AuditResult.Summary(10, 10, 0, 2.5, 3, 0.1, 0.8, 4, 0.01);
        assertThat(p.failures(passing)).isEmpty();
        assertThat(p.failures(failing)).hasSize(3);
        assertThat(p.failures(failing).get(0)).contains("expected-below>1").contains("2.5");
    }

    @Test
    void policyErrorsSayWhatIsWrong() {
        assertThatThrownBy(() -> FailPolicy.parse("loud>1")).hasMessageContaining("unknown metric 'loud'");
        assertThatThrownBy(() -> FailPolicy.parse("below=1")).hasMessageContaining("METRIC OP NUMBER");
        assertThatThrownBy(() -> FailPolicy.parse("below>x")).hasMessageContaining("not a number");
    }
}
