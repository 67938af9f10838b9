package org.voteworth.source;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class RangeStreamTest {
    @TempDir
    Path dir;

    /** A range holds exactly the file's bytes [start, end), as the JDK's whole-file read gives them, and the whole file all of them. */
    @Test
    void readsExactlyTheRange() throws IOException {
        byte[] data = new byte[3 * RangeStream.READ + 777];
        new Random(5).nextBytes(data);
        Path file = dir.resolve("part.tsv");
        Files.write(file, data);
        long[][] ranges = {{0, data.length}, {0, 0}, {1, 2}, {RangeStream.READ - 1, 2L * RangeStream.READ + 1}, {data.length - 5, data.length}};
        for (long[] r : ranges) {
            try (RangeStream in = RangeStream.open(file, r[0], r[1])) {
                assertThat(drain(in, 3 * RangeStream.READ)).isEqualTo(Arrays.copyOfRange(data, (int) r[0], (int) r[1]));
            }
        }
        try (RangeStream in = RangeStream.open(file)) {
            assertThat(drain(in, 1000)).isEqualTo(Files.readAllBytes(file));
        }
    }

    /** One read never asks the kernel for more than READ bytes, however large the caller's buffer. */
    @Test
    void capsEachRead() throws IOException {
        Path file = dir.resolve("big.tsv");
        Files.write(file, new byte[2 * RangeStream.READ]);
        try (RangeStream in = RangeStream.open(file)) {
            assertThat(in.read(new byte[4 * RangeStream.READ], 0, 4 * RangeStream.READ)).isEqualTo(RangeStream.READ);
        }
    }

    /** A missing file fails as Files.newInputStream fails, so callers keep telling it apart from an unreadable one. */
    @Test
    void missingFileIsNoSuchFile() {
        assertThatThrownBy(() -> RangeStream.open(dir.resolve("gone.tsv"))).isInstanceOf(NoSuchFileException.class)
                .hasMessageContaining("gone.tsv");
    }

    private static byte[] drain(RangeStream in, int chunk) throws IOException {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        byte[] b = new byte[chunk];
        int n;
        while ((n = in.read(b, 0, b.length)) >= 0) {
            out.write(b, 0, n);
        }
        return out.toByteArray();
    }
}
