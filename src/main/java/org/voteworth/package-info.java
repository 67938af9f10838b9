/** voteworth: reviewer credibility from helpfulness votes. */
package org.voteworth;
