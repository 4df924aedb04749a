package org.dockgate.certificates;

import com.lowagie.text.pdf.AcroFields;
import com.lowagie.text.pdf.PdfArray;
import com.lowagie.text.pdf.PdfDate;
import com.lowagie.text.pdf.PdfDictionary;
import com.lowagie.text.pdf.PdfName;
import com.lowagie.text.pdf.PdfNumber;
import com.lowagie.text.pdf.PdfObject;
import com.lowagie.text.pdf.PdfReader;
import com.lowagie.text.pdf.PdfString;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.security.cert.CertificateException;
import java.security.cert.X509Certificate;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Calendar;
import java.util.Collection;
import java.util.HexFormat;
import java.util.List;
import java.util.Optional;
import org.bouncycastle.asn1.ASN1InputStream;
import org.bouncycastle.asn1.ASN1Primitive;
import org.bouncycastle.asn1.cms.AttributeTable;
import org.bouncycastle.asn1.cms.ContentInfo;
import org.bouncycastle.asn1.ess.ESSCertIDv2;
import org.bouncycastle.asn1.ess.SigningCertificateV2;
import org.bouncycastle.asn1.nist.NISTObjectIdentifiers;
import org.bouncycastle.asn1.pkcs.PKCSObjectIdentifiers;
import org.bouncycastle.cert.X509CertificateHolder;
import org.bouncycastle.cms.CMSException;
import org.bouncycastle.cms.CMSProcessableByteArray;
import org.bouncycastle.cms.CMSSignedData;
import org.bouncycastle.cms.CMSSignerDigestMismatchException;
import org.bouncycastle.cms.SignerInformation;
import org.bouncycastle.cms.jcajce.JcaSimpleSignerInfoVerifierBuilder;
import org.bouncycastle.operator.OperatorCreationException;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * Checks any uploaded PDF, with OpenPDF (signature dictionaries) and BouncyCastle (CMS), independently
 * of how it was made:
 * <ol>
 *   <li>it is a PDF carrying exactly one signature, a PAdES one (sub-filter {@code ETSI.CAdES.detached});</li>
 *   <li>the signature covers the whole file: the /ByteRange (ISO 32000-1 12.8.1) runs from the first to the
 *       last byte and leaves out only the /Contents hex string;</li>
 *   <li>the CMS signature is cryptographically valid over those bytes (message digest and signature value,
 *       RFC 5652 5.4 and 5.6) and names its certificate with signing-certificate-v2 (RFC 5035);</li>
 *   <li>the signer's certificate allows signing and chains to this lab's CA or a trusted imported CA at
 *       the signing time, and the signer's rights were not revoked before that time;</li>
 *   <li>the register holds this very file and has not marked it superseded, and its entry agrees with what the
 *       signed document says: certificate number, SHA-256 and size (of the file and of the register's stored
 *       copy), the signer's certificate, the signer's name ({@code /Name}), the signing time ({@code /M}) and
 *       the meaning ({@code /Reason}). Every disagreement is named; any one makes the file not valid.</li>
 * </ol>
 * The signer reported is the subject CN of the signing certificate inside the CMS, never the register's
 * name: a register altered behind the application's back must not speak for the document. Nothing the file
 * says is trusted before it is checked; no input makes this throw.
 */
@Service
public class CertificateVerifier {

    private final CertificateRegister register;
    private final SigningIdentityService identities;

    CertificateVerifier(CertificateRegister register, SigningIdentityService identities) {
        this.register = register;
        this.identities = identities;
    }

    @Transactional(readOnly = true)
    public VerificationResult verify(byte[] file) {
        Outcome outcome = new Outcome();
        try {
            check(file, outcome);
        } catch (RuntimeException e) {
            // Malformed input must give an answer, not an error page: a file that breaks a parser is not valid.
            outcome.fail("Readable", "The file could not be checked completely: it is damaged or not a PDF ("
                    + e.getClass().getSimpleName() + ").");
        }
        return outcome.result();
    }

