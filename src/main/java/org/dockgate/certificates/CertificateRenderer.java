package org.dockgate.certificates;

/**
 * Renders the unsigned PDF of a certificate once the register has given it its number. Use
 * {@link CertificatePdfWriter#open(CertificateHeading, String)} so the document carries the number, the
 * verification QR code, the caution and the signature field.
 */
@FunctionalInterface
public interface CertificateRenderer {

    byte[] render(CertificateHeading heading);
}
