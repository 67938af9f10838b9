/**
 * Stage three: scoring. One class per ranking rule, named after its method
 * ({@link org.voteworth.score.WilsonLowerBound}, {@link org.voteworth.score.BayesianAverage}, ...),
 * the empirical-Bayes beta-binomial prior ({@link org.voteworth.score.EmpiricalBayesPrior}), the
 * {@link org.voteworth.score.Ranker} with the one tie order, and the
 * {@link org.voteworth.score.Explainer} that says why each reviewer stands where they stand. This
 * package knows nothing about files: it takes a reviewer table.
 */
package org.voteworth.score;