    private void check(byte[] file, Outcome outcome) {
        if (file == null || file.length == 0) {
            outcome.fail("PDF", "The file is empty.");
            return;
        }
        if (!looksLikePdf(file)) {
            outcome.fail("PDF", "The file is not a PDF document.");
            return;
        }
        String sha256 = X509s.sha256Hex(file);
        PdfReader reader;
        try {
            reader = new PdfReader(file);
        } catch (IOException | RuntimeException e) {
            outcome.fail("PDF", "The file is not a readable PDF document.");
            registerCheck(outcome, file, sha256, Claims.NONE, null);
            return;
        }
        try {
            outcome.pass("PDF", "The file is a readable PDF document.");
            String claimedNumber = reader.getInfo().get(CertificatePdfWriter.INFO_CERTIFICATE_NUMBER);
            AcroFields fields = reader.getAcroFields();
            List<String> names = fields.getSignedFieldNames();
            if (names.isEmpty()) {
                outcome.fail("Signature", "The document carries no digital signature.");
                registerCheck(outcome, file, sha256, Claims.number(claimedNumber), null);
                return;
            }
            if (names.size() > 1) {
                outcome.fail("Signature", "The document carries " + names.size()
                        + " signatures; a Dockgate certificate carries exactly one.");
            }
            String name = names.get(names.size() - 1);
            PdfDictionary dictionary = fields.getSignatureDictionary(name);
            PdfObject subFilter = PdfReader.getPdfObject(dictionary.get(PdfName.SUBFILTER));
            if (subFilter == null || !SigningService.SUB_FILTER.equals(PdfName.decodeName(subFilter.toString()))) {
                outcome.fail("Signature", "The signature is not a PAdES signature (sub-filter " + subFilter
                        + " instead of /" + SigningService.SUB_FILTER + ").");
                registerCheck(outcome, file, sha256, Claims.number(claimedNumber), null);
                return;
            }
            Instant claimedTime = signingTime(dictionary);
            Claims claims = new Claims(claimedNumber, claimedTime, text(dictionary, PdfName.NAME),
                    text(dictionary, PdfName.REASON));
            long[] range = byteRange(dictionary);
            byte[] signedBytes = coverage(file, range, outcome);
            if (signedBytes == null) {
                registerCheck(outcome, file, sha256, claims, null);
                return;
            }
            // Validate the certificate path at the register's signing time when the register knows this file;
            // else at the time the signature claims (/M), which is all a stranger's file offers.
            Instant at = register.findBySha256(sha256).map(IssuedCertificate::signedAt).orElse(claimedTime);
            X509Certificate signer = cms(file, range, signedBytes, at, outcome);
            registerCheck(outcome, file, sha256, claims, signer);
            if (signer != null) {
                revocationCheck(outcome, signer);
            }
        } finally {
            reader.close();
        }
    }

    /** The /ByteRange must be [0, a, b, c] with b + c = file length and exactly the /Contents string between. */
    private static byte[] coverage(byte[] file, long[] range, Outcome outcome) {
        if (range == null) {
            outcome.fail("Coverage", "The signature has no valid /ByteRange.");
            return null;
        }
        long a = range[0];
        long b = range[1];
        long c = range[2];
        long d = range[3];
        boolean inBounds = a >= 0 && b >= 0 && c >= a + b && d >= 0 && c + d <= file.length;
        if (!inBounds) {
            outcome.fail("Coverage", "The signature's /ByteRange points outside the file.");
            return null;
        }
        int gapStart = (int) (a + b);
        int gapEnd = (int) c;
        boolean gapIsContents = gapEnd - gapStart >= 2 && file[gapStart] == '<' && file[gapEnd - 1] == '>'
                && isHex(file, gapStart + 1, gapEnd - 1);
        if (a != 0 || c + d != file.length || !gapIsContents) {
            outcome.fail("Coverage", "The signature does not cover the whole document: "
                    + (c + d != file.length ? (file.length - (c + d)) + " bytes after the signed part are not covered"
                    + " (content was added after signing)" : "parts other than the signature value are left out") + ".");
        } else {
            outcome.pass("Coverage", "The signature covers the whole file except the signature value itself.");
        }
        byte[] signed = new byte[(int) (b + d)];
        System.arraycopy(file, (int) a, signed, 0, (int) b);
        System.arraycopy(file, (int) c, signed, (int) b, (int) d);
        return signed;
    }

