package org.dockgate.certificates;

/**
 * Where the visible signature block goes, in PDF points from the page's lower-left corner. Documents
 * from {@link CertificatePdfWriter} carry a blank signature field and need no placement.
 *
 * @param page 1-based page number; 0 means the last page
 */
public record SignaturePlacement(int page, float llx, float lly, float urx, float ury) {

    public SignaturePlacement {
        if (page < 0) {
            throw new IllegalArgumentException("A page number is 1 or more (0 for the last page).");
        }
        if (!(urx - llx >= 120) || !(ury - lly >= 50)) {
            throw new IllegalArgumentException("A signature block needs at least 120 × 50 points.");
        }
    }

    /** Lower right of the last page, above the footer, 260 × 100 points. */
    public static SignaturePlacement lastPageBottomRight() {
        return new SignaturePlacement(0, 285, 72, 545, 172);
    }
}
