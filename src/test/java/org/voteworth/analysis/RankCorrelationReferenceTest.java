package org.voteworth.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.voteworth.tally.Csv;

/**
 * Kendall's tau-b and Spearman's rho against the published check values in
 * reference-checks/rank_correlation.csv (REFERENCES.md section 5; each row names its source).
 */
class RankCorrelationReferenceTest {
    @Test
    void everyRowOfTheReferenceFileMatches() throws IOException {
        List<String> lines = Files.readAllLines(Path.of("reference-checks/rank_correlation.csv")).stream()
                .filter(l -> !l.startsWith("#") && !l.isBlank()).toList();
        List<String> header = Csv.parseLine(lines.get(0));
        int checked = 0;
        for (String line : lines.subList(1, lines.size())) {
            List<String> c = Csv.parseLine(line);
            double[] x = numbers(c.get(header.indexOf("x")));
            double[] y = numbers(c.get(header.indexOf("y")));
            String statistic = c.get(header.indexOf("statistic"));
            String value = c.get(header.indexOf("value"));
            double expected = Double.parseDouble(value);
            double tol = tolerance(value, c.get(header.indexOf("tolerance")));
            double actual = switch (statistic) {
                case "kendall_tau", "kendall_tau_b" -> KendallTauB.of(x, y);
                case "spearman_rho" -> SpearmanRho.of(x, y);
                case "concordant_pairs" -> KendallTauB.pairs(x, y).concordant();
                case "discordant_pairs" -> KendallTauB.pairs(x, y).discordant();
                case "sum_d_squared" -> sumSquaredRankDifferences(x, y);
                default -> throw new AssertionError("unknown statistic " + statistic);
            };
            assertThat(actual).as(c.get(0) + " " + statistic + " (" + c.get(header.indexOf("source")) + ")")
                    .isCloseTo(expected, within(tol));
            checked++;
        }
        assertThat(checked).isEqualTo(8);
    }

    /** Half a unit of the last published digit, unless the file gives a tolerance. */
    private static double tolerance(String value, String given) {
        if (given.equals("exact")) {
            return 0;
        }
        if (given.startsWith("abs ")) {
            return Double.parseDouble(given.substring(4));
        }
        int dot = value.indexOf('.');
        int decimals = dot < 0 ? 0 : value.length() - dot - 1;
        return 0.5 * Math.pow(10, -decimals);
    }

    private static double sumSquaredRankDifferences(double[] x, double[] y) {
        double[] rx = ranks(x);
        double[] ry = ranks(y);
        double s = 0;
        for (int i = 0; i < x.length; i++) {
            s += (rx[i] - ry[i]) * (rx[i] - ry[i]);
        }
        return s;
    }

    private static double[] ranks(double[] v) {
        double[] r = new double[v.length];
        for (int i = 0; i < v.length; i++) {
            int below = 0;
            for (double w : v) {
                if (w < v[i]) {
                    below++;
                }
            }
            r[i] = below + 1;
        }
        return r;
    }

    private static double[] numbers(String s) {
        return Arrays.stream(s.trim().split("\\s+")).mapToDouble(Double::parseDouble).toArray();
    }
}
