package org.dockgate.core.acquisition;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.Reader;
import java.io.StringReader;
import java.util.ArrayList;
import java.util.List;
import org.dockgate.core.series.Direction;
import org.junit.jupiter.api.Test;

class AcquisitionCsvTest {

    static final ExpectedUnits BAR_MV = ExpectedUnits.of("bar", "mV");
    /** 1 psi = 6894.757293168361 Pa (NIST SP 811, B.8: 6.894 757 E+03 Pa; exact from the pound and the inch). */
    static final double PA_PER_PSI = 6894.757293168361;

    record Parsed(AcquisitionReport report, List<AcquiredReading> readings) {
    }

    static Parsed parse(String csv) {
        return parse(csv, BAR_MV);
    }

    static Parsed parse(String csv, ExpectedUnits units) {
        List<AcquiredReading> readings = new ArrayList<>();
        AcquisitionReport report = AcquisitionCsv.parse(new StringReader(csv), units, readings::add,
                ProgressListener.NONE);
        return new Parsed(report, readings);
    }

    @Test
    void aValidFileParses() {
        String csv = "\uFEFFserial,test,point,direction,cycle,value,unit\r\n"
                + "SN-0001,STATIC,0,UP,1,0.052,mV\r\n"
                + "\r\n"
                + "SN-0001,STATIC,2,up,1,\"20.11\",mV\r\n"
                + "   \r\n"
                + "\"SN-0001\",STATIC,10,DOWN,2,0.10005,V\r\n"
                + ",,,,,,\r\n"
                + "SN-0001,NOISE,0,,,-0.0012,mV\r\n"
                + "SN-0001,SWEEP,5 kHz,,,98.5,mV\r\n";
        Parsed p = parse(csv);
        assertThat(p.report().messages()).isEmpty();
        assertThat(p.report().valid()).isTrue();
        assertThat(p.report().rowsRead()).isEqualTo(5);
        assertThat(p.report().readingsAccepted()).isEqualTo(5);
        List<AcquiredReading> r = p.readings();
        // line numbers are the file's lines, blank lines included
        assertThat(r).extracting(AcquiredReading::line).containsExactly(2L, 4L, 6L, 8L, 9L);
        assertThat(r.get(1).direction()).contains(Direction.UP);
        assertThat(r.get(1).value()).isEqualTo(20.11);
        assertThat(r.get(2).value()).isCloseTo(100.05, within(1e-12)); // 0.10005 V = 100.05 mV
        assertThat(r.get(2).recordedUnit()).isEqualTo("V");
        assertThat(r.get(2).toCalibrationPoint().cycle()).isEqualTo(2);
        assertThat(r.get(3).test()).isEqualTo(AcquisitionTest.NOISE);
        assertThat(r.get(3).direction()).isEmpty();
        assertThat(r.get(4).point()).isEqualTo(5000.0);                 // 5 kHz
        assertThat(r.get(4).toFrequencyPoint().amplitude()).isEqualTo(98.5);
    }

    @Test
    void theExampleInDevelopersMdParses() throws java.io.IOException {
        String guide = java.nio.file.Files.readString(java.nio.file.Path.of("DEVELOPERS.md"));
        int section = guide.indexOf("## Data-acquisition CSV format");
        assertThat(section).as("DEVELOPERS.md has the format section").isNotNegative();
        int start = guide.indexOf("```\n", section) + 4;
        String example = guide.substring(start, guide.indexOf("```", start));
        Parsed p = parse(example);
        assertThat(p.report().messages()).isEmpty();
        assertThat(p.readings()).hasSize(5);
        assertThat(p.readings().get(2).value()).isCloseTo(100.06, within(1e-12)); // 0.10006 V
    }

    @Test
    void psiSetPointsAreConvertedIntoABarProcedure() {
        Parsed p = parse(AcquisitionCsv.HEADER + "\n"
                + "SN-7,STATIC,29.00755 psi,UP,1,20.1,mV\n"
                + "SN-7,STATIC,145.0377psi,UP,1,100.0,mV\n");
        assertThat(p.report().valid()).isTrue();
        // NIST SP 811: 1 psi = 6894.757293168361 Pa; 1 bar = 100 000 Pa (SI Brochure, non-SI unit accepted)
        assertThat(p.readings().get(0).point()).isCloseTo(29.00755 * PA_PER_PSI / 1e5, within(1e-12));
        assertThat(p.readings().get(0).point()).isCloseTo(2.0, within(1e-6));
        assertThat(p.readings().get(1).point()).isCloseTo(145.0377 * PA_PER_PSI / 1e5, within(1e-12));
        assertThat(p.readings().get(0).recordedPoint()).isEqualTo("29.00755 psi");
    }

