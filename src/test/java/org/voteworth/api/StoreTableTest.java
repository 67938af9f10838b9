package org.voteworth.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.voteworth.analysis.ReviewerProfile;
import org.voteworth.cli.CliTest;
import org.voteworth.demo.DemoDumpGenerator;
import org.voteworth.demo.DemoOptions;
import org.voteworth.demo.PlantedCases;

/**
 * A table opened from a store against the same dump tallied directly, and its profiles against
 * what {@code voteworth profile} prints for the same store (equality and round-trip checks).
 */
class StoreTableTest {
    @TempDir
    static Path dir;
    static Path dump;
    static Path store;

    @BeforeAll
    static void writeStore() throws IOException {
        dump = dir.resolve("dump");
        new DemoDumpGenerator().generate(dump, DemoOptions.rows(4_000).withSeed(5));
        store = dir.resolve("store");
        CliTest.Run r = CliTest.run("tally", dump.toString(), "--store", store.toString(), "--quiet");
        assertThat(r.code()).as(r.err()).isZero();
    }

    @Test
    void aStoreOpensToTheTableADumpTallyGivesWithItsReconciliation() throws IOException {
        ReviewerTable fromStore = ReviewerTable.open(store);
        ReviewerTable fromDump = Dump.open(dump).rejects(dir.resolve("dump-rejects.tsv")).tally();
        assertThat(fromStore.tallyTable().toSortedList()).isEqualTo(fromDump.tallyTable().toSortedList());
        assertThat(fromStore.summary().rowsRead()).isEqualTo(fromDump.summary().rowsRead());
        assertThat(fromStore.summary().accepted()).isEqualTo(fromDump.summary().accepted());
        assertThat(fromStore.summary().rejected()).isEqualTo(fromDump.summary().rejected()).isPositive();
        assertThat(fromStore.reconciles()).isTrue();
        assertThat(fromStore.rejectsFile()).contains(store.resolve("rejects.tsv"));
        assertThat(fromStore.rank(Rule.wilson()).topIds(10)).isEqualTo(fromDump.rank(Rule.wilson()).topIds(10));
    }

    @Test
    void aProfileHasTheNumbersAndReportOfTheProfileCommand() throws IOException {
        Report<List<ReviewerProfile>> r = ReviewerTable.open(store).profile(PlantedCases.EXPERT, "no-such-reviewer");
        JsonNode cli = new ObjectMapper().readTree(CliTest.run("profile", PlantedCases.EXPERT, "no-such-reviewer", "--store",
                store.toString(), "--format", "json").out()).get("profiles");
        ReviewerProfile p = r.result().get(0);
        JsonNode j = cli.get(0);
        assertThat(p.reviews()).hasSize(j.get("reviews").asInt());
        assertThat(p.helpfulVotes()).isEqualTo(j.get("helpful_votes").asLong());
        assertThat(p.totalVotes()).isEqualTo(j.get("total_votes").asLong());
        assertThat(p.verified()).isEqualTo(j.get("verified").asLong());
        assertThat(p.incentivised()).isEqualTo(j.get("incentivised").asLong());
        assertThat(LocalDate.ofEpochDay(p.firstDay())).hasToString(j.get("first_date").asText());
        assertThat(LocalDate.ofEpochDay(p.lastDay())).hasToString(j.get("last_date").asText());
        assertThat(p.categories()).hasSize(j.get("categories").size());
        for (int i = 0; i < p.categories().size(); i++) {
            assertThat(p.categories().get(i).reviews()).isEqualTo(j.get("categories").get(i).get("reviews").asLong());
        }
        assertThat(p.busiestDays()).hasSize(j.get("busiest_days").size());
        assertThat(r.result().get(1).found()).isFalse();
        assertThat(cli.get(1).get("found").asBoolean()).isFalse();

        String md = CliTest.run("profile", PlantedCases.EXPERT, "no-such-reviewer", "--store", store.toString(), "--format", "md")
                .out();
        assertThat(r.content()).isEqualTo(md).contains("## Cautions");
        assertThat(r.mimeType()).isEqualTo("text/markdown");
    }

    @Test
    void aPseudonymizedTableProfilesUnderThePseudonym() throws IOException {
        Path key = dir.resolve("key.txt");
        Files.writeString(key, "store-secret\n");
        Report<List<ReviewerProfile>> r = ReviewerTable.open(store).pseudonymized("store-secret").profile(PlantedCases.EXPERT);
        String md = CliTest.run("profile", PlantedCases.EXPERT, "--store", store.toString(), "--format", "md", "--pseudonymize",
                "--key-file", key.toString()).out();
        assertThat(r.content()).isEqualTo(md).doesNotContain(PlantedCases.EXPERT);
        assertThat(r.text()).doesNotContain(PlantedCases.EXPERT);
    }

    @Test
    void aTableNotFromAStoreSaysHowToGetProfiles() throws IOException {
        ReviewerTable fromDump = Dump.open(dump).rejects(dir.resolve("r.tsv")).tally();
        assertThatThrownBy(() -> fromDump.profile(PlantedCases.EXPERT)).isInstanceOf(IllegalStateException.class)
                .hasMessageContaining("is not from a store").hasMessageContaining("tally DUMP... --store DIR")
                .hasMessageContaining("ReviewerTable.open");

        // A store of the reviewer table only (no per-review parts), as spark-tally writes it.
        Path tableOnly = dir.resolve("table-only");
        Files.createDirectories(tableOnly);
        for (String f : List.of("reviewers.parquet", "rejects.tsv")) {
            Files.copy(store.resolve(f), tableOnly.resolve(f));
        }
        Files.writeString(tableOnly.resolve("manifest.json"), Files.readString(store.resolve("manifest.json"))
                .replaceAll("\"reviewParts\" : \\d+", "\"reviewParts\" : 0").replaceAll(" mod \\d+\"", " mod 0\""));
        ReviewerTable onlyTable = ReviewerTable.open(tableOnly);
        assertThat(onlyTable.size()).isEqualTo(fromDump.size());
        assertThatThrownBy(() -> onlyTable.profile(PlantedCases.EXPERT)).isInstanceOf(IllegalStateException.class)
                .hasMessageContaining("a store of the reviewer table only").hasMessageContaining("tally DUMP... --store DIR");
        assertThatThrownBy(() -> ReviewerTable.open(dir.resolve("dump"))).isInstanceOf(IOException.class)
                .hasMessageContaining("not a store");
    }
}
