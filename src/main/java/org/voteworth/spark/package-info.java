/**
 * The tally on Apache Spark, for dumps too large for one machine:
 * {@link org.voteworth.spark.SparkTally} reads the same files with the project's own scanner
 * in Spark tasks, reduces partial tallies with the same merge, and writes the store layout
 * (reviewer table as Parquet, rejects, reconciliation, manifest), so every analysis runs
 * unchanged on its output. Spark is a provided dependency: nothing outside this package and
 * the {@code spark-tally} command loads a Spark class.
 */
package org.voteworth.spark;
