package org.dockgate.certificates;

import java.time.Instant;
import java.util.List;

/**
 * The outcome of checking an uploaded PDF.
 *
 * @param valid             every check passed: a genuine, complete, registered and current certificate
 * @param reasons           why it is not valid (empty when valid), in words for people
 * @param checks            every check made, passed or not, for the page
 * @param certificateNumber the number the register or the document names, or null
 * @param signer            the signer's name (from the register, else the signing certificate), or null
 * @param signedAt          when it was signed (the register's time, else the signature's claimed time), or null
 * @param superseded        the register marks the certificate superseded by a reissue
 * @param supersededBy      the replacement's number when superseded
 */
public record VerificationResult(boolean valid, List<String> reasons, List<Check> checks, String certificateNumber,
                                 String signer, Instant signedAt, boolean superseded, String supersededBy) {

    public VerificationResult {
        reasons = List.copyOf(reasons);
        checks = List.copyOf(checks);
    }

    /** One check and its outcome, in words. */
    public record Check(String name, boolean passed, String detail) {
    }
}
