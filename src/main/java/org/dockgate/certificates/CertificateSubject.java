package org.dockgate.certificates;

import java.util.LinkedHashSet;
import java.util.List;

/**
 * What a certificate is about, as the register searches it: the lot (its id in the receiving module and
 * its reference as printed), the supplier and the serial numbers of the units it covers. Plain values
 * for now; the lot module's types are not needed here.
 */
public record CertificateSubject(Long lotId, String lotReference, String supplier, List<String> serials) {

    public CertificateSubject {
        lotReference = blankToNull(lotReference);
        supplier = blankToNull(supplier);
        if (lotId == null && lotReference == null) {
            throw new IllegalArgumentException("A certificate names its lot (id or reference).");
        }
        if (lotReference != null && lotReference.length() > 200) {
            throw new IllegalArgumentException("A lot reference is at most 200 characters.");
        }
        if (supplier != null && supplier.length() > 200) {
            throw new IllegalArgumentException("A supplier name is at most 200 characters.");
        }
        LinkedHashSet<String> clean = new LinkedHashSet<>();
        for (String serial : serials == null ? List.<String>of() : serials) {
            String s = blankToNull(serial);
            if (s == null) {
                continue;
            }
            if (s.length() > 100) {
                throw new IllegalArgumentException("A serial number is at most 100 characters: " + s.substring(0, 20) + "…");
            }
            clean.add(s);
        }
        serials = List.copyOf(clean);
    }

    private static String blankToNull(String text) {
        return text == null || text.isBlank() ? null : text.strip();
    }
}
