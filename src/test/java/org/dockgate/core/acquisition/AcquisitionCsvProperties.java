package org.dockgate.core.acquisition;

import static org.assertj.core.api.Assertions.assertThat;
import static org.dockgate.core.PropertyCheck.forAll;

import java.io.StringReader;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/** What a writer puts in a data-acquisition file comes back out unchanged. */
class AcquisitionCsvProperties {

    static List<AcquiredReading> parse(String row, AcquisitionReport[] report) {
        List<AcquiredReading> readings = new ArrayList<>();
        report[0] = AcquisitionCsv.parse(new StringReader(AcquisitionCsv.HEADER + "\n" + row + "\n"),
                ExpectedUnits.of("bar", "mV"), readings::add, ProgressListener.NONE);
        return readings;
    }

    /** Java's shortest round-trip decimal form (Double.toString, e.g. 1.0E-5) parses back to the same double. */
    @Test
    void anyFiniteValueWrittenByJavaRoundTrips() {
        forAll(2000, g -> {
            double value = g.anyDouble();
            if (!Double.isFinite(value)) {
                return;
            }
            AcquisitionReport[] report = new AcquisitionReport[1];
            List<AcquiredReading> readings = parse("SN-1,STATIC,2,UP,1," + value + ",mV", report);
            assertThat(report[0].messages()).isEmpty();
            assertThat(readings.get(0).value()).isEqualTo(value);
        });
    }

    /** A serial with commas, quotes or line breaks survives RFC 4180 quoting (quotes doubled). */
    @Test
    void aQuotedSerialRoundTrips() {
        forAll(500, g -> {
            String serial = g.strings(1, 40);
            String stripped = serial.strip();
            if (stripped.isEmpty() || stripped.indexOf('\uFEFF') >= 0 || !stripped.equals(serial)) {
                return; // serials are trimmed, and a blank one is an error of its own
            }
            AcquisitionReport[] report = new AcquisitionReport[1];
            List<AcquiredReading> readings = parse("\"" + serial.replace("\"", "\"\"") + "\",STATIC,2,UP,1,1.5,mV",
                    report);
            assertThat(report[0].messages()).isEmpty();
            assertThat(readings.get(0).serial()).isEqualTo(serial);
        });
    }
}
