package org.voteworth.demo;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

class DemoOptionsTest {
    @ParameterizedTest
    @CsvSource({
            // SI prefixes are powers of 1000, IEC prefixes (KiB, MiB, GiB) powers of 1024 (IEC 80000-13).
            "500MB, 500000000",
            "4GB, 4000000000",
            "1.5GiB, 1610612736",
            "800k, 800000",
            "800KB, 800000",
            "2MiB, 2097152",
            "1TB, 1000000000000",
            "123456, 123456",
            "' 64 kib ', 65536",
            "10b, 10"})
    void parsesSizes(String text, long bytes) {
        assertThat(DemoOptions.parseSize(text)).isEqualTo(bytes);
    }

    @ParameterizedTest
    @ValueSource(strings = {"", "abc", "5XB", "-1GB", "0", "0.0001B", "1.5.2GB", "GB", "99999999999TB"})
    void rejectsWhatIsNotASize(String text) {
        assertThatThrownBy(() -> DemoOptions.parseSize(text)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("'" + text + "'").hasMessageContaining("500MB");
    }

    @Test
    void factoriesUseTheDefaults() {
        DemoOptions r = DemoOptions.rows(40_000);
        assertThat(r).isEqualTo(new DemoOptions(20261202L, 40_000, 0, 10, true, true, true));
        assertThat(r.sizedByRows()).isTrue();
        DemoOptions s = DemoOptions.size(1_000_000);
        assertThat(s.targetBytes()).isEqualTo(1_000_000);
        assertThat(s.sizedByRows()).isFalse();
        assertThat(s.withSeed(3).withCategories(8).withGzip(false).withPlantCases(false).withMalformedRows(false))
                .isEqualTo(new DemoOptions(3, 0, 1_000_000, 8, false, false, false));
    }

    @Test
    void needsExactlyOneWayToSize() {
        assertThatThrownBy(() -> new DemoOptions(1, 10, 10, 10, true, true, true))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("not both");
        assertThatThrownBy(() -> new DemoOptions(1, 0, 0, 10, true, true, true))
                .isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> DemoOptions.rows(5).withCategories(11))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("11");
    }
}