    /** Verifies the CMS over the signed bytes; returns the signer's certificate when the signature verifies. */
    private X509Certificate cms(byte[] file, long[] range, byte[] signedBytes, Instant signingTime, Outcome outcome) {
        int gapStart = (int) (range[0] + range[1]);
        byte[] contents;
        try {
            contents = HexFormat.of().parseHex(new String(file, gapStart + 1, (int) range[2] - gapStart - 2,
                    StandardCharsets.US_ASCII).replaceAll("\\s", ""));
        } catch (IllegalArgumentException e) {
            outcome.fail("Signature value", "The signature value is not a hexadecimal string.");
            return null;
        }
        CMSSignedData cms;
        try (ASN1InputStream in = new ASN1InputStream(new ByteArrayInputStream(contents))) {
            // /Contents is zero-padded to its reserved size: only the first ASN.1 object is the CMS.
            ASN1Primitive first = in.readObject();
            if (first == null) {
                outcome.fail("Signature value", "The signature value is empty.");
                return null;
            }
            cms = new CMSSignedData(new CMSProcessableByteArray(signedBytes), ContentInfo.getInstance(first));
        } catch (IOException | CMSException | IllegalArgumentException | IllegalStateException e) {
            outcome.fail("Signature value", "The signature value is not a CMS signature.");
            return null;
        }
        Collection<SignerInformation> signers = cms.getSignerInfos().getSigners();
        if (signers.size() != 1) {
            outcome.fail("Signature value", "The CMS signature has " + signers.size() + " signers instead of one.");
            return null;
        }
        SignerInformation info = signers.iterator().next();
        @SuppressWarnings("unchecked")
        Collection<X509CertificateHolder> matches = cms.getCertificates().getMatches(info.getSID());
        if (matches.isEmpty()) {
            outcome.fail("Signature value", "The signature does not include the signer's certificate.");
            return null;
        }
        X509Certificate signer;
        List<X509Certificate> others = new ArrayList<>();
        try {
            signer = X509s.parseDer(matches.iterator().next().getEncoded());
            @SuppressWarnings("unchecked")
            Collection<X509CertificateHolder> all = cms.getCertificates().getMatches(null);
            for (X509CertificateHolder holder : all) {
                others.add(X509s.parseDer(holder.getEncoded()));
            }
        } catch (IOException | CertificateException e) {
            outcome.fail("Signature value", "The certificates in the signature cannot be read.");
            return null;
        }
        outcome.signerFromCertificate = X509s.commonName(X509s.subject(signer));
        if (!NISTObjectIdentifiers.id_sha256.getId().equals(info.getDigestAlgOID())) {
            outcome.fail("Digest", "The signature uses the digest " + info.getDigestAlgOID() + " instead of SHA-256.");
        }
        try {
            if (info.verify(new JcaSimpleSignerInfoVerifierBuilder().build(signer))) {
                outcome.pass("Integrity", "The signature is cryptographically valid: the document's SHA-256 digest"
                        + " matches the signed digest and the signature value verifies with " + outcome.signerFromCertificate
                        + "'s certificate.");
            } else {
                outcome.fail("Integrity", "The signature value does not verify with the signer's certificate.");
                return null;
            }
        } catch (CMSSignerDigestMismatchException e) {
            outcome.fail("Integrity", "The document was changed after it was signed: its digest does not match the"
                    + " signed digest.");
            return null;
        } catch (CMSException | OperatorCreationException | RuntimeException e) {
            outcome.fail("Integrity", "The signature value does not verify (" + e.getMessage() + ").");
            return null;
        }
        signingCertificateCheck(info, signer, outcome);
        if (!X509s.maySign(signer)) {
            outcome.fail("Certificate", "The signer's certificate does not allow signing.");
        }
        Instant at = signingTime != null ? signingTime : Instant.EPOCH;
        X509s.PathResult path = X509s.validatePath(signer, others, identities.trustAnchors(), at);
        if (path.trusted()) {
            outcome.pass("Issuer", "The signer's certificate was issued by a CA this lab trusts: "
                    + X509s.subject(path.anchor().get()) + ".");
        } else {
            outcome.fail("Issuer", "The signer's certificate was not issued by this lab's CA or a trusted imported"
                    + " CA: " + path.problem() + ".");
        }
        return signer;
    }

