package org.dockgate.certificates;

import com.lowagie.text.pdf.BaseFont;
import java.nio.file.Files;
import java.nio.file.Path;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.stereotype.Component;

/**
 * The fonts of Dockgate's PDFs: Liberation Sans (metric-compatible with Helvetica/Arial; Debian
 * {@code fonts-liberation}), embedded as a subset with Unicode encoding so that names, units (Ω, µ, °)
 * and text extraction work. Falls back to the standard Helvetica (not embedded, Latin-1 only) when the
 * font files are missing.
 */
@Component
public class PdfFonts {

    private static final Logger log = LoggerFactory.getLogger(PdfFonts.class);

    private final BaseFont regular;
    private final BaseFont bold;

    PdfFonts(@Value("${dockgate.pdf.font-dir:/usr/share/fonts/truetype/liberation}") String fontDir) {
        Path folder = Path.of(fontDir);
        BaseFont r = load(folder.resolve("LiberationSans-Regular.ttf"));
        BaseFont b = load(folder.resolve("LiberationSans-Bold.ttf"));
        if (r == null || b == null) {
            log.warn("Liberation Sans not found in {}; PDFs use Helvetica (Latin-1 only)", folder);
            r = standard(BaseFont.HELVETICA);
            b = standard(BaseFont.HELVETICA_BOLD);
        }
        this.regular = r;
        this.bold = b;
    }

    public BaseFont regular() {
        return regular;
    }

    public BaseFont bold() {
        return bold;
    }

    private static BaseFont load(Path file) {
        if (!Files.isReadable(file)) {
            return null;
        }
        try {
            return BaseFont.createFont(file.toString(), BaseFont.IDENTITY_H, BaseFont.EMBEDDED);
        } catch (Exception e) {
            log.warn("Cannot load the font {}", file, e);
            return null;
        }
    }

    private static BaseFont standard(String name) {
        try {
            return BaseFont.createFont(name, BaseFont.WINANSI, BaseFont.NOT_EMBEDDED);
        } catch (Exception e) {
            throw new IllegalStateException("The standard font " + name + " is not available", e);
        }
    }
}
