package org.dockgate.certificates;

import com.lowagie.text.Chunk;
import com.lowagie.text.Document;
import com.lowagie.text.DocumentException;
import com.lowagie.text.Element;
import com.lowagie.text.Font;
import com.lowagie.text.Image;
import com.lowagie.text.PageSize;
import com.lowagie.text.Paragraph;
import com.lowagie.text.Phrase;
import com.lowagie.text.Rectangle;
import com.lowagie.text.pdf.BaseFont;
import com.lowagie.text.pdf.PdfAnnotation;
import com.lowagie.text.pdf.PdfContentByte;
import com.lowagie.text.pdf.PdfFormField;
import com.lowagie.text.pdf.PdfPCell;
import com.lowagie.text.pdf.PdfPTable;
import com.lowagie.text.pdf.PdfPageEventHelper;
import com.lowagie.text.pdf.PdfTemplate;
import com.lowagie.text.pdf.PdfWriter;
import java.awt.Color;
import java.io.ByteArrayOutputStream;
import java.util.Map;

/**
 * One certificate PDF being written (from {@link CertificatePdfWriter#open}). The header, the footer
 * with "Page x of y", the title block and the closing block (safety caution, verification QR code,
 * signature field) are Dockgate's; the sections between them are the caller's, added through the
 * helpers here or directly to {@link #document()}.
 *
 * <p>Not thread-safe; use once: add content, then {@link #finish()}.
 */
public final class CertificateDocument {

    static final float MARGIN_SIDE = 50;
    static final float MARGIN_TOP = 92;
    static final float MARGIN_BOTTOM = 62;
    private static final Color RULE = new Color(0x55, 0x5f, 0x6b);

    private final CertificatePdfWriter owner;
    private final CertificateHeading heading;
    private final String title;
    private final ByteArrayOutputStream out = new ByteArrayOutputStream();
    private final Document document;
    private final PdfWriter writer;
    private boolean signatureFieldPlaced;
    private boolean finished;

    CertificateDocument(CertificatePdfWriter owner, CertificateHeading heading, String title) {
        this.owner = owner;
        this.heading = heading;
        this.title = title;
        this.document = new Document(PageSize.A4, MARGIN_SIDE, MARGIN_SIDE, MARGIN_TOP, MARGIN_BOTTOM);
        try {
            this.writer = PdfWriter.getInstance(document, out);
        } catch (DocumentException e) {
            throw new IllegalStateException("Cannot start a PDF document", e);
        }
        writer.setPageEvent(new PageDecoration());
        document.addTitle(title + " " + heading.certificateNumber());
        document.addSubject(title + ", certificate " + heading.certificateNumber() + " revision " + heading.revision());
        document.addAuthor(owner.labName());
        document.addCreator("Dockgate");
        document.addKeywords(heading.certificateNumber());
        document.addHeader(CertificatePdfWriter.INFO_CERTIFICATE_NUMBER, heading.certificateNumber());
        document.addHeader(CertificatePdfWriter.INFO_REVISION, String.valueOf(heading.revision()));
        document.open();
        titleBlock();
    }

    /** The OpenPDF document, for content sections (tables, charts via {@code PdfGraphics2D}, images). */
    public Document document() {
        return document;
    }

    public PdfWriter writer() {
        return writer;
    }

    public CertificateHeading heading() {
        return heading;
    }

    /** The body font (Liberation Sans, embedded) at a size in points. */
    public Font font(float sizePt) {
        return new Font(owner.fonts().regular(), sizePt);
    }

    public Font boldFont(float sizePt) {
        return new Font(owner.fonts().bold(), sizePt);
    }

    /** A section heading. */
    public void section(String text) {
        Paragraph p = new Paragraph(text, boldFont(11.5f));
        p.setSpacingBefore(12);
        p.setSpacingAfter(4);
        add(p);
    }

    /** A paragraph of body text. */
    public void paragraph(String text) {
        Paragraph p = new Paragraph(text, font(9.5f));
        p.setSpacingAfter(4);
        add(p);
    }

    /** A two-column table of labelled values, in the map's order. */
    public void facts(Map<String, String> rows) {
        PdfPTable table = new PdfPTable(new float[] {1.4f, 3f});
        table.setWidthPercentage(100);
        table.setSpacingAfter(6);
        for (Map.Entry<String, String> row : rows.entrySet()) {
            table.addCell(cell(new Phrase(row.getKey(), boldFont(9)), false));
            table.addCell(cell(new Phrase(row.getValue() == null ? "—" : row.getValue(), font(9)), false));
        }
        add(table);
    }

    /** Adds any element (the caller's own tables, images, chart templates). */
    public void add(Element element) {
        if (finished) {
            throw new IllegalStateException("The certificate document is already finished.");
        }
        try {
            document.add(element);
        } catch (DocumentException e) {
            throw new IllegalStateException("Cannot add to the certificate document", e);
        }
    }

