package org.dockgate.receiving;

import java.util.ArrayList;
import java.util.List;

/** Serial numbers as typed, scanned (a barcode scanner types each one and Enter) or pasted: one per line. */
public final class SerialList {

    private SerialList() {
    }

    /**
     * Splits text into serials, one per line (CR, LF or CRLF), each trimmed. Blank lines at the end
     * (the scanner's last Enter) are dropped; a blank line between serials is kept as a blank entry so
     * the receiving check can name it. Null text gives an empty list.
     */
    public static List<String> parse(String text) {
        List<String> lines = new ArrayList<>();
        if (text == null) {
            return lines;
        }
        for (String line : text.split("\\r\\n|\\r|\\n", -1)) {
            lines.add(line.trim());
        }
        while (!lines.isEmpty() && lines.get(lines.size() - 1).isEmpty()) {
            lines.remove(lines.size() - 1);
        }
        while (!lines.isEmpty() && lines.get(0).isEmpty()) {
            lines.remove(0);
        }
        return lines;
    }
}
