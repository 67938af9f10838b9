package org.voteworth.source;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class DumpFinderTest {
    @TempDir
    Path dir;

    @BeforeEach
    void layOutADump() throws IOException {
        for (String f : List.of("dump/garden.part-01.tsv.gz", "dump/garden.part-02.tsv.gz", "dump/kitchen.tsv",
                "dump/notes.md", "dump/2021/toys.csv", "dump/2021/part-01.tsv", "dump/2021/deep/part-02.tsv",
                "dump/part-00.tsv", "dump/README", "other/shoes.txt.gz", "other/shoes.txt")) {
            SampleDump.write(dir.resolve(f), SampleDump.HEADER + "\n");
        }
    }

    private List<String> found(String... inputs) throws IOException {
        return DumpFinder.find(List.of(inputs), CategoryFromName.defaults(), dir).stream()
                .map(f -> dir.relativize(f.path()).toString().replace('\\', '/')).toList();
    }

    @Test
    void foldersAreSearchedRecursivelyForDumpExtensions() throws IOException {
        assertThat(found("dump")).containsExactly("dump/2021/deep/part-02.tsv", "dump/2021/part-01.tsv", "dump/2021/toys.csv",
                "dump/garden.part-01.tsv.gz", "dump/garden.part-02.tsv.gz", "dump/kitchen.tsv", "dump/part-00.tsv");
    }

    @Test
    void globsMatchWithinAndAcrossFolders() throws IOException {
        assertThat(found("dump/*.tsv.gz")).containsExactly("dump/garden.part-01.tsv.gz", "dump/garden.part-02.tsv.gz");
        // "**/" crosses any number of folders, none included.
        assertThat(found("dump/**/part-*.tsv")).containsExactly("dump/2021/deep/part-02.tsv", "dump/2021/part-01.tsv",
                "dump/part-00.tsv");
        assertThat(found("*/shoes.txt*")).containsExactly("other/shoes.txt", "other/shoes.txt.gz");
        assertThat(found("dump/{kitchen,README}")).containsExactly("dump/README");
    }

    @Test
    void filesAreTakenAsGivenAndDuplicatesRemoved() throws IOException {
        assertThat(found("dump/notes.md", "dump/kitchen.tsv", "dump", "dump/./kitchen.tsv", "dump/*.tsv"))
                .containsExactly("dump/2021/deep/part-02.tsv", "dump/2021/part-01.tsv", "dump/2021/toys.csv",
                        "dump/garden.part-01.tsv.gz", "dump/garden.part-02.tsv.gz", "dump/kitchen.tsv", "dump/notes.md",
                        "dump/part-00.tsv");
    }

    @Test
    void eachFileCarriesCategoryCompressionAndSize() throws IOException {
        List<DumpFile> files = DumpFinder.find(List.of("dump/garden.part-02.tsv.gz", "dump/kitchen.tsv"),
                CategoryFromName.defaults(), dir);
        assertThat(files).extracting(DumpFile::category).containsExactly("garden", "kitchen");
        assertThat(files).extracting(DumpFile::compression).containsExactly(DumpFile.Compression.GZIP, DumpFile.Compression.NONE);
        assertThat(files.get(1).sizeBytes()).isEqualTo(Files.size(dir.resolve("dump/kitchen.tsv")));
    }

    @Test
    void anInputThatMatchesNothingIsNamed() throws IOException {
        assertThatThrownBy(() -> found("dump/kitchen.tsv", "dump/garden.tsv"))
                .isInstanceOf(DumpFormatException.class)
                .hasMessage("dump/garden.tsv: no such file or folder");
        assertThatThrownBy(() -> found("dump/*.parquet"))
                .isInstanceOf(DumpFormatException.class)
                .hasMessage("dump/*.parquet: the pattern matches no file");
        assertThatThrownBy(() -> found("nowhere/*.tsv")).hasMessage("nowhere/*.tsv: the pattern matches no file");
        Files.createDirectories(dir.resolve("empty"));
        Files.writeString(dir.resolve("empty/readme.md"), "x");
        assertThatThrownBy(() -> found("empty")).hasMessageContaining("empty: the folder holds no dump files");
        assertThatThrownBy(() -> found()).hasMessageContaining("no dump files given");
    }

    @Test
    void relativeInputsStayRelativeToTheWorkingDirectory() throws IOException {
        // The public entry point resolves against the working directory: an absolute input stays absolute.
        List<DumpFile> files = DumpFinder.find(List.of(dir.resolve("dump/kitchen.tsv").toString()), CategoryFromName.defaults());
        assertThat(files).singleElement().satisfies(f -> assertThat(f.path()).isEqualTo(dir.resolve("dump/kitchen.tsv")));
    }
}
