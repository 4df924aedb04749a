package org.dockgate.certificates;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.ByteArrayOutputStream;
import java.security.KeyStore;
import java.security.cert.Certificate;
import java.time.Instant;
import java.util.UUID;
import org.dockgate.accounts.AccountService;
import org.dockgate.platform.Role;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;

/**
 * Importing the organisation's CA and a person's own certificate as PKCS#12, and the key store's
 * password rule. The imported CA (with its key) issues the following grants; a person's certificate
 * from an unknown CA is refused.
 */
// Its own data folder AND its own in-memory database, on every run: importing a CA and re-keying people
// changes which signing keys the database expects, which must not leak into a database that other test
// contexts share (the PostgreSQL run shares one database between all of them).
@SpringBootTest(properties = {"dockgate.data-dir=target/test-data/import-${random.uuid}",
    "spring.datasource.url=jdbc:h2:mem:import-${random.uuid};DB_CLOSE_DELAY=-1",
    "spring.datasource.username=sa", "spring.datasource.password="})
class SigningImportTest {

    @Autowired AccountService accounts;
    @Autowired SigningIdentityService identities;
    @Autowired SigningService signing;
    @Autowired CertificatePdfWriter writer;
    @Autowired CertificateVerifier verifier;
    @Autowired org.dockgate.platform.DataDirectory data;

    private static byte[] pkcs12(String alias, java.security.PrivateKey key, Certificate[] chain, char[] password)
            throws Exception {
        KeyStore store = KeyStore.getInstance("PKCS12");
        store.load(null, password);
        store.setKeyEntry(alias, key, password, chain);
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        store.store(out, password);
        return out.toByteArray();
    }

    private static String newUser(AccountService accounts) {
        String name = "import-" + UUID.randomUUID().toString().substring(0, 8);
        accounts.create(name, "Imported " + name.substring(7), "import-password", java.util.Set.of(Role.ENGINEER));
        return name;
    }

    @Test
    void aPersonsOwnCertificateFromAnImportedCaSignsAndVerifies() throws Exception {
        char[] password = "org-ca-password".toCharArray();
        // The organisation's CA, made outside Dockgate (here with the same helper, standing in for any CA).
        var orgCa = LabCertificateAuthority.createRoot("Invented Organisation PKI", false, Instant.now());
        String person = newUser(accounts);
        var personal = LabCertificateAuthority.issueSigner("Imported Person", person, "Invented Organisation",
                orgCa.keys().getPrivate(), orgCa.certificate(), Instant.now(), 2);

        byte[] personFile = pkcs12("me", personal.keys().getPrivate(),
                new Certificate[] {personal.certificate(), orgCa.certificate()}, password);
        assertThatThrownBy(() -> identities.importIdentity(person, personFile, password, "admin"))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("Import the CA that issued it first");

        // Import the CA without its key: trusted for verification only.
        KeyStore caOnly = KeyStore.getInstance("PKCS12");
        caOnly.load(null, password);
        caOnly.setCertificateEntry("ca", orgCa.certificate());
        ByteArrayOutputStream caBytes = new ByteArrayOutputStream();
        caOnly.store(caBytes, password);
        SigningAuthority authority = identities.importAuthority(caBytes.toByteArray(), password, "admin");
        assertThat(authority.trusted()).isTrue();
        assertThat(authority.canIssue()).isFalse();

        SigningIdentity identity = identities.importIdentity(person, personFile, password, "admin");
        assertThat(identity.origin()).isEqualTo(SigningIdentity.Origin.IMPORTED);
        assertThat(identity.keyPresent()).isTrue();
        SignedDocument signed = signing.sign(SigningFixtures.render(writer, CertificateHeading.first("TEST-IMPORTED"), 0),
                person, "approved for release");
        VerificationResult result = verifier.verify(signed.pdf());
        assertThat(result.checks()).anyMatch(c -> c.name().equals("Issuer") && c.passed()
                && c.detail().contains("Invented Organisation PKI"));
        assertThat(result.checks()).anyMatch(c -> c.name().equals("Integrity") && c.passed());
        // Not in the register (signed directly), so not a valid certificate of the lab.
        assertThat(result.valid()).isFalse();
        assertThat(result.reasons()).anyMatch(r -> r.contains("There is no certificate TEST-IMPORTED in the register"));

        assertThatThrownBy(() -> identities.importIdentity(newUser(accounts), personFile, "wrong".toCharArray(), "admin"))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("password is wrong");
    }

    @Test
    void anImportedCaWithItsKeyIssuesTheNextGrants() throws Exception {
        char[] password = "issuing-ca-password".toCharArray();
        var orgCa = LabCertificateAuthority.createRoot("Invented Issuing CA", false, Instant.now());
        byte[] file = pkcs12("ca", orgCa.keys().getPrivate(), new Certificate[] {orgCa.certificate()}, password);
        SigningAuthority authority = identities.importAuthority(file, password, "admin");
        assertThat(authority.canIssue()).isTrue();
        assertThat(authority.issuing()).isTrue();
        assertThat(identities.overview().issuing().orElseThrow().id()).isEqualTo(authority.id());

        String person = newUser(accounts);
        SigningIdentity granted = identities.grant(person, "admin");
        assertThat(granted.issuer()).contains("Invented Issuing CA");
        assertThatThrownBy(() -> identities.importAuthority(file, password, "admin"))
                .isInstanceOf(IllegalStateException.class).hasMessageContaining("already known");
    }

    @Test
    void aPersonsCertificateIsNotACa() throws Exception {
        char[] password = "x-password".toCharArray();
        var lonely = LabCertificateAuthority.createRoot("Lonely", false, Instant.now());
        var personal = LabCertificateAuthority.issueSigner("Someone", "someone", "Lonely", lonely.keys().getPrivate(),
                lonely.certificate(), Instant.now(), 1);
        byte[] file = pkcs12("p", personal.keys().getPrivate(), new Certificate[] {personal.certificate()}, password);
        assertThatThrownBy(() -> identities.importAuthority(file, password, "admin"))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("not a CA certificate");
        assertThatThrownBy(() -> identities.importAuthority("not pkcs12".getBytes(), password, "admin"))
                .isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void withoutAKeyStorePasswordDockgateRefusesToStart() {
        // The postgres profile sets dockgate.signing.keystore-password=${DOCKGATE_KEYSTORE_PASSWORD:}.
        assertThatThrownBy(() -> new SigningKeyStore(data, ""))
                .isInstanceOf(IllegalStateException.class).hasMessageContaining("DOCKGATE_KEYSTORE_PASSWORD");
        assertThatThrownBy(() -> new SigningKeyStore(data, "  ")).isInstanceOf(IllegalStateException.class);
    }
}
