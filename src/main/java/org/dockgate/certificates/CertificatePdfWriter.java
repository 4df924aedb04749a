package org.dockgate.certificates;

import java.time.ZoneId;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.stereotype.Component;

/**
 * Starts certificate PDFs with the parts every certificate shares, so the content sections (lot,
 * sampling plan, units, instruments, decision) can be added by the evaluation module:
 * <ul>
 *   <li>a header on every page with the lab's name and address ({@code dockgate.lab.name},
 *       {@code dockgate.lab.address}) and the certificate number and revision;</li>
 *   <li>a footer "Page x of y" on every page (ISO/IEC 17025:2017 7.8.2.1 d, from memory: every part
 *       recognisable as a portion of the complete report, with a clear identification of the end);</li>
 *   <li>at the end: the safety caution, a QR code for the verification page
 *       {@code <dockgate.public-base-url>/verify/<number>}, and the empty signature field where the
 *       signer's visible signature block goes.</li>
 * </ul>
 * The certificate number is also written into the document information ({@link #INFO_CERTIFICATE_NUMBER}),
 * inside the signed bytes, so verification can name the certificate a file claims to be.
 */
@Component
public class CertificatePdfWriter {

    private static final org.slf4j.Logger LOG = org.slf4j.LoggerFactory.getLogger(CertificatePdfWriter.class);

    /** The caution every certificate carries (issue 6; common practice for incoming-inspection reports). */
    public static final String SAFETY_CAUTION = "Acceptance by incoming inspection does not by itself qualify a part"
            + " for a safety function; local codes and licensed practice govern.";
    /** Name of the blank signature field the signing service signs into. */
    public static final String SIGNATURE_FIELD = "Approval";
    /** Document-information key holding the certificate number. */
    public static final String INFO_CERTIFICATE_NUMBER = "DockgateCertificateNumber";
    public static final String INFO_REVISION = "DockgateCertificateRevision";

    private final PdfFonts fonts;
    private final String labName;
    private final String labAddress;
    private final String publicBaseUrl;
    private final ZoneId labZone;
    private final String receivingOrganisation;

    CertificatePdfWriter(PdfFonts fonts, @Value("${dockgate.lab.name:Dockgate laboratory}") String labName,
                         @Value("${dockgate.lab.address:}") String labAddress,
                         @Value("${dockgate.public-base-url:http://localhost:8080}") String publicBaseUrl,
                         @Value("${dockgate.lab.time-zone:UTC}") String labZone,
                         @Value("${dockgate.lab.receiving-organisation:}") String receivingOrganisation) {
        this.fonts = fonts;
        this.labName = labName;
        this.labAddress = labAddress;
        this.publicBaseUrl = publicBaseUrl.endsWith("/") ? publicBaseUrl.substring(0, publicBaseUrl.length() - 1)
                : publicBaseUrl;
        this.labZone = ZoneId.of(labZone);
        this.receivingOrganisation = receivingOrganisation == null || receivingOrganisation.isBlank()
                ? "the receiving organisation of " + labName : receivingOrganisation.strip();
        if (pointsToLocalhost()) {
            LOG.warn("dockgate.public-base-url is {}: the QR codes and verification links printed on certificates"
                    + " will point to this computer only. Set it to the address people reach Dockgate at.", this.publicBaseUrl);
        }
    }

    /**
     * Whether the verification links would point to this computer only (localhost, 127.x, ::1), so a
     * customer scanning the QR code reaches nothing: warned at start-up and marked on the signing page.
     */
    public boolean pointsToLocalhost() {
        String host;
        try {
            host = java.net.URI.create(publicBaseUrl).getHost();
        } catch (IllegalArgumentException e) {
            return false;
        }
        if (host == null) {
            return false;
        }
        String h = host.toLowerCase(java.util.Locale.ROOT);
        return h.equals("localhost") || h.endsWith(".localhost") || h.startsWith("127.") || h.equals("[::1]")
                || h.equals("::1") || h.equals("0.0.0.0");
    }

    /** {@code dockgate.public-base-url} without a trailing slash. */
    public String publicBaseUrl() {
        return publicBaseUrl;
    }

    /**
     * Who the work is done for (ISO/IEC 17025:2017 7.8.2.1 e): for incoming inspection the receiving
     * organisation or department, {@code dockgate.lab.receiving-organisation}.
     */
    public String receivingOrganisation() {
        return receivingOrganisation;
    }

    /**
     * A new A4 certificate document: header, footer and document information are set up; add the
     * content sections to {@link CertificateDocument#document()} and call {@link CertificateDocument#finish()}.
     *
     * @param title the document title, e.g. "Certificate of conformance"
     */
    public CertificateDocument open(CertificateHeading heading, String title) {
        if (title == null || title.isBlank()) {
            throw new IllegalArgumentException("A certificate needs a title.");
        }
        return new CertificateDocument(this, heading, title.strip());
    }

    /** The public verification page of a certificate, the QR code's target. */
    public String verificationUrl(String certificateNumber) {
        return publicBaseUrl + "/verify/" + certificateNumber;
    }

    public String labName() {
        return labName;
    }

    public String labAddress() {
        return labAddress;
    }

    /** The zone in which dates and times are printed ({@code dockgate.lab.time-zone}, default UTC). */
    public ZoneId labZone() {
        return labZone;
    }

    PdfFonts fonts() {
        return fonts;
    }
}
