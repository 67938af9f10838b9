package org.voteworth.tally;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The spill byte format against the published encodings it uses, and sections written in memory
 * then appended to one file read back exactly by their byte ranges.
 */
class SpillFileTest {
    @TempDir
    Path dir;

    private static byte[] written(Path file, ThrowingWriter w) throws IOException {
        try (SpillFile.Out out = SpillFile.create(file)) {
            w.write(out);
        }
        return Files.readAllBytes(file);
    }

    @FunctionalInterface
    private interface ThrowingWriter {
        void write(SpillFile.Out out) throws IOException;
    }

    @Test
    void numbersAreUnsignedLeb128AndSignedOnesZigZag() throws IOException {
        // Unsigned LEB128: 624485 is E5 8E 26, the worked example of the DWARF specification (version 5, section 7.6).
        assertThat(written(dir.resolve("a"), out -> out.number(624_485)))
                .containsExactly(0xE5, 0x8E, 0x26);
        assertThat(written(dir.resolve("b"), out -> out.number(127))).containsExactly(0x7F);
        assertThat(written(dir.resolve("c"), out -> out.number(128))).containsExactly(0x80, 0x01);
        // Zig-zag, as the Protocol Buffers encoding guide tabulates it: 0 -> 0, -1 -> 1, 1 -> 2, -2 -> 3,
        // 2147483647 -> 4294967294, -2147483648 -> 4294967295.
        int[] signed = {0, -1, 1, -2, Integer.MAX_VALUE, Integer.MIN_VALUE};
        long[] zigzag = {0, 1, 2, 3, 4_294_967_294L, 4_294_967_295L};
        for (int i = 0; i < signed.length; i++) {
            int v = signed[i];
            long z = zigzag[i];
            byte[] got = written(dir.resolve("s" + i), out -> out.signed(v));
            byte[] want = written(dir.resolve("u" + i), out -> out.number(z));
            assertThat(got).as("zig-zag of %d", v).isEqualTo(want);
        }
    }

    @Test
    void sectionsBuiltInMemoryAreReadBackByTheirByteRanges() throws IOException {
        Random rnd = new Random(11);
        int sections = 40;
        long[][] values = new long[sections][];
        String[] texts = new String[sections];
        long[] start = new long[sections];
        long[] end = new long[sections];
        Path file = dir.resolve("spill.bin");
        try (SpillFile.Out out = SpillFile.create(file)) {
            for (int s = 0; s < sections; s++) {
                SpillFile.Out memory = SpillFile.inMemory();
                // Some sections far beyond the file buffer (64 KiB), so the in-memory one must grow.
                values[s] = new long[s % 7 == 0 ? 40_000 : rnd.nextInt(50)];
                for (int i = 0; i < values[s].length; i++) {
                    values[s][i] = rnd.nextInt(4) == 0 ? rnd.nextLong() >>> 1 : rnd.nextInt(300);
                    memory.number(values[s][i]);
                }
                texts[s] = "x".repeat(s % 5 == 0 ? 100_000 : s) + "é";
                memory.text(texts[s]);
                memory.write(0x5A);
                start[s] = out.position();
                out.append(memory);
                end[s] = out.position();
                assertThat(memory.position()).isZero();
            }
        }
        assertThat(Files.size(file)).isEqualTo(end[sections - 1]);
        for (int s = sections - 1; s >= 0; s--) {
            try (SpillFile.In in = SpillFile.open(file, start[s], end[s])) {
                for (long v : values[s]) {
                    assertThat(in.number()).isEqualTo(v);
                }
                assertThat(in.text()).isEqualTo(texts[s]);
                assertThat(in.read()).isEqualTo(0x5A);
                assertThatThrownBy(in::read).as("section %d ends at its range", s).isInstanceOf(java.io.EOFException.class);
            }
        }
    }

    @Test
    void onlyAnInMemoryOutIsAppendedAndOnlyToAFile() throws IOException {
        try (SpillFile.Out file = SpillFile.create(dir.resolve("f")); SpillFile.Out other = SpillFile.create(dir.resolve("g"))) {
            assertThatThrownBy(() -> file.append(other)).isInstanceOf(IllegalArgumentException.class);
            assertThatThrownBy(() -> SpillFile.inMemory().append(SpillFile.inMemory()))
                    .isInstanceOf(IllegalArgumentException.class);
        }
    }
}
