package org.dockgate.certificates;

/**
 * What a certificate document must print about its own identity, handed by the register to whoever
 * renders the PDF: its number, revision and, for a reissue, the certificate it replaces and why.
 *
 * @param replacesNumber null for a first issue
 * @param reissueReason  null for a first issue
 */
public record CertificateHeading(String certificateNumber, int revision, String replacesNumber, String reissueReason) {

    public CertificateHeading {
        if (certificateNumber == null || certificateNumber.isBlank()) {
            throw new IllegalArgumentException("A certificate needs its number.");
        }
        if (revision < 1) {
            throw new IllegalArgumentException("A certificate revision starts at 1.");
        }
        if ((replacesNumber == null) != (reissueReason == null)) {
            throw new IllegalArgumentException("A reissue names the certificate it replaces and the reason together.");
        }
    }

    public static CertificateHeading first(String certificateNumber) {
        return new CertificateHeading(certificateNumber, 1, null, null);
    }

    public boolean reissue() {
        return replacesNumber != null;
    }
}
