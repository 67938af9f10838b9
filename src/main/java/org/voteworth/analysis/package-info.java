/**
 * The analyses users come for, on top of the ranker: how sure each rank is
 * ({@link org.voteworth.analysis.RankUncertainty}), whether a list depends on its entry bar
 * ({@link org.voteworth.analysis.ThresholdSweep}), how ranking rules differ
 * ({@link org.voteworth.analysis.RuleComparison}) and whether a promotion list holds up
 * ({@link org.voteworth.analysis.PromotionAudit}). Results are records; writers live in
 * {@code report}.
 */
package org.voteworth.analysis;