    @Test
    void unitTextThatCrashedTheParserIsALineAndColumnError() {
        // Each of these made the UCUM parser throw a java.lang.Error (or overflow the stack): a whole import failed.
        List<String> nasty = List.of("mV\u00e9", "\u20ac", "\ufeffmV", "mV\ufffd", "m\u202eV", "[", "{", "mV6000");
        StringBuilder csv = new StringBuilder(AcquisitionCsv.HEADER).append('\n');
        for (String unit : nasty) {
            csv.append("SN-1,STATIC,0,UP,1,1.5,").append(unit).append('\n');
        }
        csv.append("SN-1,STATIC,0,UP,1,1.5,mV\n");
        Parsed p = parse(csv.toString());
        assertThat(p.report().errors()).hasSize(nasty.size());
        for (int i = 0; i < nasty.size(); i++) {
            assertThat(p.report().errors().get(i).line()).isEqualTo(i + 2);
            assertThat(p.report().errors().get(i).column()).contains("unit");
        }
        assertThat(p.report().readingsAccepted()).isEqualTo(1);
    }

    @Test
    void oneBadRowReportsExactlyThatLineAndColumn() {
        StringBuilder csv = new StringBuilder(AcquisitionCsv.HEADER).append('\n');
        for (int line = 2; line <= 30; line++) {
            csv.append("SN-1,STATIC,").append(line % 6 * 2).append(",UP,1,")
                    .append(line == 17 ? "abc" : "1.5").append(",mV\n");
        }
        Parsed p = parse(csv.toString());
        assertThat(p.report().messages()).containsExactly("line 17, column 'value': 'abc' is not a number");
        assertThat(p.report().errors().get(0).line()).isEqualTo(17);
        assertThat(p.report().errors().get(0).column()).contains("value");
        assertThat(p.report().rowsRead()).isEqualTo(29);
        assertThat(p.report().readingsAccepted()).isEqualTo(28);
    }

    @Test
    void everyBadFieldIsReportedAndParsingGoesOn() {
        Parsed p = parse(AcquisitionCsv.HEADER + "\n"
                + "SN-1,STATIC,2,UP,1,1.0,mV\n"
                + "SN-1,STATIC,2,SIDEWAYS,0,1.0,mV\n"
                + "SN-1,STATIC,2,UP,1,1.0,mV\n"
                + "SN-1,STATIC,2,UP,1,1.0,mV\n"
                + "SN-1,STATIC,2,UP,1,1.0,mV\n"
                + "SN-1,STATIC,2,UP,1,1.0,mV\n"
                + "SN-1,STATIC,2,UP,1,1.0,mV\n"
                + "SN-1,STATIC,2,UP,1,2.5,psi\n"
                + "SN-1,NOISE,3,UP,1,NaN,mV\n"
                + ",TORQUE,x,,,1e400,furlong\n"
                + "SN-1,STATIC,2 m,UP,1,\"1,5\",mV\n"
                + "SN-1,SWEEP,0,,,-1,mV\n"
                + "SN-1,STATIC,2,UP\n");
        assertThat(p.report().messages()).containsExactly(
                "line 3, column 'direction': 'SIDEWAYS' is not a direction; a STATIC row needs UP or DOWN",
                "line 3, column 'cycle': '0' is not a cycle; a STATIC row needs a whole number of 1 or more",
                "line 9, column 'unit': 'psi' is not compatible with mV (a voltage was expected, 'psi' is a pressure)",
                "line 10, column 'direction': must be empty for a NOISE row, found 'UP'",
                "line 10, column 'cycle': must be empty for a NOISE row, found '1'",
                "line 10, column 'value': 'NaN' is not a finite number",
                "line 11, column 'serial': is empty; the unit's serial number is needed",
                "line 11, column 'test': 'TORQUE' is not a test; expected STATIC, NOISE or SWEEP",
                "line 11, column 'value': '1e400' is too large for a number",
                "line 11, column 'unit': 'furlong' is not a unit Dockgate knows",
                "line 12, column 'point': 'm' is not compatible with bar (a pressure was expected, 'm' is a length)",
                "line 12, column 'value': '1,5' is not a number (write the decimal separator as a point)",
                "line 13, column 'point': '0' is not a frequency; it must be greater than 0",
                "line 13, column 'value': '-1' is not an amplitude; a sweep value must be greater than 0",
                "line 14: 4 fields, expected 7 (serial,test,point,direction,cycle,value,unit)");
        assertThat(p.report().readingsAccepted()).isEqualTo(6);
    }

