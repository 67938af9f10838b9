/**
 * Writers for people and tools: terminal tables, Markdown, CSV (neutralised against spreadsheet
 * formulas) and JSON, the same numbers in each; the cautions every report carries; keyed
 * pseudonyms for reviewer ids.
 */
package org.voteworth.report;
