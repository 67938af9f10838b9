/**
 * Stage two of the journey: per-reviewer tallies. {@link org.voteworth.tally.TallyTable} keeps
 * them in parallel primitive arrays and is the reviewer table every later stage reads;
 * {@link org.voteworth.tally.ReviewerTally} is one reviewer's tally as a value. Both merge with
 * one associative, order-independent operation, so partial tallies from files, byte ranges,
 * spilled partitions or a cluster combine into the same result.
 */
package org.voteworth.tally;
