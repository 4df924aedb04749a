package org.dockgate.certificates;

import com.google.zxing.BarcodeFormat;
import com.google.zxing.EncodeHintType;
import com.google.zxing.WriterException;
import com.google.zxing.common.BitMatrix;
import com.google.zxing.qrcode.QRCodeWriter;
import com.google.zxing.qrcode.decoder.ErrorCorrectionLevel;
import com.lowagie.text.pdf.PdfContentByte;
import com.lowagie.text.pdf.PdfTemplate;
import java.util.Map;

/** QR codes drawn as vector squares into a PDF (ZXing computes the modules). */
final class QrCodes {

    /** ISO/IEC 18004 asks for a quiet zone of 4 modules around the symbol. */
    static final int QUIET_ZONE_MODULES = 4;

    private QrCodes() {
    }

    static BitMatrix matrix(String text) {
        try {
            // Error correction M (about 15 % of the symbol recoverable): a printed page may be creased.
            return new QRCodeWriter().encode(text, BarcodeFormat.QR_CODE, 0, 0,
                    Map.of(EncodeHintType.MARGIN, 0, EncodeHintType.ERROR_CORRECTION, ErrorCorrectionLevel.M,
                            EncodeHintType.CHARACTER_SET, "UTF-8"));
        } catch (WriterException e) {
            throw new IllegalArgumentException("The text cannot be encoded as a QR code: " + e.getMessage());
        }
    }

    /** A square template of the given side (points) holding the symbol and its quiet zone. */
    static PdfTemplate template(PdfContentByte canvas, String text, float sidePt) {
        BitMatrix matrix = matrix(text);
        int modules = matrix.getWidth() + 2 * QUIET_ZONE_MODULES;
        float module = sidePt / modules;
        PdfTemplate template = canvas.createTemplate(sidePt, sidePt);
        template.setRGBColorFill(0, 0, 0);
        for (int y = 0; y < matrix.getHeight(); y++) {
            int x = 0;
            while (x < matrix.getWidth()) {
                if (!matrix.get(x, y)) {
                    x++;
                    continue;
                }
                int start = x;
                while (x < matrix.getWidth() && matrix.get(x, y)) {
                    x++;
                }
                // One rectangle per horizontal run of dark modules; PDF y grows upwards.
                template.rectangle((start + QUIET_ZONE_MODULES) * module,
                        sidePt - (y + 1 + QUIET_ZONE_MODULES) * module, (x - start) * module, module);
            }
        }
        template.fill();
        return template;
    }
}
