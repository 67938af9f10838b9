/**
 * The {@code voteworth} command line: one picocli command per job. The only package that wires
 * the stages together.
 */
package org.voteworth.cli;
