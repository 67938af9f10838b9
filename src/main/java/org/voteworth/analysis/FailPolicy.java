package org.voteworth.analysis;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * When an audit fails, so that it can gate a pipeline: comma-separated conditions
 * {@code METRIC OP NUMBER}, OP one of {@code < <= > >=}; the list fails when any holds. Metrics:
 * <ul>
 * <li>{@code expected-below}: expected number of listed reviewers below the bar, Σ(1 − P)</li>
 * <li>{@code below}: listed reviewers more likely below the bar than above it (P &lt; 0.5)</li>
 * <li>{@code min-probability}: the smallest P(meets the bar) on the list</li>
 * <li>{@code precision}: share of the found listed reviewers in the statistical top k</li>
 * <li>{@code missing}: listed ids not in the data</li>
 * <li>{@code overlooked}: reviewers not listed who beat the list's weakest members with high probability</li>
 * </ul>
 * e.g. {@code expected-below>1,min-probability<0.5}.
 *
 * @param conditions the parsed conditions
 */
public record FailPolicy(List<Condition> conditions) {
    public static final List<String> METRICS = List.of("expected-below", "below", "min-probability", "precision", "missing",
            "overlooked");

    public FailPolicy {
        conditions = List.copyOf(conditions);
    }

    /** Never fails. */
    public static final FailPolicy NONE = new FailPolicy(List.of());

    /**
     * One condition.
     *
     * @param metric one of {@link #METRICS}
     * @param op the comparison
     * @param value the number compared with
     */
    public record Condition(String metric, String op, double value) {
        boolean holds(double v) {
            return switch (op) {
                case "<" -> v < value;
                case "<=" -> v <= value;
                case ">" -> v > value;
                default -> v >= value;
            };
        }

        @Override
        public String toString() {
            return metric + op + trim(value);
        }
    }

    public static FailPolicy parse(String text) {
        List<Condition> out = new ArrayList<>();
        for (String part : text.split(",")) {
            String p = part.strip();
            if (p.isEmpty()) {
                continue;
            }
            int at = -1;
            for (int i = 0; i < p.length(); i++) {
                char c = p.charAt(i);
                if (c == '<' || c == '>') {
                    at = i;
                    break;
                }
            }
            if (at <= 0) {
                throw new IllegalArgumentException("--fail-if: '" + p + "' is not METRIC OP NUMBER (e.g. expected-below>1,"
                        + " OP one of < <= > >=)");
            }
            String metric = p.substring(0, at).strip().toLowerCase(Locale.ROOT);
            String op = p.length() > at + 1 && p.charAt(at + 1) == '=' ? p.substring(at, at + 2) : p.substring(at, at + 1);
            String number = p.substring(at + op.length()).strip();
            if (!METRICS.contains(metric)) {
                throw new IllegalArgumentException("--fail-if: unknown metric '" + metric + "' in '" + p + "': use one of "
                        + String.join(", ", METRICS));
            }
            try {
                out.add(new Condition(metric, op, Double.parseDouble(number)));
            } catch (NumberFormatException e) {
                throw new IllegalArgumentException("--fail-if: '" + number + "' in '" + p + "' is not a number");
            }
        }
        if (out.isEmpty()) {
            throw new IllegalArgumentException("--fail-if needs at least one condition, e.g. expected-below>1");
        }
        return new FailPolicy(out);
    }

    /** The conditions that hold for {@code s}, in words; empty when the list passes. */
    public List<String> failures(AuditResult.Summary s) {
        List<String> out = new ArrayList<>();
        for (Condition c : conditions) {
            double v = switch (c.metric()) {
                case "expected-below" -> s.expectedBelow();
                case "below" -> s.likelyBelow();
                case "min-probability" -> s.minProbability();
                case "precision" -> s.precision();
                case "missing" -> s.missing();
                default -> s.overlooked();
            };
            if (c.holds(v)) {
                out.add(c + " holds: " + c.metric() + " is " + trim(v));
            }
        }
        return out;
    }

    static String trim(double v) {
        return v == Math.rint(v) && Math.abs(v) < 1e15 ? Long.toString((long) v) : String.format(Locale.ROOT, "%.4g", v);
    }
}