    private static void signingCertificateCheck(SignerInformation info, X509Certificate signer, Outcome outcome) {
        AttributeTable signed = info.getSignedAttributes();
        var attribute = signed == null ? null : signed.get(PKCSObjectIdentifiers.id_aa_signingCertificateV2);
        if (attribute == null) {
            outcome.fail("Signing certificate", "The signature lacks the signing-certificate-v2 attribute that PAdES"
                    + " requires.");
            return;
        }
        try {
            SigningCertificateV2 value = SigningCertificateV2.getInstance(attribute.getAttrValues().getObjectAt(0));
            ESSCertIDv2 first = value.getCerts()[0];
            boolean sha256 = first.getHashAlgorithm().getAlgorithm().equals(NISTObjectIdentifiers.id_sha256);
            if (sha256 && Arrays.equals(first.getCertHash(), X509s.sha256(X509s.encoded(signer)))) {
                outcome.pass("Signing certificate", "The signed signing-certificate-v2 attribute names the signer's"
                        + " certificate.");
            } else {
                outcome.fail("Signing certificate", "The signing-certificate-v2 attribute names another certificate.");
            }
        } catch (RuntimeException e) {
            outcome.fail("Signing certificate", "The signing-certificate-v2 attribute cannot be read.");
        }
    }

    private void revocationCheck(Outcome outcome, X509Certificate signer) {
        Optional<SigningIdentity> identity = identities.byFingerprint(X509s.fingerprint(signer));
        Instant signedAt = outcome.signedAt;
        if (identity.isPresent() && identity.get().revokedAt() != null && signedAt != null
                && !signedAt.isBefore(identity.get().revokedAt())) {
            outcome.fail("Signing rights", "The signature was made on " + signedAt + ", after the signer's signing"
                    + " rights were revoked on " + identity.get().revokedAt() + ".");
        } else if (identity.isPresent()) {
            outcome.pass("Signing rights", identity.get().revokedAt() == null
                    ? "The signer holds signing rights."
                    : "The signature was made before the signer's signing rights were revoked on "
                    + identity.get().revokedAt() + "; it stays valid.");
        }
    }

    /**
     * What the document says about itself: the number in its document information and, from the signature
     * dictionary (inside the signed byte range), the signing time, the signer's name and the meaning.
     */
    private record Claims(String number, Instant signedAt, String signerName, String meaning) {
        static final Claims NONE = new Claims(null, null, null, null);

        static Claims number(String number) {
            return new Claims(number, null, null, null);
        }
    }

