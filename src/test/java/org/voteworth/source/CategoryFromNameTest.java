package org.voteworth.source;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Path;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

class CategoryFromNameTest {
    @ParameterizedTest(name = "{0} -> {1}")
    @CsvSource({
        "garden.tsv, garden",
        "garden.tsv.gz, garden",
        "garden.part-01.tsv.gz, garden",
        "garden.part-02.tsv.gz, garden",
        "garden_part3.csv, garden",
        "garden-0002.txt, garden",
        "Garden.PART-7.TSV.GZ, Garden",
        "home_kitchen.tsv, home_kitchen",
        "toys-and-games.csv.gz, toys-and-games",
        "books2020.tsv, books2020",
        "reviews.txt, reviews",
        "plain, plain",
        "dump/2021/shoes.part_04.tsv, shoes",
    })
    void defaultDropsExtensionsAndPartSuffixes(String file, String category) {
        assertThat(CategoryFromName.defaults().categoryOf(Path.of(file))).isEqualTo(category);
    }

    @Test
    void aUserPatternTakesItsFirstGroup() {
        CategoryFromName c = CategoryFromName.of("^reviews_([a-z]+)_");
        assertThat(c.categoryOf(Path.of("x", "reviews_garden_2021.tsv"))).isEqualTo("garden");
        assertThatThrownBy(() -> c.categoryOf(Path.of("garden.tsv")))
                .isInstanceOf(DumpFormatException.class)
                .hasMessageContaining("garden.tsv does not match --category-pattern ^reviews_([a-z]+)_");
    }

    @Test
    void badPatternsAreExplained() {
        assertThatThrownBy(() -> CategoryFromName.of("garden")).hasMessageContaining("has no capture group");
        assertThatThrownBy(() -> CategoryFromName.of("([a-z]")).hasMessageContaining("not a valid regular expression");
    }
}
