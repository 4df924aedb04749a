package org.dockgate.certificates;

import com.lowagie.text.Element;
import com.lowagie.text.Font;
import com.lowagie.text.Phrase;
import com.lowagie.text.Rectangle;
import com.lowagie.text.pdf.ColumnText;
import com.lowagie.text.pdf.PdfDate;
import com.lowagie.text.pdf.PdfDictionary;
import com.lowagie.text.pdf.PdfName;
import com.lowagie.text.pdf.PdfReader;
import com.lowagie.text.pdf.PdfSignature;
import com.lowagie.text.pdf.PdfSignatureAppearance;
import com.lowagie.text.pdf.PdfStamper;
import com.lowagie.text.pdf.PdfString;
import com.lowagie.text.pdf.PdfTemplate;
import java.awt.Color;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.time.Clock;
import java.time.Instant;
import java.time.ZonedDateTime;
import java.time.format.DateTimeFormatter;
import java.time.temporal.ChronoUnit;
import java.util.Arrays;
import java.util.Calendar;
import java.util.GregorianCalendar;
import java.util.List;
import java.util.Map;
import org.dockgate.audit.AuditEvent;
import org.dockgate.audit.AuditEvent.FieldChange;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.context.ApplicationEventPublisher;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * Signs PDFs for a person with their signing identity: a PAdES baseline B-B signature (ETSI EN 319
 * 142-1) and a visible signature block with the printed name, the date and time with its time zone, and
 * the meaning of the signature.
 *
 * <p>How (OpenPDF 2.0.5's own signing modes only give SHA-1): the signature field gets a signature
 * dictionary with filter {@code Adobe.PPKLite} and sub-filter {@code ETSI.CAdES.detached}; {@code preClose}
 * writes the whole file with {@value #RESERVED_CONTENTS_BYTES} bytes reserved for /Contents; the bytes
 * outside that hole (the /ByteRange, ISO 32000-1 12.8.1) are signed as a detached CMS built with
 * BouncyCastle ({@link CmsSignatures}), which is zero-padded into the hole. The signature therefore covers
 * the whole file except the signature value itself.
 *
 * <p>Re-authentication and separation of duties belong to the caller (the lot approval), which knows
 * the lot; this service checks that the signer's identity is active, the key present and matching, the
 * certificate valid now and the account enabled.
 */
@Service
public class SigningService {

    /** Room for the CMS: one EC chain of three certificates is about 2 KB; 16 KB leave room for RSA-4096 chains. */
    static final int RESERVED_CONTENTS_BYTES = 16384;
    static final String SUB_FILTER = "ETSI.CAdES.detached";
    private static final DateTimeFormatter PRINTED = DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm:ss zzz '(UTC'xxx')'");

    private final SigningIdentityService identities;
    private final CertificatePdfWriter pdfs;
    private final ApplicationEventPublisher events;
    private final Clock clock;
    private final String labName;

    SigningService(SigningIdentityService identities, CertificatePdfWriter pdfs, ApplicationEventPublisher events,
                   Clock clock, @Value("${dockgate.lab.name:Dockgate laboratory}") String labName) {
        this.identities = identities;
        this.pdfs = pdfs;
        this.events = events;
        this.clock = clock;
        this.labName = labName;
    }

    /**
     * Signs into the document's blank signature field (as {@link CertificatePdfWriter} makes), or at the
     * lower right of the last page when it has none.
     *
     * @param meaning what the signature means, printed in the block and stored as the signature's
     *                /Reason, e.g. "approved for release"
     */
    @Transactional
    public SignedDocument sign(byte[] pdf, String signerUsername, String meaning) {
        return sign(pdf, signerUsername, meaning, null);
    }

    /**
     * Signs a PDF as {@code signerUsername}. Refused: an empty, unreadable, encrypted or already signed
     * PDF; a blank meaning; a signer without an active signing identity (never granted or revoked), with
     * a disabled account, a missing key or a certificate not valid now.
     *
     * @param placement where the visible block goes when the document has no blank signature field; null
     *                  for {@link SignaturePlacement#lastPageBottomRight()}
     */
    @Transactional
    public SignedDocument sign(byte[] pdf, String signerUsername, String meaning, SignaturePlacement placement) {
        if (pdf == null || pdf.length == 0) {
            throw new IllegalArgumentException("There is no PDF to sign.");
        }
        String why = meaning == null ? "" : meaning.strip();
        if (why.isEmpty()) {
            throw new IllegalArgumentException("A signature needs its meaning, e.g. \"approved for release\".");
        }
        if (why.length() > 200) {
            throw new IllegalArgumentException("The meaning of a signature is at most 200 characters.");
        }
        SigningIdentityService.SignerKey signer = identities.signerKey(signerUsername);
        Instant signedAt = clock.instant().truncatedTo(ChronoUnit.SECONDS);
        byte[] signed = stamp(pdf, signer, why, signedAt, placement);
        String sha256 = X509s.sha256Hex(signed);
        SigningIdentity identity = signer.identity();
        events.publishEvent(AuditEvent.of("SIGNING_IDENTITY", identity.id(), "SIGN",
                        identity.username() + " signed a document (" + why + "), SHA-256 " + sha256)
                .withChanges(List.of(FieldChange.of("documentSha256", null, sha256),
                        FieldChange.of("meaning", null, why), FieldChange.of("signedAt", null, signedAt))));
        return new SignedDocument(signed, sha256, identity.username(), identity.displayName(), why, signedAt,
                identity.id(), identity.serialHex(), identity.fingerprintSha256());
    }

    private byte[] stamp(byte[] pdf, SigningIdentityService.SignerKey signer, String meaning, Instant signedAt,
                         SignaturePlacement placement) {
        PdfReader reader;
        try {
            reader = new PdfReader(pdf);
        } catch (IOException | RuntimeException e) {
            throw new IllegalArgumentException("The document is not a readable PDF.");
        }
        try {
            if (reader.isEncrypted()) {
                throw new IllegalArgumentException("An encrypted PDF cannot be signed here.");
            }
            if (!reader.getAcroFields().getSignedFieldNames().isEmpty()) {
                throw new IllegalArgumentException("The PDF is already signed; a signed document never changes.");
            }
            ByteArrayOutputStream out = new ByteArrayOutputStream(pdf.length + 2 * RESERVED_CONTENTS_BYTES + 8192);
            PdfStamper stamper = PdfStamper.createSignature(reader, out, '\0');
            PdfSignatureAppearance appearance = stamper.getSignatureAppearance();
            List<String> blank = reader.getAcroFields().getFieldNamesWithBlankSignatures();
            if (blank.contains(CertificatePdfWriter.SIGNATURE_FIELD)) {
                appearance.setVisibleSignature(CertificatePdfWriter.SIGNATURE_FIELD);
            } else if (!blank.isEmpty()) {
                appearance.setVisibleSignature(blank.get(0));
            } else {
                SignaturePlacement where = placement == null ? SignaturePlacement.lastPageBottomRight() : placement;
                int page = where.page() == 0 ? reader.getNumberOfPages() : where.page();
                if (page > reader.getNumberOfPages()) {
                    throw new IllegalArgumentException("The PDF has no page " + page + ".");
                }
                appearance.setVisibleSignature(new Rectangle(where.llx(), where.lly(), where.urx(), where.ury()), page,
                        CertificatePdfWriter.SIGNATURE_FIELD);
            }
            ZonedDateTime local = signedAt.atZone(pdfs.labZone());
            Calendar calendar = GregorianCalendar.from(local);
            appearance.setSignDate(calendar);
            appearance.setReason(meaning);
            appearance.setLocation(labName);
            // Acrobat-6 layers: only n0 and n2, so no "signature not verified" mark (layer n4) is drawn.
            appearance.setAcro6Layers(true);
            String printed = "Digitally signed by " + signer.identity().displayName() + "\n"
                    + "Meaning: " + meaning + "\n"
                    + "Date: " + PRINTED.format(local) + "\n"
                    + "Certificate " + signer.identity().serialHex() + ", issued by "
                    + X509s.commonName(signer.identity().issuer());
            appearance.setLayer2Text(printed);
            drawBlock(appearance, signer.identity().displayName(), meaning, PRINTED.format(local),
                    signer.identity().serialHex(), X509s.commonName(signer.identity().issuer()));

            PdfSignature dictionary = new PdfSignature(PdfName.ADOBE_PPKLITE, new PdfName(SUB_FILTER));
            dictionary.setDate(new PdfDate(calendar));
            dictionary.setName(signer.identity().displayName());
            dictionary.setReason(meaning);
            dictionary.setLocation(labName);
            appearance.setCryptoDictionary(dictionary);
            appearance.preClose(Map.of(PdfName.CONTENTS, RESERVED_CONTENTS_BYTES * 2 + 2));

            byte[] rangeBytes;
            try (InputStream range = appearance.getRangeStream()) {
                rangeBytes = range.readAllBytes();
            }
            byte[] cms = CmsSignatures.detached(rangeBytes, signer.key(), signer.chain());
            if (cms.length > RESERVED_CONTENTS_BYTES) {
                throw new IllegalStateException("The signature (" + cms.length + " bytes) does not fit the "
                        + RESERVED_CONTENTS_BYTES + " bytes reserved for it.");
            }
            PdfDictionary update = new PdfDictionary();
            update.put(PdfName.CONTENTS, new PdfString(Arrays.copyOf(cms, RESERVED_CONTENTS_BYTES)).setHexWriting(true));
            appearance.close(update);
            return out.toByteArray();
        } catch (IOException | com.lowagie.text.DocumentException e) {
            throw new IllegalStateException("The PDF could not be signed: " + e.getMessage(), e);
        } finally {
            reader.close();
        }
    }

    /** The visible block (layer n2), drawn here rather than left to OpenPDF so the layout is ours. */
    private void drawBlock(PdfSignatureAppearance appearance, String name, String meaning, String when,
                           String serial, String issuer) {
        PdfTemplate layer = appearance.getLayer(2);
        Rectangle box = appearance.getRect();
        float pad = 6;
        layer.setColorFill(new Color(0xf4, 0xf7, 0xfa));
        layer.rectangle(0, 0, box.getWidth(), box.getHeight());
        layer.fill();
        layer.setColorStroke(new Color(0x1f, 0x4e, 0x79));
        layer.setLineWidth(0.8f);
        layer.rectangle(0.5f, 0.5f, box.getWidth() - 1, box.getHeight() - 1);
        layer.stroke();
        // Every font carries its colour: without one, ColumnText draws in the current fill colour, which is
        // the box's light fill, and the text is extractable but invisible (issue 12: blank in poppler viewers).
        Color ink = new Color(0x1a, 0x1a, 0x1a);
        layer.setColorFill(ink);
        Font small = new Font(pdfs.fonts().regular(), 7.5f, Font.NORMAL, ink);
        Font label = new Font(pdfs.fonts().bold(), 7.5f, Font.NORMAL, ink);
        Font big = new Font(pdfs.fonts().bold(), 10.5f, Font.NORMAL, new Color(0x1f, 0x4e, 0x79));
        ColumnText column = new ColumnText(layer);
        column.setSimpleColumn(pad, pad, box.getWidth() - pad, box.getHeight() - pad);
        column.addText(new Phrase("Digitally signed by\n", small));
        column.addText(new Phrase(name + "\n", big));
        column.addText(new Phrase("Meaning: ", label));
        column.addText(new Phrase(meaning + "\n", small));
        column.addText(new Phrase("Date: ", label));
        column.addText(new Phrase(when + "\n", small));
        column.addText(new Phrase("Certificate " + serial + ", issued by " + issuer, small));
        column.setLeading(0, 1.2f);
        column.setAlignment(Element.ALIGN_LEFT);
        try {
            column.go();
        } catch (com.lowagie.text.DocumentException e) {
            throw new IllegalStateException("Cannot draw the signature block", e);
        }
    }
}
