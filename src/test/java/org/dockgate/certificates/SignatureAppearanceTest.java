package org.dockgate.certificates;

import static org.assertj.core.api.Assertions.assertThat;

import com.google.zxing.BinaryBitmap;
import com.google.zxing.DecodeHintType;
import com.google.zxing.RGBLuminanceSource;
import com.google.zxing.common.HybridBinarizer;
import com.google.zxing.qrcode.QRCodeReader;
import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import javax.imageio.ImageIO;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.common.PDRectangle;
import org.apache.pdfbox.pdmodel.interactive.annotation.PDAnnotationWidget;
import org.dockgate.accounts.AccountService;
import org.dockgate.platform.Role;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;

/**
 * What a reader sees, rendered by poppler (pdftoppm, a renderer that is none of Dockgate's or PDFBox's
 * code): the visible signature block holds dark pixels where the signer's name is (issue 12 item 6), and the
 * QR code decodes (ZXing's reader) to the configured public base URL (item 5).
 */
@SpringBootTest
class SignatureAppearanceTest {

    static final int DPI = 144;

    @Autowired AccountService accounts;
    @Autowired SigningIdentityService identities;
    @Autowired SigningService signing;
    @Autowired CertificatePdfWriter writer;
    @Autowired PdfFonts fonts;

    @Test
    void theSignatureBoxShowsTheSignersNameWhenPopplerRendersThePage() throws Exception {
        String signer = SigningFixtures.newSigner(accounts, identities, Role.ENGINEER);
        byte[] pdf = signing.sign(SigningFixtures.render(writer, CertificateHeading.first("TEST-APPEAR-1"), 0), signer,
                "approved for release").pdf();
        Widget box = signatureWidget(pdf);
        BufferedImage page = render(pdf, box.page());
        double scale = DPI / 72.0;
        // The name is the second line (bold 10.5 pt) below "Digitally signed by" (7.5 pt): the band from about
        // 8 pt to 24 pt below the box's top, inside its 6 pt padding.
        int left = (int) Math.round((box.rect().getLowerLeftX() + 7) * scale);
        int right = (int) Math.round((box.rect().getUpperRightX() - 7) * scale);
        int top = (int) Math.round((box.pageHeight() - box.rect().getUpperRightY() + 8) * scale);
        int bottom = (int) Math.round((box.pageHeight() - box.rect().getUpperRightY() + 26) * scale);
        int dark = darkPixels(page, left, top, right, bottom);
        assertThat(dark).as("dark pixels of the signer's name in the rendered signature box").isGreaterThan(60);
        // The box itself is drawn: its light fill (#f4f7fa) is not the page's white.
        int fill = page.getRGB(left + 2, (int) Math.round((box.pageHeight() - box.rect().getLowerLeftY() - 3) * scale));
        assertThat(fill & 0xffffff).as("the box's fill near its bottom edge").isNotEqualTo(0xffffff);
    }

    @Test
    void aConfiguredPublicBaseUrlReachesTheQrCodeAndThePrintedLink() throws Exception {
        CertificatePdfWriter configured = new CertificatePdfWriter(fonts, "Northbank Sensor Receiving Laboratory",
                "Unit 4, Quayside Works, Harbour Road, Northbank", "https://inspection.northbank.example/dockgate/", "UTC",
                "Goods-in");
        assertThat(configured.pointsToLocalhost()).isFalse();
        assertThat(writer.pointsToLocalhost()).as("application.properties keeps the localhost default").isTrue();
        byte[] pdf = SigningFixtures.render(configured, CertificateHeading.first("TEST-QR-1"), 0);
        String url = "https://inspection.northbank.example/dockgate/verify/TEST-QR-1";
        // Text extraction may wrap the long link, so it is compared without white space.
        assertThat(LotCertificateTest.compact(IndependentSignatureCheck.text(pdf)))
                .contains(LotCertificateTest.compact("Verify this certificate: " + url));
        BufferedImage page = render(pdf, 1);
        int[] pixels = page.getRGB(0, 0, page.getWidth(), page.getHeight(), null, 0, page.getWidth());
        var bitmap = new BinaryBitmap(new HybridBinarizer(new RGBLuminanceSource(page.getWidth(), page.getHeight(), pixels)));
        String decoded = new QRCodeReader().decode(bitmap, Map.of(DecodeHintType.TRY_HARDER, Boolean.TRUE)).getText();
        assertThat(decoded).isEqualTo(url);
    }

    record Widget(int page, PDRectangle rect, float pageHeight) {
    }

    static Widget signatureWidget(byte[] pdf) throws Exception {
        try (PDDocument document = Loader.loadPDF(pdf)) {
            var field = document.getDocumentCatalog().getAcroForm().getField(CertificatePdfWriter.SIGNATURE_FIELD);
            PDAnnotationWidget widget = field.getWidgets().get(0);
            int index = document.getPages().indexOf(widget.getPage());
            if (index < 0) {
                for (int i = 0; i < document.getNumberOfPages(); i++) {
                    if (document.getPage(i).getAnnotations().stream().anyMatch(a -> a.getCOSObject() == widget.getCOSObject())) {
                        index = i;
                    }
                }
            }
            assertThat(index).as("the page of the signature widget").isNotNegative();
            return new Widget(index + 1, widget.getRectangle(), document.getPage(index).getMediaBox().getHeight());
        }
    }

    /** One page rendered by poppler's pdftoppm at {@value #DPI} dpi; skipped only where poppler is absent. */
    static BufferedImage render(byte[] pdf, int page) throws Exception {
        Path tool = Path.of("/usr/bin/pdftoppm");
        if (!Files.isExecutable(tool)) {
            if ("true".equals(System.getenv("CI"))) {
                throw new AssertionError("pdftoppm (poppler-utils) is missing, and CI=true requires it");
            }
            Assumptions.abort("pdftoppm (Debian poppler-utils) is not installed; skipping the rendering check");
        }
        Path dir = Files.createTempDirectory("dockgate-render");
        Path file = dir.resolve("in.pdf");
        try {
            Files.write(file, pdf);
            Process process = new ProcessBuilder(tool.toString(), "-r", String.valueOf(DPI), "-f", String.valueOf(page),
                    "-l", String.valueOf(page), "-png", "-singlefile", file.toString(), dir.resolve("page").toString())
                    .redirectErrorStream(true).start();
            String output = new String(process.getInputStream().readAllBytes());
            if (!process.waitFor(60, TimeUnit.SECONDS)) {
                process.destroyForcibly();
                throw new AssertionError("pdftoppm did not finish");
            }
            assertThat(process.exitValue()).as("pdftoppm: " + output).isZero();
            return ImageIO.read(dir.resolve("page.png").toFile());
        } finally {
            try (var files = Files.list(dir)) {
                files.forEach(f -> f.toFile().delete());
            }
            Files.deleteIfExists(dir);
        }
    }

    static int darkPixels(BufferedImage image, int x0, int y0, int x1, int y1) {
        int dark = 0;
        for (int y = Math.max(0, y0); y < Math.min(image.getHeight(), y1); y++) {
            for (int x = Math.max(0, x0); x < Math.min(image.getWidth(), x1); x++) {
                int rgb = image.getRGB(x, y);
                int luminance = (299 * ((rgb >> 16) & 0xff) + 587 * ((rgb >> 8) & 0xff) + 114 * (rgb & 0xff)) / 1000;
                if (luminance < 110) {
                    dark++;
                }
            }
        }
        return dark;
    }
}
