/**
 * Source: reading a review dump. {@link org.voteworth.source.DumpFinder} turns files, folders and
 * globs into {@link org.voteworth.source.DumpFile}s with a category from each name;
 * {@link org.voteworth.source.HeaderMapping} maps each file's header to the
 * {@link org.voteworth.source.Field}s; {@link org.voteworth.source.DumpScanner} scans the bytes
 * (plain or gzip) in a large buffer and {@link org.voteworth.source.RowParser}, the one
 * definition of a valid row, fills a {@link org.voteworth.source.ReviewRow} flyweight without
 * decoding the free text; valid rows go to a {@link org.voteworth.source.ReviewSink}, bad ones
 * with a reason to a {@link org.voteworth.source.RejectSink} (a
 * {@link org.voteworth.source.RejectLog} keeps them); {@link org.voteworth.source.ScanSummary}
 * reconciles read = accepted + rejected and {@link org.voteworth.source.RejectRateLimit} stops a
 * run whose files are being misread. {@link org.voteworth.source.DumpReader} ties it together.
 */
package org.voteworth.source;
