package org.dockgate.audit;

import java.util.List;

/**
 * The result of recomputing the chain.
 *
 * @param intact           every entry matches its hash and its predecessor, and every seal matches
 * @param entries          how many entries were checked
 * @param firstBrokenEntry the sequence number of the first entry that does not match (for a cut-off
 *                         tail: the first sealed entry that is missing), or null when intact
 * @param problems         what did not match, in words
 */
public record ChainVerification(boolean intact, long entries, Long firstBrokenEntry, List<String> problems) {

    public ChainVerification {
        problems = List.copyOf(problems);
    }
}
