/**
 * The charts of the HTML report, drawn with JFreeChart into SVG with real text: a funnel plot
 * with control limits, bars of counts, counts per month, rank intervals and the entry-bar sweep,
 * all in one colour-blind-safe palette.
 */
package org.voteworth.report.chart;
