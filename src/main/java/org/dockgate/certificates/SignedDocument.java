package org.dockgate.certificates;

import java.time.Instant;

/**
 * A PDF with Dockgate's PAdES signature.
 *
 * @param pdf                       the signed bytes (the file to store and hand out unchanged)
 * @param sha256                    SHA-256 of {@code pdf}, lower-case hex
 * @param signedAt                  the signing time written into the signature dictionary (/M), whole seconds
 * @param signingIdentityId         the signer's identity in the register of signers
 * @param certificateSerialHex      serial of the signer's certificate
 * @param certificateFingerprintSha256 SHA-256 of the signer's certificate
 */
public record SignedDocument(byte[] pdf, String sha256, String signerUsername, String signerName, String meaning,
                             Instant signedAt, long signingIdentityId, String certificateSerialHex,
                             String certificateFingerprintSha256) {
}
