package org.dockgate.certificates;

import java.time.Instant;

/**
 * A certification authority Dockgate knows: the lab's own root or an imported CA.
 *
 * @param trusted   its certificate is in the key store, so signatures chaining to it verify
 * @param canIssue  its private key is in the key store, so it can issue signing certificates
 * @param issuing   it is the one that issues new signing certificates
 */
public record SigningAuthority(long id, Kind kind, String subject, String fingerprintSha256, String certificatePem,
                               Instant notAfter, String addedBy, Instant addedAt, boolean trusted, boolean canIssue,
                               boolean issuing) {

    public enum Kind { LAB_ROOT, IMPORTED_CA }
}
