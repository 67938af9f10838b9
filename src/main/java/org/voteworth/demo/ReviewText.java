package org.voteworth.demo;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.voteworth.score.MarsagliaTsangGamma;

/**
 * Headlines and bodies for the demo's reviews, from our own small vocabulary and sentence
 * templates, with the tone following the stars. Text is most of a dump's bytes, as in real dumps,
 * so that the cost of reading it (and of skipping it) is realistic.
 *
 * <p>Templates are compiled once into codes: a code {@code >= 0} is a literal, a negative code
 * names a slot filled from a word list. Never writes a tab or a line break.
 */
final class ReviewText {
    private static final String[] SLOTS = {"thing", "pos", "neg", "mid", "person", "time", "freq", "when", "colour", "count"};
    private static final int THING = 0;

    private static final String[][] WORDS = {
            {},
            {"sturdy", "solid", "well made", "lovely", "light", "handy", "reliable", "excellent", "neat",
                    "comfortable", "smooth", "quiet", "bright", "good value", "easy to clean", "easy to use",
                    "well finished", "generous", "tidy", "robust"},
            {"flimsy", "loose", "wobbly", "noisy", "dull", "fragile", "stiff", "disappointing", "badly made",
                    "too small", "awkward", "scratched", "uneven", "overpriced", "hard to clean", "cheaply finished"},
            {"fine", "okay", "average", "plain", "as expected", "a bit small", "decent", "nothing special",
                    "adequate", "fair for the price"},
            {"my partner", "our kids", "my neighbour", "my mother", "a friend", "the whole family", "my flatmate",
                    "our grandson", "my sister", "a colleague"},
            {"a week", "two weeks", "a month", "three months", "half a year", "a year", "a few days", "two years"},
            {"every day", "most mornings", "at weekends", "twice a week", "now and then", "every evening"},
            {"a day early", "on time", "two days late", "in a battered box", "well packed", "a week late"},
            {"grey", "green", "blue", "white", "black", "red", "plain oak", "sand", "navy"},
            {"two", "three", "five", "a dozen", "twenty", "ten", "four"},
    };

    private static final String[] POSITIVE = {
            "The {thing} is {pos}.",
            "I bought this for {person} and it was a hit.",
            "After {time} of daily use the {thing} is still {pos}.",
            "It's {pos} and {pos}, which I didn't expect at this price.",
            "Would happily buy it again.",
            "Delivery was quick and the packaging was {pos}.",
            "The {thing} feels {pos} in the hand.",
            "Does exactly what it says.",
            "{person} says it's the best {thing} we've had.",
            "I've used it {count} times now without a problem.",
            "Compared with our old {thing}, this one is far more {pos}.",
            "Really pleased with the {thing}.",
            "The {thing} is {pos} and the {thing} is {pos} too.",
            "No complaints at all after {time}.",
            "I'd recommend it to anyone who needs a {pos} {thing}.",
    };
    private static final String[] NEGATIVE = {
            "The {thing} was {neg} out of the box.",
            "It broke after {time}.",
            "Sadly the {thing} is {neg} and {neg}.",
            "I sent it back after {time}.",
            "Not worth the money.",
            "The {thing} came {neg}, and the replacement was no better.",
            "{person} couldn't get it to work.",
            "I wouldn't buy it again.",
            "The picture made the {thing} look far more {pos} than it is.",
            "It is \"{pos}\" only in the listing.",
            "The {thing} stopped working after {time}.",
            "Customer service never replied to my {count} emails.",
            "The {thing} feels {neg} and the {thing} is {neg}.",
    };
    private static final String[] MIXED = {
            "The {thing} is {mid}, nothing more.",
            "It does the job, but the {thing} is a bit {neg}.",
            "For the price it's {mid}.",
            "Good enough for {person}, though I expected more.",
            "The {thing} is {pos}, but the {thing} is {neg}.",
            "Neither great nor terrible.",
            "It's {mid} once you get used to the {thing}.",
    };
    private static final String[] NEUTRAL = {
            "I use it {freq}.",
            "It arrived {when}.",
            "The {thing} is about the size I expected.",
            "The instructions were {mid}.",
            "I ordered it in {colour}.",
            "It took {count} minutes to set up.",
            "We keep it in the cupboard by the door.",
            "I had been looking for a {thing} like this for {time}.",
            "{person} uses it {freq}.",
            "It replaced a {thing} we'd had for {time}.",
    };
    private static final String[] HEAD_POSITIVE = {
            "Sturdy and {pos}", "Great {thing}", "Just what we needed", "Does the job well", "Really {pos}",
            "Love this {thing}", "Excellent value", "Better than expected", "Five stars", "A {pos} {thing}"};
    private static final String[] HEAD_NEGATIVE = {
            "Broke after {time}", "Very {neg}", "Not as described", "Disappointed", "Poor {thing}", "Avoid",
            "Returned it", "The {thing} is {neg}"};
    private static final String[] HEAD_MIXED = {
            "It's {mid}", "Okay for the price", "Fine but {neg}", "Average {thing}", "Does the job, just"};

