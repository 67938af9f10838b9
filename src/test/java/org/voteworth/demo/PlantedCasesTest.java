package org.voteworth.demo;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import org.junit.jupiter.api.Test;

class PlantedCasesTest {
    @Test
    void namesAndSumsAreAsDocumented() {
        List<PlantedCases.PlantedReviewer> all = PlantedCases.all();
        assertThat(all).hasSize(45).extracting(PlantedCases.PlantedReviewer::id).doesNotHaveDuplicates();
        assertThat(PlantedCases.small(1)).isEqualTo("planted-small-01");
        assertThat(PlantedCases.small(40)).isEqualTo("planted-small-40");
        assertThatThrownBy(() -> PlantedCases.small(41)).isInstanceOf(IllegalArgumentException.class);
        assertThat(all).allMatch(p -> p.helpful() <= p.total() && p.reviews() >= 1);
        assertThat(all.subList(0, 40)).allMatch(p -> p.total() >= 1 && p.total() <= 8 && p.helpful() >= p.total() - 1);
        assertThat(PlantedCases.of(PlantedCases.EXPERT)).get()
                .isEqualTo(new PlantedCases.PlantedReviewer("planted-expert", 150, 896, 900));
        assertThat(PlantedCases.of("nobody")).isEmpty();
        PlantedCases.PlantedReviewer viral = PlantedCases.of(PlantedCases.VIRAL).orElseThrow();
        assertThat((double) PlantedCases.VIRAL_TOP_TOTAL / viral.total()).isGreaterThan(0.95);
        for (String v : List.of(PlantedCases.VETERAN_1, PlantedCases.VETERAN_2, PlantedCases.VETERAN_3)) {
            PlantedCases.PlantedReviewer p = PlantedCases.of(v).orElseThrow();
            assertThat(p.total()).isBetween(300L, 600L);
            assertThat((double) p.helpful() / p.total()).isBetween(0.96, 0.98);
        }
        assertThat(PlantedCases.reviewCount()).isEqualTo(all.stream().mapToInt(PlantedCases.PlantedReviewer::reviews).sum());
    }
}
