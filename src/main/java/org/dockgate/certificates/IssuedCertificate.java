package org.dockgate.certificates;

import java.time.Instant;
import java.util.List;

/**
 * An entry of the certificate register. The entry and its PDF never change; {@code status},
 * {@code supersededBy}, {@code supersededAt} and {@code supersessionReason} come from the supersession
 * made by a later reissue.
 */
public record IssuedCertificate(long id, String certificateNumber, int revision, String replacesNumber,
                                String reissueReason, Long lotId, String lotReference, String supplier,
                                List<String> serials, String signerUsername, String signerName,
                                long signingIdentityId, String signerCertificateSha256, String meaning,
                                Instant signedAt, String pdfSha256, long pdfSize, Status status,
                                String supersededBy, Instant supersededAt, String supersessionReason) {

    public enum Status { ISSUED, SUPERSEDED }

    public IssuedCertificate {
        serials = List.copyOf(serials);
    }

    public boolean superseded() {
        return status == Status.SUPERSEDED;
    }
}
