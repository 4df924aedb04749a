package org.dockgate.certificates;

import java.math.BigInteger;
import java.security.GeneralSecurityException;
import java.security.KeyPair;
import java.security.KeyPairGenerator;
import java.security.PrivateKey;
import java.security.SecureRandom;
import java.security.cert.X509Certificate;
import java.security.spec.ECGenParameterSpec;
import java.time.Duration;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.Date;
import org.bouncycastle.asn1.x500.X500Name;
import org.bouncycastle.asn1.x500.X500NameBuilder;
import org.bouncycastle.asn1.x500.style.BCStyle;
import org.bouncycastle.asn1.x509.BasicConstraints;
import org.bouncycastle.asn1.x509.Extension;
import org.bouncycastle.asn1.x509.KeyUsage;
import org.bouncycastle.cert.CertIOException;
import org.bouncycastle.cert.X509v3CertificateBuilder;
import org.bouncycastle.cert.jcajce.JcaX509CertificateConverter;
import org.bouncycastle.cert.jcajce.JcaX509ExtensionUtils;
import org.bouncycastle.cert.jcajce.JcaX509v3CertificateBuilder;
import org.bouncycastle.operator.OperatorCreationException;
import org.bouncycastle.operator.jcajce.JcaContentSignerBuilder;

/**
 * The lab's small certification authority, with BouncyCastle: a self-signed root and signing
 * certificates for people. Keys are EC P-256 with SHA-256 (ECDSA, FIPS 186-4 curve P-256; accepted by
 * PAdES baseline signatures per ETSI TS 119 312), fast enough to create on first start.
 */
final class LabCertificateAuthority {

    static final String KEY_ALGORITHM = "EC";
    static final String CURVE = "secp256r1";
    private static final SecureRandom RANDOM = new SecureRandom();

    private LabCertificateAuthority() {
    }

    record Issued(KeyPair keys, X509Certificate certificate) {
    }

    static KeyPair newKeyPair() {
        try {
            KeyPairGenerator generator = KeyPairGenerator.getInstance(KEY_ALGORITHM);
            generator.initialize(new ECGenParameterSpec(CURVE), RANDOM);
            return generator.generateKeyPair();
        } catch (GeneralSecurityException e) {
            throw new IllegalStateException("Cannot create an EC P-256 key pair", e);
        }
    }

    /**
     * The lab's root: self-signed, CA with path length 0 (it signs only people's certificates), key usage
     * keyCertSign and cRLSign (RFC 5280 4.2.1.3, 4.2.1.9), valid 20 years.
     */
    static Issued createRoot(String labName, boolean demo, Instant now) {
        KeyPair keys = newKeyPair();
        X500Name name = new X500NameBuilder(BCStyle.INSTANCE)
                .addRDN(BCStyle.O, clip(labName, 64))
                .addRDN(BCStyle.CN, clip(labName, 40) + " signing root" + (demo ? " (DEMO)" : ""))
                .build();
        try {
            JcaX509ExtensionUtils extensions = new JcaX509ExtensionUtils();
            X509v3CertificateBuilder builder = new JcaX509v3CertificateBuilder(name, randomSerial(),
                    Date.from(now.minus(Duration.ofHours(1))),
                    Date.from(now.atOffset(ZoneOffset.UTC).plusYears(20).toInstant()), name, keys.getPublic())
                    .addExtension(Extension.basicConstraints, true, new BasicConstraints(0))
                    .addExtension(Extension.keyUsage, true, new KeyUsage(KeyUsage.keyCertSign | KeyUsage.cRLSign))
                    .addExtension(Extension.subjectKeyIdentifier, false,
                            extensions.createSubjectKeyIdentifier(keys.getPublic()));
            return new Issued(keys, sign(builder, keys.getPrivate()));
        } catch (GeneralSecurityException | CertIOException e) {
            throw new IllegalStateException("Cannot create the lab root certificate", e);
        }
    }

    /**
     * A person's signing certificate: subject CN = their display name (O = the lab; RDNs in the
     * conventional order, most significant first), random 127-bit serial
     * (RFC 5280 4.1.2.2: positive, at most 20 octets; CA/B Forum practice of at least 64 random bits),
     * key usage digitalSignature and nonRepudiation (RFC 5280 4.2.1.3), not a CA.
     */
    static Issued issueSigner(String displayName, String username, String labName, PrivateKey issuerKey,
                              X509Certificate issuer, Instant now, int validityYears) {
        KeyPair keys = newKeyPair();
        X500Name subject = new X500NameBuilder(BCStyle.INSTANCE)
                .addRDN(BCStyle.O, clip(labName, 64))
                .addRDN(BCStyle.UID, clip(username, 64))
                .addRDN(BCStyle.CN, clip(displayName, 64))
                .build();
        Instant notAfter = now.atOffset(ZoneOffset.UTC).plusYears(validityYears).toInstant();
        if (notAfter.isAfter(issuer.getNotAfter().toInstant())) {
            notAfter = issuer.getNotAfter().toInstant();
        }
        try {
            JcaX509ExtensionUtils extensions = new JcaX509ExtensionUtils();
            X509v3CertificateBuilder builder = new JcaX509v3CertificateBuilder(issuer, randomSerial(),
                    Date.from(now.minus(Duration.ofMinutes(5))), Date.from(notAfter), subject, keys.getPublic())
                    .addExtension(Extension.basicConstraints, true, new BasicConstraints(false))
                    .addExtension(Extension.keyUsage, true,
                            new KeyUsage(KeyUsage.digitalSignature | KeyUsage.nonRepudiation))
                    .addExtension(Extension.subjectKeyIdentifier, false,
                            extensions.createSubjectKeyIdentifier(keys.getPublic()))
                    .addExtension(Extension.authorityKeyIdentifier, false,
                            extensions.createAuthorityKeyIdentifier(issuer));
            return new Issued(keys, sign(builder, issuerKey));
        } catch (GeneralSecurityException | CertIOException e) {
            throw new IllegalStateException("Cannot issue a signing certificate", e);
        }
    }

    /** SHA256withECDSA for EC keys, SHA256withRSA for RSA keys (an imported CA or person may hold either). */
    static String signatureAlgorithm(PrivateKey key) {
        return switch (key.getAlgorithm()) {
            case "EC", "ECDSA" -> "SHA256withECDSA";
            case "RSA" -> "SHA256withRSA";
            default -> throw new IllegalArgumentException("Keys of type " + key.getAlgorithm()
                    + " cannot sign here; use an EC or RSA key.");
        };
    }

    private static X509Certificate sign(X509v3CertificateBuilder builder, PrivateKey key)
            throws GeneralSecurityException {
        try {
            return new JcaX509CertificateConverter()
                    .getCertificate(builder.build(new JcaContentSignerBuilder(signatureAlgorithm(key)).build(key)));
        } catch (OperatorCreationException e) {
            throw new GeneralSecurityException(e);
        }
    }

    private static BigInteger randomSerial() {
        return new BigInteger(127, RANDOM).setBit(126);
    }

    private static String clip(String text, int max) {
        String clean = text == null ? "" : text.strip();
        return clean.length() <= max ? clean : clean.substring(0, max);
    }
}
