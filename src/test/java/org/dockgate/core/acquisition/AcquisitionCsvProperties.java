package org.dockgate.core.acquisition;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.StringReader;
import java.util.ArrayList;
import java.util.List;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.StringLength;

/** What a writer puts in a data-acquisition file comes back out unchanged. */
class AcquisitionCsvProperties {

    static List<AcquiredReading> parse(String row, AcquisitionReport[] report) {
        List<AcquiredReading> readings = new ArrayList<>();
        report[0] = AcquisitionCsv.parse(new StringReader(AcquisitionCsv.HEADER + "\n" + row + "\n"),
                ExpectedUnits.of("bar", "mV"), readings::add, ProgressListener.NONE);
        return readings;
    }

    /** Java's shortest round-trip decimal form (Double.toString, e.g. 1.0E-5) parses back to the same double. */
    @Property(tries = 2000)
    void anyFiniteValueWrittenByJavaRoundTrips(@ForAll double value) {
        if (!Double.isFinite(value)) {
            return;
        }
        AcquisitionReport[] report = new AcquisitionReport[1];
        List<AcquiredReading> readings = parse("SN-1,STATIC,2,UP,1," + value + ",mV", report);
        assertThat(report[0].messages()).isEmpty();
        assertThat(readings.get(0).value()).isEqualTo(value);
    }

    /** A serial with commas, quotes or line breaks survives RFC 4180 quoting (quotes doubled). */
    @Property(tries = 500)
    void aQuotedSerialRoundTrips(@ForAll @StringLength(min = 1, max = 40) String serial) {
        String stripped = serial.strip();
        if (stripped.isEmpty() || stripped.indexOf('\uFEFF') >= 0 || !stripped.equals(serial)) {
            return; // serials are trimmed, and a blank one is an error of its own
        }
        AcquisitionReport[] report = new AcquisitionReport[1];
        List<AcquiredReading> readings = parse("\"" + serial.replace("\"", "\"\"") + "\",STATIC,2,UP,1,1.5,mV",
                report);
        assertThat(report[0].messages()).isEmpty();
        assertThat(readings.get(0).serial()).isEqualTo(serial);
    }
}
