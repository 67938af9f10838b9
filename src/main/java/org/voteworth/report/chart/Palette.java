package org.voteworth.report.chart;

import java.awt.Color;
import java.util.Locale;

/**
 * The colours of every chart: the eight-colour palette of Okabe and Ito (2008), "Color Universal
 * Design (CUD): how to make figures and presentations that are friendly to colorblind people"
 * (values from memory, as widely reproduced), chosen to stay distinct for the common forms of
 * colour blindness and in greyscale print. Each ranking rule keeps one colour in every chart.
 */
public final class Palette {
    public static final Color BLACK = new Color(0x000000);
    public static final Color ORANGE = new Color(0xE69F00);
    public static final Color SKY_BLUE = new Color(0x56B4E9);
    public static final Color BLUISH_GREEN = new Color(0x009E73);
    public static final Color YELLOW = new Color(0xF0E442);
    public static final Color BLUE = new Color(0x0072B2);
    public static final Color VERMILLION = new Color(0xD55E00);
    public static final Color REDDISH_PURPLE = new Color(0xCC79A7);
    /** Grid lines and frames: light enough to stay behind the data in print. */
    public static final Color GRID = new Color(0xD9D9D9);

    private Palette() {
    }

    /** The colour of a ranking rule by its name; rules not known here get black. */
    public static Color ofRule(String rule) {
        return switch (rule.toLowerCase(Locale.ROOT)) {
            case "raw-share" -> VERMILLION;
            case "wilson" -> BLUE;
            case "wilson-cc" -> SKY_BLUE;
            case "bayes-mean" -> BLUISH_GREEN;
            case "bayes-lower" -> REDDISH_PURPLE;
            case "review-majority" -> ORANGE;
            default -> BLACK;
        };
    }
}
