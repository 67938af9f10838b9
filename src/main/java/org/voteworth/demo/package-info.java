/**
 * The generator of a review dump for Quarrendale Market, a fictional online marketplace: realistic
 * distributions, planted reviewers that show what ranking by raw share gets wrong, and malformed
 * rows of every kind the reader must reject.
 */
package org.voteworth.demo;