    private void registerCheck(Outcome outcome, byte[] file, String sha256, Claims claims, X509Certificate signer) {
        outcome.claimedSignedAt = claims.signedAt();
        Optional<IssuedCertificate> bySha = register.findBySha256(sha256);
        if (bySha.isPresent()) {
            IssuedCertificate entry = bySha.get();
            outcome.number = entry.certificateNumber();
            outcome.signedAt = entry.signedAt();
            compare(outcome, entry, file, sha256, claims, signer);
            supersession(outcome, entry);
            return;
        }
        outcome.signedAt = claims.signedAt();
        String claimedNumber = claims.number();
        Optional<IssuedCertificate> byNumber = claimedNumber == null ? Optional.empty() : register.find(claimedNumber);
        outcome.number = claimedNumber;
        if (byNumber.isEmpty()) {
            outcome.fail("Register", claimedNumber == null
                    ? "No certificate in the register has this file's SHA-256 (" + sha256 + ")."
                    : "There is no certificate " + claimedNumber + " in the register.");
            return;
        }
        IssuedCertificate entry = byNumber.get();
        boolean storedCopyIsThisFile = register.pdf(entry.certificateNumber()).map(X509s::sha256Hex)
                .filter(sha256::equals).isPresent();
        if (storedCopyIsThisFile) {
            // The register keeps this very file but records another SHA-256 for it: the entry was altered.
            outcome.signedAt = entry.signedAt();
            compare(outcome, entry, file, sha256, claims, signer);
        } else {
            outcome.fail("Register", "This file is not the certificate registered as " + claimedNumber
                    + ": its SHA-256 (" + sha256 + ") differs from the register's (" + entry.pdfSha256() + ").");
        }
        supersession(outcome, entry);
    }

    /** Compares the register's entry for this file with what the file and its signature say, field by field. */
    private void compare(Outcome outcome, IssuedCertificate entry, byte[] file, String sha256, Claims claims,
                         X509Certificate signer) {
        List<VerificationResult.Disagreement> found = new ArrayList<>();
        disagree(found, "certificateNumber", "certificate number", claims.number(), entry.certificateNumber());
        disagree(found, "sha256", "SHA-256", sha256, entry.pdfSha256());
        String stored = register.pdf(entry.certificateNumber()).map(X509s::sha256Hex).orElse("none");
        if (!stored.equals(sha256)) {
            disagree(found, "storedCopy", "SHA-256 of the register's stored copy", sha256, stored);
        }
        disagree(found, "size", "size in bytes", String.valueOf(file.length), String.valueOf(entry.pdfSize()));
        if (signer != null) {
            disagree(found, "signerCertificate", "SHA-256 of the signer's certificate", X509s.fingerprint(signer),
                    entry.signerCertificateSha256());
        }
        // The signer's name as signed into the signature dictionary (what Dockgate writes there is the name the
        // register records); a signature without /Name is compared by its certificate's CN.
        String signedName = claims.signerName() != null ? claims.signerName() : outcome.signerFromCertificate;
        disagree(found, "signer", "signer", signedName, entry.signerName());
        disagree(found, "signedAt", "signing time", claims.signedAt() == null ? null : claims.signedAt().toString(),
                entry.signedAt() == null ? null : entry.signedAt().toString());
        disagree(found, "meaning", "meaning of the signature", claims.meaning(), entry.meaning());
        if (found.isEmpty()) {
            outcome.pass("Register", "The register holds this exact file as certificate " + entry.certificateNumber()
                    + ", signed by " + entry.signerName() + " on " + entry.signedAt() + " (SHA-256 " + sha256
                    + "), and agrees with the document on number, size, signer, signing certificate, time and meaning.");
            return;
        }
        for (VerificationResult.Disagreement d : found) {
            outcome.disagreements.add(d);
            outcome.fail("Register", "The register disagrees with the document about the " + d.label() + " of "
                    + entry.certificateNumber() + ": the document says " + quoted(d.document()) + ", the register says "
                    + quoted(d.register()) + ".");
        }
    }

    /** Records a disagreement when the document states a value and the register's differs. */
    private static void disagree(List<VerificationResult.Disagreement> found, String field, String label,
                                 String document, String register) {
        if (document != null && !document.equals(register)) {
            found.add(new VerificationResult.Disagreement(field, label, document, register));
        }
    }

