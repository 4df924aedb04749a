package org.dockgate.certificates;

import java.io.ByteArrayInputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.KeyStore;
import java.security.cert.X509Certificate;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Set;
import java.util.UUID;
import java.util.function.Supplier;
import org.dockgate.accounts.AccountService;
import org.dockgate.platform.DataDirectory;
import org.dockgate.platform.Role;
import org.springframework.security.authentication.UsernamePasswordAuthenticationToken;
import org.springframework.security.core.authority.AuthorityUtils;
import org.springframework.security.core.context.SecurityContextHolder;

/** Test helpers: a fresh signer (unique name, so a shared database is fine), a rendered certificate, the lab root. */
final class SigningFixtures {

    static final String PASSWORD = "signer-password";

    private SigningFixtures() {
    }

    static String newSigner(AccountService accounts, SigningIdentityService identities, Role role) {
        String username = "signer-" + UUID.randomUUID().toString().substring(0, 8);
        accounts.create(username, "Test Signer " + username.substring(7), PASSWORD, Set.of(role));
        identities.grant(username, "admin");
        return username;
    }

    static byte[] render(CertificatePdfWriter writer, CertificateHeading heading, int extraParagraphs) {
        CertificateDocument document = writer.open(heading, "Certificate of conformance");
        document.section("Lot");
        Map<String, String> facts = new LinkedHashMap<>();
        facts.put("Supplier", "Invented Sensors Ltd");
        facts.put("Lot", "LOT-TEST-1");
        facts.put("Resistance at 0 °C", "100.02 Ω ± 0.05 Ω (k = 2)");
        document.facts(facts);
        for (int i = 0; i < extraParagraphs; i++) {
            document.paragraph("Filler paragraph " + i + " so that the certificate runs over several pages and the"
                    + " footer's page count can be checked on each of them.");
        }
        return document.finish();
    }

    static CertificateSubject subject(String serial) {
        return new CertificateSubject(null, "LOT-TEST-" + serial, "Invented Sensors Ltd",
                java.util.List.of(serial, serial + "-B"));
    }

    /** The lab root, read straight from the key store file with the configured test password. */
    static X509Certificate labRoot(DataDirectory data) throws Exception {
        Path file = data.root().resolve("keys").resolve("signing-keystore.p12");
        KeyStore store = KeyStore.getInstance("PKCS12");
        store.load(new ByteArrayInputStream(Files.readAllBytes(file)), "dockgate-demo-keystore".toCharArray());
        return (X509Certificate) store.getCertificate("lab-root");
    }

    static <T> T as(String username, Supplier<T> work) {
        var previous = SecurityContextHolder.getContext().getAuthentication();
        SecurityContextHolder.getContext().setAuthentication(UsernamePasswordAuthenticationToken.authenticated(
                username, null, AuthorityUtils.createAuthorityList("ROLE_ENGINEER")));
        try {
            return work.get();
        } finally {
            SecurityContextHolder.getContext().setAuthentication(previous);
        }
    }

    /** A copy with one byte changed at the first occurrence of {@code marker} outside the signature value. */
    static byte[] flipByteOf(byte[] pdf, String marker, int[] byteRange) {
        byte[] needle = marker.getBytes(java.nio.charset.StandardCharsets.ISO_8859_1);
        outer:
        for (int i = 0; i + needle.length <= pdf.length; i++) {
            for (int j = 0; j < needle.length; j++) {
                if (pdf[i + j] != needle[j]) {
                    continue outer;
                }
            }
            boolean inSignedRange = i < byteRange[1] || i >= byteRange[2];
            if (inSignedRange) {
                byte[] copy = pdf.clone();
                copy[i] = (byte) (copy[i] ^ 0x20);
                return copy;
            }
        }
        throw new AssertionError("marker " + marker + " not found in the signed range");
    }
}
