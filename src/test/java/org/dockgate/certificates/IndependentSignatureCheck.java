package org.dockgate.certificates;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.cert.CertificateFactory;
import java.security.cert.X509Certificate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collection;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.interactive.digitalsignature.PDSignature;
import org.apache.pdfbox.text.PDFTextStripper;
import org.bouncycastle.asn1.ASN1InputStream;
import org.bouncycastle.asn1.ASN1OctetString;
import org.bouncycastle.asn1.cms.CMSAttributes;
import org.bouncycastle.asn1.cms.ContentInfo;
import org.bouncycastle.asn1.pkcs.PKCSObjectIdentifiers;
import org.bouncycastle.cert.X509CertificateHolder;
import org.bouncycastle.cms.CMSProcessableByteArray;
import org.bouncycastle.cms.CMSSignedData;
import org.bouncycastle.cms.SignerInformation;
import org.bouncycastle.cms.jcajce.JcaSimpleSignerInfoVerifierBuilder;
import org.junit.jupiter.api.Assumptions;

/**
 * Checks a signed PDF without any of Dockgate's code: PDFBox 3 reads the signature dictionary, byte
 * range and contents; BouncyCastle's CMS classes verify the signer; the chain is checked by hand
 * against a root certificate given by the test. And poppler's pdfsig, a third implementation.
 */
final class IndependentSignatureCheck {

    private IndependentSignatureCheck() {
    }

    /** What PDFBox + BouncyCastle found; {@code problems} is empty for a good signature. */
    record Report(List<String> problems, String subFilter, String signerSubject, int[] byteRange) {
        boolean valid() {
            return problems.isEmpty();
        }
    }

    static Report check(byte[] pdf, X509Certificate root) throws Exception {
        List<String> problems = new ArrayList<>();
        try (PDDocument document = Loader.loadPDF(pdf)) {
            List<PDSignature> signatures = document.getSignatureDictionaries();
            if (signatures.size() != 1) {
                problems.add(signatures.size() + " signatures");
                return new Report(problems, null, null, null);
            }
            PDSignature signature = signatures.get(0);
            int[] range = signature.getByteRange();
            // ISO 32000-1 12.8.1: the byte range covers the whole file except the /Contents hex string.
            if (range.length != 4 || range[0] != 0 || range[2] + range[3] != pdf.length) {
                problems.add("byte range " + Arrays.toString(range) + " does not reach both ends of " + pdf.length);
            }
            if (pdf[range[1]] != '<' || pdf[range[2] - 1] != '>') {
                problems.add("the gap is not exactly the /Contents hex string");
            }
            byte[] contents = signature.getContents(pdf);
            byte[] signedContent = signature.getSignedContent(pdf);
            // /Contents is zero-padded: read only the first ASN.1 object.
            ContentInfo info;
            try (ASN1InputStream in = new ASN1InputStream(new ByteArrayInputStream(contents))) {
                info = ContentInfo.getInstance(in.readObject());
            }
            CMSSignedData cms = new CMSSignedData(new CMSProcessableByteArray(signedContent), info);
            SignerInformation signer = cms.getSignerInfos().getSigners().iterator().next();
            @SuppressWarnings("unchecked")
            Collection<X509CertificateHolder> matches = cms.getCertificates().getMatches(signer.getSID());
            X509Certificate certificate = (X509Certificate) CertificateFactory.getInstance("X.509")
                    .generateCertificate(new ByteArrayInputStream(matches.iterator().next().getEncoded()));
            // RFC 5652 11.2: the message-digest attribute is the digest of the signed content.
            byte[] digest = MessageDigest.getInstance("SHA-256").digest(signedContent);
            byte[] signedDigest = ASN1OctetString.getInstance(signer.getSignedAttributes()
                    .get(CMSAttributes.messageDigest).getAttrValues().getObjectAt(0)).getOctets();
            if (!Arrays.equals(digest, signedDigest)) {
                problems.add("message digest does not match the signed bytes");
            }
            try {
                if (!signer.verify(new JcaSimpleSignerInfoVerifierBuilder().build(certificate))) {
                    problems.add("signature value does not verify");
                }
            } catch (Exception e) {
                problems.add("signature does not verify: " + e.getMessage());
            }
            // RFC 5035: PAdES requires the signing-certificate-v2 signed attribute.
            if (signer.getSignedAttributes().get(PKCSObjectIdentifiers.id_aa_signingCertificateV2) == null) {
                problems.add("no signing-certificate-v2 attribute");
            }
            // The chain: the signer's certificate is signed by the lab root's key and names it as issuer.
            try {
                certificate.verify(root.getPublicKey());
                if (!certificate.getIssuerX500Principal().equals(root.getSubjectX500Principal())) {
                    problems.add("issuer name differs from the root's subject");
                }
                certificate.checkValidity();
            } catch (Exception e) {
                problems.add("signer certificate does not chain to the lab root: " + e.getMessage());
            }
            return new Report(problems, signature.getSubFilter(), certificate.getSubjectX500Principal().getName(),
                    range);
        }
    }

    static String text(byte[] pdf) throws IOException {
        try (PDDocument document = Loader.loadPDF(pdf)) {
            return new PDFTextStripper().getText(document);
        }
    }

    /**
     * The text with form fields flattened into the pages first, so that the visible signature block (the
     * signature widget's appearance stream) is extracted too.
     */
    static String textWithFields(byte[] pdf) throws IOException {
        try (PDDocument document = Loader.loadPDF(pdf)) {
            var form = document.getDocumentCatalog().getAcroForm();
            if (form != null) {
                form.flatten();
            }
            return new PDFTextStripper().getText(document);
        }
    }

    static int pages(byte[] pdf) throws IOException {
        try (PDDocument document = Loader.loadPDF(pdf)) {
            return document.getNumberOfPages();
        }
    }

    /**
     * Poppler's pdfsig output for the file, or a skipped test when pdfsig is missing outside CI (with
     * CI=true a missing pdfsig fails: .ci/run installs poppler-utils).
     */
    static String pdfsig(byte[] pdf) throws Exception {
        Path tool = Path.of("/usr/bin/pdfsig");
        if (!Files.isExecutable(tool)) {
            if ("true".equals(System.getenv("CI"))) {
                throw new AssertionError("pdfsig (poppler-utils) is missing, and CI=true requires it");
            }
            Assumptions.abort("pdfsig (Debian poppler-utils) is not installed; skipping the poppler check");
        }
        Path file = Files.createTempFile("dockgate-signed", ".pdf");
        try {
            Files.write(file, pdf);
            Process process = new ProcessBuilder(tool.toString(), file.toString()).redirectErrorStream(true).start();
            String output = new String(process.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
            if (!process.waitFor(60, TimeUnit.SECONDS)) {
                process.destroyForcibly();
                throw new AssertionError("pdfsig did not finish");
            }
            return output;
        } finally {
            Files.deleteIfExists(file);
        }
    }
}
