/**
 * The library API: voteworth as an analyst uses it from Java code or a notebook cell.
 *
 * <p>{@link org.voteworth.api.Dump} opens a dump (or generates the demo marketplace's) and tallies
 * it into a {@link org.voteworth.api.ReviewerTable}; the table ranks under a
 * {@link org.voteworth.api.Rule} into a {@link org.voteworth.api.Ranking}, which shows its top k,
 * explains a rank, sweeps entry bars, compares rules and audits a promotion list. Every result a
 * person reads is a {@link org.voteworth.api.Display}: plain text for a terminal, Markdown (with the
 * cautions) for a notebook.
 *
 * <p>Besides {@code cli}, this is the one package allowed to wire the others together (source,
 * tally, score, analysis, report, demo); it adds no statistics of its own and keeps their rules:
 * every input row is accepted or written to the rejects file, every tally carries its
 * reconciliation, and ids can be pseudonymised in every output.
 */
package org.voteworth.api;