    private static String quoted(String value) {
        return value == null ? "nothing" : "\"" + value + "\"";
    }

    private static String text(PdfDictionary dictionary, PdfName key) {
        PdfObject value = PdfReader.getPdfObject(dictionary.get(key));
        return value instanceof PdfString string ? string.toUnicodeString() : null;
    }

    private static void supersession(Outcome outcome, IssuedCertificate entry) {
        if (entry.superseded()) {
            outcome.superseded = true;
            outcome.supersededBy = entry.supersededBy();
            outcome.fail("Current", "Certificate " + entry.certificateNumber() + " was superseded by "
                    + entry.supersededBy() + " on " + entry.supersededAt() + ": " + entry.supersessionReason());
        } else {
            outcome.pass("Current", "Certificate " + entry.certificateNumber() + " is current (not superseded).");
        }
    }

    private static long[] byteRange(PdfDictionary dictionary) {
        PdfObject object = PdfReader.getPdfObject(dictionary.get(PdfName.BYTERANGE));
        if (!(object instanceof PdfArray array) || array.size() != 4) {
            return null;
        }
        long[] range = new long[4];
        for (int i = 0; i < 4; i++) {
            PdfObject item = PdfReader.getPdfObject(array.getPdfObject(i));
            if (!(item instanceof PdfNumber number)) {
                return null;
            }
            range[i] = (long) number.doubleValue();
            if (range[i] != number.doubleValue() || range[i] < 0 || range[i] > Integer.MAX_VALUE) {
                return null;
            }
        }
        return range;
    }

    private static Instant signingTime(PdfDictionary dictionary) {
        PdfObject m = PdfReader.getPdfObject(dictionary.get(PdfName.M));
        if (!(m instanceof PdfString text)) {
            return null;
        }
        try {
            Calendar calendar = PdfDate.decode(text.toString());
            return calendar == null ? null : calendar.toInstant();
        } catch (RuntimeException e) {
            return null;
        }
    }

    private static boolean looksLikePdf(byte[] file) {
        int window = Math.min(file.length, 1024);
        String head = new String(file, 0, window, StandardCharsets.ISO_8859_1);
        return head.contains("%PDF-");
    }

    private static boolean isHex(byte[] file, int from, int to) {
        for (int i = from; i < to; i++) {
            byte c = file[i];
            boolean hex = (c >= '0' && c <= '9') || (c >= 'a' && c <= 'f') || (c >= 'A' && c <= 'F');
            if (!hex) {
                return false;
            }
        }
        return true;
    }

    /** Collects checks while verifying. */
    private static final class Outcome {
        private final List<VerificationResult.Check> checks = new ArrayList<>();
        private String number;
        private final List<VerificationResult.Disagreement> disagreements = new ArrayList<>();
        private String signerFromCertificate;
        private Instant signedAt;
        private Instant claimedSignedAt;
        private boolean superseded;
        private String supersededBy;

        void pass(String name, String detail) {
            checks.add(new VerificationResult.Check(name, true, detail));
        }

        void fail(String name, String detail) {
            checks.add(new VerificationResult.Check(name, false, detail));
        }

        VerificationResult result() {
            List<String> reasons = checks.stream().filter(c -> !c.passed()).map(VerificationResult.Check::detail).toList();
            boolean valid = reasons.isEmpty() && checks.stream().anyMatch(c -> c.name().equals("Integrity") && c.passed())
                    && checks.stream().anyMatch(c -> c.name().equals("Register") && c.passed());
            // Signer and time as the signature states them, never as the register does.
            return new VerificationResult(valid, reasons, checks, disagreements, number, signerFromCertificate,
                    claimedSignedAt != null ? claimedSignedAt : signedAt, superseded, supersededBy);
        }
    }
}
