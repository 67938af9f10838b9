/**
 * Writers for people and tools: terminal tables, Markdown, CSV (neutralised against spreadsheet
 * formulas), JSON and one self-contained HTML report with charts, the same numbers in each; the
 * cautions every report carries; keyed pseudonyms for reviewer ids.
 */
package org.voteworth.report;
