package org.dockgate.certificates;

import java.time.Instant;
import java.util.List;

/**
 * The outcome of checking an uploaded PDF.
 *
 * @param valid             every check passed: a genuine, complete, registered and current certificate
 * @param reasons           why it is not valid (empty when valid), in words for people
 * @param checks            every check made, passed or not, for the page
 * @param disagreements     where the register's entry for this file contradicts the document (empty when it
 *                          agrees or no entry was found); any one makes the file not valid
 * @param certificateNumber the number the register or the document names, or null
 * @param signer            the signer's name as the signature states it: the subject CN of the signing
 *                          certificate inside the CMS, never the register's; null when no certificate is readable
 * @param signedAt          when it was signed as the signature states it (/M), else the register's time, or null
 * @param superseded        the register marks the certificate superseded by a reissue
 * @param supersededBy      the replacement's number when superseded
 */
public record VerificationResult(boolean valid, List<String> reasons, List<Check> checks,
                                 List<Disagreement> disagreements, String certificateNumber, String signer,
                                 Instant signedAt, boolean superseded, String supersededBy) {

    public VerificationResult {
        reasons = List.copyOf(reasons);
        checks = List.copyOf(checks);
        disagreements = List.copyOf(disagreements);
    }

    /**
     * One field on which the register's entry and the document differ.
     *
     * @param field    a stable key: certificateNumber, sha256, storedCopy, size, signerCertificate, signer,
     *                 signedAt or meaning
     * @param label    the field in words
     * @param document what the document (or its signature) says
     * @param register what the register says
     */
    public record Disagreement(String field, String label, String document, String register) {
    }

    /** One check and its outcome, in words. */
    public record Check(String name, boolean passed, String detail) {
    }
}