    /** Sentence pools by tone: 0 positive, 1 mixed, 2 negative. */
    private final int[][][] bodyByTone;
    private final int[][][] headByTone;
    private final int[][] neutral;
    private final List<byte[]> literals = new ArrayList<>();
    private final byte[][][] slotWords;
    private final byte[][][] thingsByCategory;

    ReviewText(List<MarketCategory> categories) {
        bodyByTone = new int[][][] {compile(POSITIVE), compile(MIXED), compile(NEGATIVE)};
        headByTone = new int[][][] {compile(HEAD_POSITIVE), compile(HEAD_MIXED), compile(HEAD_NEGATIVE)};
        neutral = compile(NEUTRAL);
        slotWords = new byte[WORDS.length][][];
        for (int s = 0; s < WORDS.length; s++) {
            slotWords[s] = bytes(WORDS[s]);
        }
        thingsByCategory = new byte[categories.size()][][];
        for (int c = 0; c < categories.size(); c++) {
            thingsByCategory[c] = bytes(categories.get(c).things().toArray(String[]::new));
        }
    }

    /** Tone of a review with these stars: 0 positive, 1 mixed, 2 negative. */
    static int tone(int stars) {
        return stars >= 4 ? 0 : stars == 3 ? 1 : 2;
    }

    void headline(RowBytes out, SplittableRandom rng, int category, int stars) {
        int[][] pool = headByTone[tone(stars)];
        write(out, pool[rng.nextInt(pool.length)], rng, category, true);
    }

    /**
     * A body of {@code sentences} sentences: mostly in the review's tone, some neutral, a few
     * off-tone (people hedge).
     */
    void body(RowBytes out, SplittableRandom rng, int category, int stars, int sentences) {
        int tone = tone(stars);
        for (int i = 0; i < sentences; i++) {
            if (i > 0) {
                out.put((byte) ' ');
            }
            double u = rng.nextDouble();
            int[][] pool = u < 0.62 ? bodyByTone[tone] : u < 0.92 ? neutral : bodyByTone[rng.nextInt(3)];
            write(out, pool[skewed(rng, pool.length)], rng, category, true);
        }
    }

    /** Sentences in a body: log-normal, median 9 (about 70 words), from 2 up to 60 (about 480). */
    static int sentenceCount(SplittableRandom rng) {
        double z = MarsagliaTsangGamma.normal(rng);
        long n = Math.round(9.0 * StrictMath.exp(0.75 * z));
        return (int) Math.max(2, Math.min(60, n));
    }

    /** Earlier entries of a list are likelier: people repeat the common phrases. */
    static int skewed(SplittableRandom rng, int n) {
        double u = rng.nextDouble();
        return (int) (n * u * (0.35 + 0.65 * u));
    }

    private void write(RowBytes out, int[] codes, SplittableRandom rng, int category, boolean capital) {
        int start = out.length();
        for (int k = 0; k < codes.length; k++) {
            int code = codes[k];
            if (code >= 0) {
                out.put(literals.get(code));
            } else {
                int slot = -code - 1;
                byte[][] words = slot == THING ? thingsByCategory[category] : slotWords[slot];
                out.put(words[skewed(rng, words.length)]);
            }
        }
        if (capital && out.length() > start) {
            byte b = out.byteAt(start);
            if (b >= 'a' && b <= 'z') {
                out.setByteAt(start, (byte) (b - 32));
            }
        }
    }

    private int[][] compile(String[] templates) {
        int[][] out = new int[templates.length][];
        for (int t = 0; t < templates.length; t++) {
            List<Integer> codes = new ArrayList<>();
            String s = templates[t];
            int i = 0;
            while (i < s.length()) {
                int open = s.indexOf('{', i);
                if (open < 0) {
                    codes.add(literal(s.substring(i)));
                    break;
                }
                if (open > i) {
                    codes.add(literal(s.substring(i, open)));
                }
                int close = s.indexOf('}', open);
                codes.add(-slot(s.substring(open + 1, close)) - 1);
                i = close + 1;
            }
            out[t] = codes.stream().mapToInt(Integer::intValue).toArray();
        }
        return out;
    }

    private int literal(String text) {
        literals.add(text.getBytes(StandardCharsets.UTF_8));
        return literals.size() - 1;
    }

    private static int slot(String name) {
        for (int i = 0; i < SLOTS.length; i++) {
            if (SLOTS[i].equals(name)) {
                return i;
            }
        }
        throw new IllegalStateException("unknown slot {" + name + "} in a review template");
    }

    private static byte[][] bytes(String[] words) {
        byte[][] b = new byte[words.length][];
        for (int i = 0; i < words.length; i++) {
            b[i] = words[i].getBytes(StandardCharsets.UTF_8);
        }
        return b;
    }
}