    /**
     * Ends the document with the closing block (safety caution, verification QR code and URL, the blank
     * signature field {@value CertificatePdfWriter#SIGNATURE_FIELD}) and returns the unsigned PDF.
     */
    public byte[] finish() {
        if (finished) {
            throw new IllegalStateException("The certificate document is already finished.");
        }
        Paragraph caution = new Paragraph(CertificatePdfWriter.SAFETY_CAUTION, boldFont(9));
        caution.setSpacingBefore(14);
        caution.setSpacingAfter(8);
        add(caution);

        String url = owner.verificationUrl(heading.certificateNumber());
        PdfPTable closing = new PdfPTable(new float[] {1.25f, 2.75f});
        closing.setWidthPercentage(100);
        closing.setKeepTogether(true);
        try {
            Image qr = Image.getInstance(QrCodes.template(writer.getDirectContent(), url, 86));
            PdfPCell qrCell = new PdfPCell();
            qrCell.setBorder(Rectangle.NO_BORDER);
            qrCell.addElement(qr);
            Paragraph verify = new Paragraph("Verify this certificate: ", font(7.5f));
            verify.add(new Chunk(url, font(7.5f)));
            qrCell.addElement(verify);
            closing.addCell(qrCell);
        } catch (DocumentException e) {
            throw new IllegalStateException("Cannot draw the verification QR code", e);
        }
        PdfPCell signature = new PdfPCell(new Phrase(" ", font(8)));
        signature.setFixedHeight(104);
        signature.setBorderColor(RULE);
        signature.setBorderWidth(0.6f);
        signature.setCellEvent((cell, position, canvases) -> placeSignatureField(position));
        closing.addCell(signature);
        add(closing);
        finished = true;
        document.close();
        if (!signatureFieldPlaced) {
            throw new IllegalStateException("The signature field could not be placed.");
        }
        return out.toByteArray();
    }

    private void placeSignatureField(Rectangle position) {
        if (signatureFieldPlaced) {
            return;
        }
        PdfFormField field = PdfFormField.createSignature(writer);
        field.setFieldName(CertificatePdfWriter.SIGNATURE_FIELD);
        field.setWidget(new Rectangle(position.getLeft() + 1.5f, position.getBottom() + 1.5f,
                position.getRight() - 1.5f, position.getTop() - 1.5f), null);
        field.setFlags(PdfAnnotation.FLAGS_PRINT);
        writer.addAnnotation(field);
        signatureFieldPlaced = true;
    }

    private void titleBlock() {
        Paragraph t = new Paragraph(title, boldFont(17));
        t.setSpacingAfter(2);
        add(t);
        Paragraph number = new Paragraph("Certificate No. " + heading.certificateNumber() + ", revision "
                + heading.revision(), boldFont(11));
        number.setSpacingAfter(heading.reissue() ? 2 : 8);
        add(number);
        if (heading.reissue()) {
            Paragraph replaces = new Paragraph("This certificate replaces certificate " + heading.replacesNumber()
                    + ", which is superseded. Reason for reissue: " + heading.reissueReason(), font(9.5f));
            replaces.setSpacingAfter(8);
            add(replaces);
        }
    }

    private static PdfPCell cell(Phrase phrase, boolean border) {
        PdfPCell cell = new PdfPCell(phrase);
        cell.setBorder(border ? Rectangle.BOX : Rectangle.BOTTOM);
        cell.setBorderColor(new Color(0xd0, 0xd4, 0xd9));
        cell.setPaddingTop(3);
        cell.setPaddingBottom(4);
        return cell;
    }

    /** Header and footer on every page; "of y" is a template filled in when the document closes. */
    private final class PageDecoration extends PdfPageEventHelper {

        private PdfTemplate total;

        @Override
        public void onOpenDocument(PdfWriter w, Document d) {
            total = w.getDirectContent().createTemplate(40, 12);
        }

        @Override
        public void onEndPage(PdfWriter w, Document d) {
            PdfContentByte canvas = w.getDirectContent();
            Rectangle page = d.getPageSize();
            float left = page.getLeft() + MARGIN_SIDE;
            float right = page.getRight() - MARGIN_SIDE;
            float top = page.getTop() - 36;
            BaseFont regular = owner.fonts().regular();
            BaseFont bold = owner.fonts().bold();

            canvas.beginText();
            canvas.setFontAndSize(bold, 10);
            canvas.showTextAligned(Element.ALIGN_LEFT, owner.labName(), left, top, 0);
            canvas.setFontAndSize(regular, 8);
            canvas.showTextAligned(Element.ALIGN_LEFT, owner.labAddress(), left, top - 12, 0);
            canvas.setFontAndSize(bold, 9);
            canvas.showTextAligned(Element.ALIGN_RIGHT, "Certificate " + heading.certificateNumber(), right, top, 0);
            canvas.setFontAndSize(regular, 8);
            canvas.showTextAligned(Element.ALIGN_RIGHT, "Revision " + heading.revision(), right, top - 12, 0);
            canvas.endText();
            canvas.setColorStroke(RULE);
            canvas.setLineWidth(0.6f);
            canvas.moveTo(left, top - 20);
            canvas.lineTo(right, top - 20);
            canvas.stroke();

            float bottom = page.getBottom() + 34;
            canvas.moveTo(left, bottom + 12);
            canvas.lineTo(right, bottom + 12);
            canvas.stroke();
            // Lab and number at the left, "Page x of y" at the right and last in the content stream, so that
            // text extraction reads "Page x of y" in one piece (the total is a template filled in at the end;
            // its width is taken as that of x).
            String pageText = "Page " + w.getPageNumber() + " of ";
            float pageWidth = regular.getWidthPoint(pageText + w.getPageNumber(), 8);
            canvas.beginText();
            canvas.setFontAndSize(regular, 8);
            canvas.showTextAligned(Element.ALIGN_LEFT, owner.labName() + " · Certificate " + heading.certificateNumber()
                    + ", revision " + heading.revision(), left, bottom, 0);
            canvas.showTextAligned(Element.ALIGN_LEFT, pageText, right - pageWidth, bottom, 0);
            canvas.endText();
            canvas.addTemplate(total, right - pageWidth + regular.getWidthPoint(pageText, 8), bottom);
        }

        @Override
        public void onCloseDocument(PdfWriter w, Document d) {
            total.beginText();
            total.setFontAndSize(owner.fonts().regular(), 8);
            total.showTextAligned(Element.ALIGN_LEFT, String.valueOf(w.getPageNumber() - 1), 0, 0, 0);
            total.endText();
        }
    }
}
