/**
 * The columnar store a tally leaves behind: the reviewer table and every review's numeric columns as
 * Parquet files, sorted by reviewer, with a manifest of the files they came from. Analyses read it
 * instead of the dump; a profile looks up one reviewer by reading one row group of one file.
 * The layout is described in {@code docs/store.md}.
 */
package org.voteworth.store;