    @Test
    void infinityIsRefused() {
        Parsed p = parse(AcquisitionCsv.HEADER + "\nSN-1,STATIC,2,UP,1,Infinity,mV\nSN-1,STATIC,-inf,UP,1,1,mV\n");
        assertThat(p.report().messages()).containsExactly(
                "line 2, column 'value': 'Infinity' is not a finite number",
                "line 3, column 'point': '-inf' is not a finite number");
    }

    @Test
    void aWrongHeaderIsOneClearError() {
        Parsed wrong = parse("serial,test,point,value,unit\nSN-1,STATIC,2,1.0,mV\n");
        assertThat(wrong.report().messages()).containsExactly("line 1: the header row must be exactly '"
                + AcquisitionCsv.HEADER + "', found 'serial,test,point,value,unit'");
        assertThat(wrong.report().rowsRead()).isZero();

        Parsed missing = parse("SN-1,STATIC,2,UP,1,1.0,mV\n");
        assertThat(missing.report().messages()).containsExactly("line 1: the header row is missing: the first line"
                + " must be exactly '" + AcquisitionCsv.HEADER + "', found the data row 'SN-1,STATIC,2,UP,1,1.0,mV'");

        Parsed semicolons = parse("serial;test;point;direction;cycle;value;unit\n");
        assertThat(semicolons.report().messages().get(0)).endsWith("(the separator must be a comma)");

        Parsed empty = parse("\n\n");
        assertThat(empty.report().messages()).containsExactly(
                "line 1: the file is empty: it must start with the header row '" + AcquisitionCsv.HEADER + "'");
    }

    @Test
    void brokenQuotingStopsWithTheLine() {
        Parsed p = parse(AcquisitionCsv.HEADER + "\nSN-1,STATIC,2,UP,1,1.0,mV\nSN-1,STATIC,\"2,UP,1,1.0,mV\n"
                + "SN-1,STATIC,4,UP,1,1.0,mV\n");
        assertThat(p.report().errors()).hasSize(1);
        assertThat(p.report().errors().get(0).line()).isEqualTo(3);
        assertThat(p.report().errors().get(0).message()).contains("malformed");
        assertThat(p.readings()).hasSize(1);
    }

    @Test
    void theCallersReaderIsLeftOpen() throws java.io.IOException {
        StringReader reader = new StringReader(AcquisitionCsv.HEADER + "\nSN-1,STATIC,2,UP,1,1.0,mV\n");
        AcquisitionCsv.parse(reader, BAR_MV, r -> { }, ProgressListener.NONE);
        assertThat(reader.ready()).isTrue(); // a closed StringReader throws here
    }

    @Test
    void theConsumerMayRefuseAReading() {
        List<AcquiredReading> kept = new ArrayList<>();
        AcquisitionReport report = AcquisitionCsv.parse(new StringReader(AcquisitionCsv.HEADER
                        + "\nSN-1,STATIC,2,UP,1,1.0,mV\nSN-9,STATIC,2,UP,1,1.0,mV\n"), BAR_MV,
                r -> {
                    if (!r.serial().equals("SN-1")) {
                        throw new IllegalArgumentException("serial " + r.serial() + " is not in this lot");
                    }
                    kept.add(r);
                }, ProgressListener.NONE);
        assertThat(report.messages()).containsExactly("line 3: serial SN-9 is not in this lot");
        assertThat(kept).hasSize(1);
        assertThat(report.readingsAccepted()).isEqualTo(1);
    }

