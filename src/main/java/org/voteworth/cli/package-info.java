/**
 * The {@code voteworth} command line: one picocli command per job. With {@code org.voteworth.api}
 * (the library API), one of the two packages that wire the stages together.
 */
package org.voteworth.cli;
