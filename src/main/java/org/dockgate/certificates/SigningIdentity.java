package org.dockgate.certificates;

import java.time.Instant;

/**
 * A person's signing certificate as the register of signers shows it.
 *
 * @param origin    ISSUED by the lab's CA, or IMPORTED by an ADMIN (the organisation's own PKI)
 * @param keyPresent whether the private key is in the key store (false after a key store was lost)
 * @param revokedAt when signing rights were revoked (no new signatures from then on); null while active
 */
public record SigningIdentity(long id, long userId, String username, String displayName, Origin origin,
                              String subject, String issuer, String serialHex, String fingerprintSha256,
                              String certificatePem, Instant notBefore, Instant notAfter, String grantedBy,
                              Instant grantedAt, Instant revokedAt, String revokedBy, String revokeReason,
                              boolean keyPresent, long version) {

    public enum Origin { ISSUED, IMPORTED }

    /** Not revoked. (Whether it can sign right now also depends on its validity period and key.) */
    public boolean active() {
        return revokedAt == null;
    }
}