    @Test
    void aRefusalNamesItsColumn() {
        AcquisitionReport report = AcquisitionCsv.parse(new StringReader(AcquisitionCsv.HEADER
                        + "\nSN-9,STATIC,2,UP,1,1.0,mV\nSN-9,STATIC,4,UP,1,1.0,mV\n"), BAR_MV,
                r -> {
                    if (r.point() == 2) {
                        throw new RefusedReading("serial", "SN-9 is not one of the sampled units");
                    }
                    throw new IllegalArgumentException("column 'point': 4 bar is not a point of the procedure");
                }, ProgressListener.NONE);
        assertThat(report.messages()).containsExactly(
                "line 2, column 'serial': SN-9 is not one of the sampled units",
                "line 3, column 'point': 4 bar is not a point of the procedure");
    }

    @Test
    void theErrorListIsCappedAndTheRestCounted() {
        StringBuilder csv = new StringBuilder(AcquisitionCsv.HEADER).append('\n');
        for (int i = 0; i < 300; i++) {
            csv.append("SN-1,STATIC,2,UP,1,x,mV\n");
        }
        Parsed p = parse(csv.toString());
        assertThat(p.report().errors()).hasSize(AcquisitionCsv.MAX_LISTED_ERRORS);
        assertThat(p.report().errorsNotListed()).isEqualTo(100);
        assertThat(p.report().errorCount()).isEqualTo(300);
        assertThat(p.report().messages()).last().isEqualTo("… and 100 more errors");
    }

    @Test
    void aMillionRowsStreamWithBoundedMemory() {
        int rows = 1_000_000;
        Runtime runtime = Runtime.getRuntime();
        System.gc();
        long baseline = runtime.totalMemory() - runtime.freeMemory();
        long[] midway = new long[1];
        List<long[]> progress = new ArrayList<>();
        long[] count = new long[1];
        double[] sum = new double[1];
        long start = System.nanoTime();
        AcquisitionReport report = AcquisitionCsv.parse(new GeneratedFile(rows), BAR_MV, r -> {
            count[0]++;
            sum[0] += r.value();
        }, (read, characters) -> {
            progress.add(new long[] {read, characters});
            if (read == rows / 2) {
                System.gc();
                midway[0] = runtime.totalMemory() - runtime.freeMemory();
            }
        }, 50_000);
        double seconds = (System.nanoTime() - start) / 1e9;
        System.out.printf("AcquisitionCsv: %d rows in %.2f s, %.0f rows/s%n", rows, seconds, rows / seconds);

        assertThat(report.valid()).isTrue();
        assertThat(report.rowsRead()).isEqualTo(rows);
        assertThat(count[0]).isEqualTo(rows);
        // 20 reports every 50 000 rows and a last one at the end
        assertThat(progress).hasSize(21);
        assertThat(progress.get(0)[0]).isEqualTo(50_000);
        assertThat(progress.get(20)[0]).isEqualTo(rows);
        assertThat(progress.get(20)[1]).isEqualTo(GeneratedFile.length(rows));
        // Holding 500 000 parsed rows would take far more than 64 MB (each a record with strings and optionals).
        assertThat(midway[0] - baseline).as("heap growth halfway through, bytes").isLessThan(64L << 20);
    }

    /** A data-acquisition file generated as it is read, never held in memory. */
    static final class GeneratedFile extends Reader {
        private final int rows;
        private int next = -1; // -1 is the header
        private String current = "";
        private int position;

        GeneratedFile(int rows) {
            this.rows = rows;
        }

        static String line(int row) {
            if (row < 0) {
                return AcquisitionCsv.HEADER + "\n";
            }
            int point = row % 6;
            return "SN-" + (row / 36) + ",STATIC," + (point * 2) + ",UP," + (row / 6 % 3 + 1) + "," + (point * 20)
                    + "." + (row % 1000) + ",mV\n";
        }

        static long length(int rows) {
            long n = 0;
            for (int r = -1; r < rows; r++) {
                n += line(r).length();
            }
            return n;
        }

        @Override
        public int read(char[] buffer, int offset, int length) {
            int written = 0;
            while (written < length) {
                if (position == current.length()) {
                    if (next >= rows) {
                        break;
                    }
                    current = line(next++);
                    position = 0;
                }
                int n = Math.min(length - written, current.length() - position);
                current.getChars(position, position + n, buffer, offset + written);
                position += n;
                written += n;
            }
            return written == 0 ? -1 : written;
        }

        @Override
        public void close() {
        }
    }
}
