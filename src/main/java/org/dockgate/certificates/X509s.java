package org.dockgate.certificates;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.security.GeneralSecurityException;
import java.security.InvalidAlgorithmParameterException;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.security.cert.CertPathBuilder;
import java.security.cert.CertPathBuilderException;
import java.security.cert.CertStore;
import java.security.cert.Certificate;
import java.security.cert.CertificateEncodingException;
import java.security.cert.CertificateException;
import java.security.cert.CertificateFactory;
import java.security.cert.CollectionCertStoreParameters;
import java.security.cert.PKIXBuilderParameters;
import java.security.cert.PKIXCertPathBuilderResult;
import java.security.cert.TrustAnchor;
import java.security.cert.X509CertSelector;
import java.security.cert.X509Certificate;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Collection;
import java.util.Date;
import java.util.HashSet;
import java.util.HexFormat;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import javax.naming.InvalidNameException;
import javax.naming.ldap.LdapName;
import javax.naming.ldap.Rdn;
import org.bouncycastle.openssl.jcajce.JcaPEMWriter;

/** Small X.509 helpers: PEM, fingerprints, names, and certificate path validation against trusted CAs. */
final class X509s {

    private X509s() {
    }

    static byte[] sha256(byte[] data) {
        try {
            return MessageDigest.getInstance("SHA-256").digest(data);
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is not available", e);
        }
    }

    static String sha256Hex(byte[] data) {
        return HexFormat.of().formatHex(sha256(data));
    }

    /** SHA-256 of the DER encoding, lower-case hex: the certificate's fingerprint. */
    static String fingerprint(X509Certificate certificate) {
        return sha256Hex(encoded(certificate));
    }

    static byte[] encoded(X509Certificate certificate) {
        try {
            return certificate.getEncoded();
        } catch (CertificateEncodingException e) {
            throw new IllegalStateException("A certificate cannot be encoded", e);
        }
    }

    static String serialHex(X509Certificate certificate) {
        return certificate.getSerialNumber().toString(16).toUpperCase();
    }

    static String subject(X509Certificate certificate) {
        return certificate.getSubjectX500Principal().getName();
    }

    static String issuer(X509Certificate certificate) {
        return certificate.getIssuerX500Principal().getName();
    }

    /** The common name of a distinguished name (RFC 2253 text), or the whole name when it has none. */
    static String commonName(String distinguishedName) {
        try {
            for (Rdn rdn : new LdapName(distinguishedName).getRdns()) {
                if (rdn.getType().equalsIgnoreCase("CN")) {
                    return String.valueOf(rdn.getValue());
                }
            }
        } catch (InvalidNameException e) {
            // fall through: show the name as it is
        }
        return distinguishedName;
    }

    static String pem(List<X509Certificate> certificates) {
        StringWriter text = new StringWriter();
        try (JcaPEMWriter writer = new JcaPEMWriter(text)) {
            for (X509Certificate certificate : certificates) {
                writer.writeObject(certificate);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return text.toString();
    }

    static String pem(X509Certificate certificate) {
        return pem(List.of(certificate));
    }

    static List<X509Certificate> parsePem(String pem) {
        if (pem == null || pem.isBlank()) {
            return List.of();
        }
        try {
            Collection<? extends Certificate> parsed = CertificateFactory.getInstance("X.509")
                    .generateCertificates(new ByteArrayInputStream(pem.getBytes(StandardCharsets.US_ASCII)));
            List<X509Certificate> certificates = new ArrayList<>();
            parsed.forEach(c -> certificates.add((X509Certificate) c));
            return certificates;
        } catch (CertificateException e) {
            throw new IllegalStateException("A stored certificate cannot be read", e);
        }
    }

    static X509Certificate parseDer(byte[] der) throws CertificateException {
        return (X509Certificate) CertificateFactory.getInstance("X.509").generateCertificate(new ByteArrayInputStream(der));
    }

    /** May the certificate make signatures (key usage digitalSignature or nonRepudiation, or no key usage at all)? */
    static boolean maySign(X509Certificate certificate) {
        boolean[] usage = certificate.getKeyUsage();
        return usage == null || usage[0] || (usage.length > 1 && usage[1]);
    }

    /** Is the certificate a CA certificate (basic constraints CA, and keyCertSign when key usage is present)? */
    static boolean isCa(X509Certificate certificate) {
        boolean[] usage = certificate.getKeyUsage();
        return certificate.getBasicConstraints() >= 0 && (usage == null || (usage.length > 5 && usage[5]));
    }

    /**
     * Builds and validates the certification path from {@code target} to one of the trusted CAs (RFC 5280
     * path validation as the JDK's PKIX implementation does it, without revocation checking: Dockgate's
     * revocation is "no new signatures", checked against the register), at the given moment.
     *
     * @return the trust anchor reached, or empty with the reason in {@code problem}
     */
    static PathResult validatePath(X509Certificate target, Collection<X509Certificate> intermediates,
                                   Collection<X509Certificate> anchors, Instant at) {
        if (anchors.isEmpty()) {
            return new PathResult(Optional.empty(), "No certification authority is trusted yet.");
        }
        try {
            Set<TrustAnchor> trust = new HashSet<>();
            for (X509Certificate anchor : anchors) {
                if (anchor.equals(target)) {
                    return new PathResult(Optional.of(anchor), null);
                }
                trust.add(new TrustAnchor(anchor, null));
            }
            X509CertSelector selector = new X509CertSelector();
            selector.setCertificate(target);
            PKIXBuilderParameters parameters = new PKIXBuilderParameters(trust, selector);
            parameters.setRevocationEnabled(false);
            parameters.setDate(Date.from(at));
            List<Certificate> pool = new ArrayList<>(intermediates);
            pool.add(target);
            parameters.addCertStore(CertStore.getInstance("Collection", new CollectionCertStoreParameters(pool)));
            PKIXCertPathBuilderResult result = (PKIXCertPathBuilderResult) CertPathBuilder.getInstance("PKIX")
                    .build(parameters);
            return new PathResult(Optional.of(result.getTrustAnchor().getTrustedCert()), null);
        } catch (CertPathBuilderException e) {
            return new PathResult(Optional.empty(), "no valid certification path to a trusted CA at " + at
                    + (e.getMessage() == null ? "" : " (" + e.getMessage() + ")"));
        } catch (InvalidAlgorithmParameterException e) {
            return new PathResult(Optional.empty(), "the trusted CAs cannot be used (" + e.getMessage() + ")");
        } catch (GeneralSecurityException e) {
            return new PathResult(Optional.empty(), "the certification path cannot be checked (" + e.getMessage() + ")");
        }
    }

    record PathResult(Optional<X509Certificate> anchor, String problem) {
        boolean trusted() {
            return anchor.isPresent();
        }
    }
}
