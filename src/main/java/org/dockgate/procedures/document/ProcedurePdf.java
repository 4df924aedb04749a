package org.dockgate.procedures.document;

import com.lowagie.text.Chunk;
import com.lowagie.text.Document;
import com.lowagie.text.DocumentException;
import com.lowagie.text.Element;
import com.lowagie.text.Font;
import com.lowagie.text.PageSize;
import com.lowagie.text.Paragraph;
import com.lowagie.text.Phrase;
import com.lowagie.text.Rectangle;
import com.lowagie.text.pdf.BaseFont;
import com.lowagie.text.pdf.PdfContentByte;
import com.lowagie.text.pdf.PdfPCell;
import com.lowagie.text.pdf.PdfPTable;
import com.lowagie.text.pdf.PdfPageEventHelper;
import com.lowagie.text.pdf.PdfTemplate;
import com.lowagie.text.pdf.PdfWriter;
import java.awt.Color;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.OptionalDouble;
import org.dockgate.core.report.ResultFormat;
import java.util.Set;
import org.dockgate.core.procedure.Metric;
import org.dockgate.core.procedure.KindPractice;
import org.dockgate.core.procedure.ProcedureProposal;
import org.dockgate.core.procedure.ProcedureProposal.FrequencySweep;
import org.dockgate.core.procedure.ProcedureProposal.MetricAcceptance;
import org.dockgate.core.procedure.ProcedureProposal.NoiseCapture;
import org.dockgate.core.procedure.ProcedureProposal.SamplingRow;
import org.dockgate.core.procedure.ProcedureProposal.StaticCalibration;
import org.dockgate.core.sampling.SamplingPlan;
import org.dockgate.core.series.Direction;
import org.springframework.stereotype.Component;

/**
 * Lays out a {@link ProcedureDocument} as an A4 PDF (OpenPDF): nine numbered sections, a header with
 * the procedure's identification and status and a "Page x of y" footer on every page.
 *
 * <p>Text is set in Liberation Sans, embedded as Identity-H, so ±, −, Ω, °, ≤ and µ print as written.
 * When that font file is missing the document falls back to Helvetica (WinAnsi); characters outside
 * that encoding are then spelled out ("Ohm", "<=", "-") rather than silently dropped.
 */
@Component
public class ProcedurePdf {

    /** Where Debian's fonts-liberation puts the regular face. */
    public static final Path LIBERATION_SANS = Path.of("/usr/share/fonts/truetype/liberation/LiberationSans-Regular.ttf");

    /** The statement every procedure prints in its safety section, whatever the cautions say. */
    public static final String SAFETY_STATEMENT = "Local codes, licensed practice and the lab's own safety rules"
            + " govern every test in this procedure. Acceptance by this inspection does not qualify a part for a"
            + " safety function.";

    private static final DateTimeFormatter DATE_TIME = DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm 'UTC'",
            Locale.ROOT).withZone(ZoneOffset.UTC);
    private static final DateTimeFormatter DATE = DateTimeFormatter.ofPattern("yyyy-MM-dd", Locale.ROOT)
            .withZone(ZoneOffset.UTC);
    private static final Color RULE = new Color(0x88, 0x88, 0x88);
    private static final Color HEAD_FILL = new Color(0xE6, 0xE9, 0xEE);
    private static final Color NOTE = new Color(0x44, 0x44, 0x44);
    private static final Color WARNING = new Color(0x9A, 0x1F, 0x1F);

    private final Path fontFile;

    /** Uses Liberation Sans from {@link #LIBERATION_SANS} when present, else Helvetica. */
    public ProcedurePdf() {
        this(LIBERATION_SANS);
    }

    /**
     * @param regularFont the TrueType regular face to embed; the bold face is looked for beside it
     *                    ({@code …-Regular.ttf} → {@code …-Bold.ttf}). A missing file means Helvetica.
     */
    public ProcedurePdf(Path regularFont) {
        this.fontFile = Objects.requireNonNull(regularFont, "regularFont");
    }

    /**
     * Renders the document.
     *
     * <p>Steps of the static calibration are listed in the order the technician visits them: for each
     * cycle, the points ascending, then (when descending is planned) the same points in reverse order.
     *
     * @param doc the document
     * @return the PDF bytes
     * @throws UncheckedIOException when a font file exists but cannot be read
     */
    public byte[] render(ProcedureDocument doc) {
        Objects.requireNonNull(doc, "doc");
        Fonts fonts = Fonts.load(fontFile);
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        Document pdf = new Document(PageSize.A4, 50, 50, 62, 56);
        try {
            PdfWriter writer = PdfWriter.getInstance(pdf, out);
            writer.setPageEvent(new HeaderAndFooter(doc, fonts));
            pdf.addTitle(fonts.text("Inspection procedure " + doc.identification() + " — " + doc.partNumber()));
            pdf.addSubject(fonts.text(doc.modelName() + ", " + doc.specificationRevision()));
            pdf.addAuthor(fonts.text(doc.author()));
            pdf.addCreator("Dockgate");
            pdf.open();
            new Layout(pdf, writer, doc, fonts).write();
            pdf.close();
        } catch (DocumentException e) {
            throw new IllegalStateException("The procedure document could not be laid out: " + e.getMessage(), e);
        }
        return out.toByteArray();
    }

    /** Number as printed: a stated value through the one results formatter (six significant digits, true minus). */
    static String number(double value) {
        return Double.isFinite(value) ? ResultFormat.stated(value) : "—";
    }

    /** "9.925 … 10.075", "≤ 0.25", "≥ 5000", or "—" when neither side is bounded. */
    static String interval(OptionalDouble lower, OptionalDouble upper) {
        return lower.isEmpty() && upper.isEmpty() ? "—" : ResultFormat.interval(lower, upper, "");
    }

    /** "4.0:1"; "∞:1" when the planned uncertainty is zero. */
    static String ratio(double tur) {
        return Double.isInfinite(tur) ? "∞:1" : String.format(Locale.ROOT, "%.1f:1", tur);
    }

    static String metricName(Metric metric) {
        String words = metric.name().toLowerCase(Locale.ROOT).replace('_', ' ');
        return switch (metric) {
            case RTD_TOLERANCE -> "RTD class tolerance";
            default -> Character.toUpperCase(words.charAt(0)) + words.substring(1);
        };
    }

    /** The fonts of one rendering, and the spelling-out of characters Helvetica cannot show. */
    record Fonts(BaseFont regular, BaseFont bold, boolean unicode) {

        static final Map<Character, String> WIN_ANSI_SPELLING = Map.of(
                '−', "-", '≤', "<=", '≥', ">=", 'Ω', "Ohm", '√', "sqrt", '≈', "~", '∞', "infinity");

        static Fonts load(Path regularFile) {
            try {
                if (Files.isReadable(regularFile)) {
                    BaseFont regular = BaseFont.createFont(regularFile.toString(), BaseFont.IDENTITY_H, BaseFont.EMBEDDED);
                    Path boldFile = regularFile.resolveSibling(
                            regularFile.getFileName().toString().replace("-Regular", "-Bold"));
                    BaseFont bold = !boldFile.equals(regularFile) && Files.isReadable(boldFile)
                            ? BaseFont.createFont(boldFile.toString(), BaseFont.IDENTITY_H, BaseFont.EMBEDDED)
                            : regular;
                    return new Fonts(regular, bold, true);
                }
                return new Fonts(BaseFont.createFont(BaseFont.HELVETICA, BaseFont.WINANSI, BaseFont.NOT_EMBEDDED),
                        BaseFont.createFont(BaseFont.HELVETICA_BOLD, BaseFont.WINANSI, BaseFont.NOT_EMBEDDED), false);
            } catch (IOException e) {
                throw new UncheckedIOException("Cannot read the font " + regularFile + ": " + e.getMessage(), e);
            } catch (DocumentException e) {
                throw new IllegalStateException("Cannot use the font " + regularFile + ": " + e.getMessage(), e);
            }
        }

        /** The text as this font can print it. */
        String text(String text) {
            if (unicode || text == null) {
                return text;
            }
            StringBuilder printable = new StringBuilder(text.length());
            text.codePoints().forEach(c -> {
                if (regular.charExists(c)) {
                    printable.appendCodePoint(c);
                } else {
                    printable.append(c <= Character.MAX_VALUE
                            ? WIN_ANSI_SPELLING.getOrDefault((char) c, "?") : "?");
                }
            });
            return printable.toString();
        }

        Font font(float size, boolean strong, Color color) {
            Font font = new Font(strong ? bold : regular, size, Font.NORMAL);
            font.setColor(color);
            return font;
        }
    }

    /** The body of the document, section by section. */
    private static final class Layout {

        private final Document pdf;
        private final PdfWriter writer;
        private final ProcedureDocument doc;
        private final ProcedureProposal proposal;
        private final Fonts fonts;
        private final Font body;
        private final Font strong;
        private final Font small;
        private final Font heading;
        private final Font warning;

        Layout(Document pdf, PdfWriter writer, ProcedureDocument doc, Fonts fonts) {
            this.pdf = pdf;
            this.writer = writer;
            this.doc = doc;
            this.proposal = doc.proposal();
            this.fonts = fonts;
            this.body = fonts.font(9.5f, false, Color.BLACK);
            this.strong = fonts.font(9.5f, true, Color.BLACK);
            this.small = fonts.font(8f, false, NOTE);
            this.heading = fonts.font(12.5f, true, Color.BLACK);
            this.warning = fonts.font(9.5f, true, WARNING);
        }

        void write() throws DocumentException {
            title();
            scope();
            safety();
            kindPractice();
            instruments();
            steps();
            acceptance();
            sampling();
            conditions();
            history();
            approval();
        }

        private void title() throws DocumentException {
            put(doc.labName(), fonts.font(13f, true, Color.BLACK), 0, 0);
            put(doc.labAddress(), small, 0, 0);
            put("Inspection procedure " + doc.identification(), fonts.font(17f, true, Color.BLACK), 14, 2);
            put(doc.partNumber() + " " + doc.modelName() + " · " + doc.status(), body, 0, 4);
        }

        private void scope() throws DocumentException {
            section("1 Scope and identification");
            put("This procedure states how incoming units of the sensor model below are tested and how"
                    + " each unit and each lot is judged against " + doc.specificationRevision() + ".", body, 0, 6);
            PdfPTable table = keyValueTable();
            keyValue(table, "Laboratory", doc.labName() + ", " + doc.labAddress());
            keyValue(table, "Procedure", doc.procedureNumber() + ", revision " + doc.revision());
            keyValue(table, "Status", doc.status());
            keyValue(table, "Sensor model", doc.partNumber() + " — " + doc.modelName());
            keyValue(table, "Kind", doc.sensorKind());
            keyValue(table, "Specification", doc.specificationRevision());
            keyValue(table, "Sampling", "AQL " + doc.aql() + " % nonconforming, inspection level " + doc.inspectionLevel()
                    + " (ISO 2859-1:1999 single sampling)");
            keyValue(table, "Decision rule", doc.decisionRule());
            keyValue(table, "Bench time per unit", "about " + proposal.estimatedBenchMinutes() + " min (estimate)");
            pdf.add(table);
        }

        private void safety() throws DocumentException {
            section("2 Safety");
            // The derivation's own safety statement is printed once, as the fixed statement below.
            List<String> cautions = proposal.cautions().stream()
                    .filter(c -> !c.toLowerCase(Locale.ROOT).contains("does not qualify a part for a safety function"))
                    .toList();
            bullets(cautions, body);
            put(SAFETY_STATEMENT, strong, 4, 0);
        }

        /** The kind's preparation items and cautions, each with its source (KindPractice), and the deferral. */
        private void kindPractice() throws DocumentException {
            KindPractice.Practice practice = doc.practice();
            if (practice == null) {
                return;
            }
            subsection("Cautions for this kind");
            bullets(practice.cautions().stream().map(KindPractice.Item::inWords).toList(), body);
            subsection("Preparation and practice for this kind");
            bullets(practice.items().stream().map(KindPractice.Item::inWords).toList(), body);
            put(KindPractice.DEFERRAL, strong, 4, 0);
        }

        private void instruments() throws DocumentException {
            section("3 Reference instruments");
            Map<String, Set<String>> usedFor = usedFor();
            if (doc.referenceInstruments().isEmpty()) {
                put("No reference instrument is listed for this procedure.", warning, 0, 0);
            } else {
                PdfPTable table = table(new float[] {16, 34, 18, 12, 20},
                        "Identifier", "Description", "Certificate", "Due date", "Used for");
                for (ProcedureDocument.ReferenceInstrument instrument : doc.referenceInstruments()) {
                    cell(table, instrument.identifier(), strong);
                    cell(table, instrument.description(), body);
                    cell(table, instrument.certificateNumber(), body);
                    cell(table, DATE.format(instrument.dueDate()), body);
                    cell(table, String.join(", ", usedFor.getOrDefault(instrument.identifier(), Set.of())), body);
                }
                pdf.add(table);
            }
            Set<String> listed = new LinkedHashSet<>();
            doc.referenceInstruments().forEach(i -> listed.add(i.identifier()));
            List<String> unlisted = usedFor.keySet().stream().filter(id -> !listed.contains(id)).toList();
            if (!unlisted.isEmpty()) {
                put("Named by the procedure but not listed above: " + String.join(", ", unlisted) + ".",
                        warning, 4, 0);
            }
            put("Use an instrument only while its calibration is valid on the day of the test.", small, 4, 0);
        }

        /** Which tests and metrics each instrument serves, in the order they appear. */
        private Map<String, Set<String>> usedFor() {
            Map<String, Set<String>> uses = new LinkedHashMap<>();
            StaticCalibration statics = proposal.staticCalibration();
            if (statics != null && statics.referenceInstrument() != null) {
                uses.computeIfAbsent(statics.referenceInstrument(), k -> new LinkedHashSet<>()).add("static calibration");
            }
            FrequencySweep sweep = proposal.frequencySweep();
            if (sweep != null && sweep.referenceInstrument() != null) {
                uses.computeIfAbsent(sweep.referenceInstrument(), k -> new LinkedHashSet<>()).add("frequency sweep");
            }
            for (MetricAcceptance metric : proposal.acceptance()) {
                if (metric.referenceInstrument() != null) {
                    uses.computeIfAbsent(metric.referenceInstrument(), k -> new LinkedHashSet<>())
                            .add(metricName(metric.metric()).toLowerCase(Locale.ROOT));
                }
            }
            return uses;
        }

        private void steps() throws DocumentException {
            section("4 Test steps");
            int test = 0;
            StaticCalibration statics = proposal.staticCalibration();
            if (statics != null) {
                subsection("4." + ++test + " Static calibration");
                put(statics.pointsInput().size() + " points, " + directionsInWords(statics.directions())
                        + ", " + statics.cycles() + (statics.cycles() == 1 ? " cycle" : " cycles") + "; let each point"
                        + " settle " + statics.settleSeconds() + " s before reading; " + statics.readingsPerUnit()
                        + " readings per unit. Reference: " + orNone(statics.referenceInstrument()) + "."
                        + (statics.appliedWindow() == null ? "" : " Record the value the reference applied at each point;"
                        + " it must lie within ±" + trimNumber(statics.appliedWindow()) + " " + statics.inputUnit()
                        + " of the set point."), body, 0, 4);
                PdfPTable table = table(new float[] {10, 10, 18, 22, 40},
                        "Step", "Cycle", "Direction", "Point (% of span)", "Input value (" + statics.inputUnit() + ")");
                int step = 0;
                for (int cycle = 1; cycle <= statics.cycles(); cycle++) {
                    for (Direction direction : statics.directions()) {
                        List<Integer> order = new ArrayList<>();
                        for (int i = 0; i < statics.pointsInput().size(); i++) {
                            order.add(direction == Direction.DOWN ? statics.pointsInput().size() - 1 - i : i);
                        }
                        for (int i : order) {
                            cell(table, String.valueOf(++step), body, Element.ALIGN_RIGHT);
                            cell(table, String.valueOf(cycle), body, Element.ALIGN_RIGHT);
                            cell(table, direction == Direction.UP ? "ascending" : "descending", body);
                            cell(table, i < statics.pointsPercentOfSpan().size()
                                    ? number(statics.pointsPercentOfSpan().get(i)) : "—", body, Element.ALIGN_RIGHT);
                            cell(table, number(statics.pointsInput().get(i)), body, Element.ALIGN_RIGHT);
                        }
                    }
                }
                pdf.add(table);
                bullets(statics.reasoning(), small);
            }
            NoiseCapture noise = proposal.noiseCapture();
            if (noise != null) {
                subsection("4." + ++test + " Noise capture");
                put("Record the output at zero input, sensor powered and settled.", body, 0, 4);
                PdfPTable table = keyValueTable();
                keyValue(table, "Samples", String.valueOf(noise.samples()));
                keyValue(table, "Sample rate", number(noise.sampleRateHz()) + " Hz");
                keyValue(table, "Duration", number(noise.durationSeconds()) + " s");
                pdf.add(table);
                bullets(noise.reasoning(), small);
            }
            FrequencySweep sweep = proposal.frequencySweep();
            if (sweep != null) {
                subsection("4." + ++test + " Frequency-response sweep");
                put("Constant amplitude " + number(sweep.amplitude()) + " " + sweep.amplitudeUnit()
                        + "; the response at " + number(sweep.referenceHz()) + " Hz is the reference. Reference: "
                        + orNone(sweep.referenceInstrument()) + ".", body, 0, 4);
                PdfPTable table = table(new float[] {12, 30, 30, 28},
                        "Point", "Frequency (Hz)", "Amplitude (" + sweep.amplitudeUnit() + ")", "Note");
                int point = 0;
                for (double frequency : sweep.frequenciesHz()) {
                    cell(table, String.valueOf(++point), body, Element.ALIGN_RIGHT);
                    cell(table, number(frequency), body, Element.ALIGN_RIGHT);
                    cell(table, number(sweep.amplitude()), body, Element.ALIGN_RIGHT);
                    cell(table, frequency == sweep.referenceHz() ? "reference" : "", body);
                }
                pdf.add(table);
                bullets(sweep.reasoning(), small);
            }
            if (test == 0) {
                put("This procedure defines no test.", warning, 0, 0);
            }
        }

        private void acceptance() throws DocumentException {
            section("5 Acceptance limits");
            put("Decision rule: " + doc.decisionRule(), body, 0, 2);
            put("A unit conforms when every metric lies within its acceptance limits. TUR = tolerance"
                    + " span / (2 U); 4:1 is adequate.", small, 0, 4);
            PdfPTable table = table(new float[] {15, 10, 17, 14, 18, 11, 15},
                    "Metric", "Unit", "Tolerance", "Planned U (k)", "Acceptance limits", "TUR", "Reference");
            for (MetricAcceptance m : proposal.acceptance()) {
                cell(table, metricName(m.metric()), strong);
                cell(table, m.unit(), body);
                cell(table, interval(m.toleranceLower(), m.toleranceUpper()), body);
                cell(table, m.plannedExpandedUncertainty().isPresent()
                        ? number(m.plannedExpandedUncertainty().getAsDouble()) + " (k = " + number(m.coverageFactor()) + ")"
                        : "not planned", body);
                cell(table, interval(m.acceptanceLower(), m.acceptanceUpper()), strong);
                if (m.testUncertaintyRatio().isPresent()) {
                    cell(table, ratio(m.testUncertaintyRatio().getAsDouble())
                            + (m.turAdequate() ? "" : " below 4:1"), m.turAdequate() ? body : warning);
                } else {
                    cell(table, "n/a", body);
                }
                cell(table, orNone(m.referenceInstrument()), body);
                PdfPCell reason = new PdfPCell(phrase(m.reasoning(), small));
                reason.setColspan(7);
                reason.setBorderColor(RULE);
                reason.setPaddingLeft(12);
                reason.setPaddingBottom(4);
                table.addCell(reason);
            }
            if (proposal.acceptance().isEmpty()) {
                put("No metric is judged by this procedure.", warning, 0, 0);
            } else {
                pdf.add(table);
            }
            List<String> low = proposal.acceptance().stream()
                    .filter(m -> m.testUncertaintyRatio().isPresent() && !m.turAdequate())
                    .map(m -> metricName(m.metric()).toLowerCase(Locale.ROOT)).toList();
            if (!low.isEmpty()) {
                put("TUR below 4:1 for " + String.join(", ", low) + ".", warning, 6, 2);
            }
            if (doc.turJustification().isPresent()) {
                put("TUR justification: " + doc.turJustification().get(), body, low.isEmpty() ? 6 : 0, 0);
            } else if (!low.isEmpty()) {
                put("No justification is recorded: this revision cannot be approved.", warning, 0, 0);
            }
            if (!proposal.reasoning().isEmpty()) {
                put("Notes", strong, 6, 2);
                bullets(proposal.reasoning(), small);
            }
        }

        private void sampling() throws DocumentException {
            section("6 Sampling plans");
            put("ISO 2859-1:1999 single sampling, AQL " + doc.aql() + ", inspection level "
                    + doc.inspectionLevel() + ". n: units to inspect; accept the lot with at most Ac nonconforming"
                    + " units, reject it with Re or more. Start at normal inspection; switching to tightened or"
                    + " reduced follows the standard's rules.", body, 0, 4);
            PdfPTable table = new PdfPTable(new float[] {13, 9, 9, 7, 7, 9, 7, 7, 9, 7, 7});
            table.setWidthPercentage(100);
            table.setHeaderRows(2);
            headCell(table, "Lot size", 1, 2);
            headCell(table, "Code letter", 1, 2);
            headCell(table, "Normal", 3, 1);
            headCell(table, "Tightened", 3, 1);
            headCell(table, "Reduced", 3, 1);
            for (int i = 0; i < 3; i++) {
                headCell(table, "n", 1, 1);
                headCell(table, "Ac", 1, 1);
                headCell(table, "Re", 1, 1);
            }
            boolean anyFull = false;
            for (SamplingRow row : proposal.sampling()) {
                cell(table, String.valueOf(row.lotSize()), strong, Element.ALIGN_RIGHT);
                cell(table, row.normal().codeLetter().name(), body, Element.ALIGN_CENTER);
                for (SamplingPlan plan : List.of(row.normal(), row.tightened(), row.reduced())) {
                    anyFull |= plan.fullInspection();
                    cell(table, plan.sampleSize() + (plan.fullInspection() ? "*" : ""), body, Element.ALIGN_RIGHT);
                    cell(table, String.valueOf(plan.acceptNumber()), body, Element.ALIGN_RIGHT);
                    cell(table, String.valueOf(plan.rejectNumber()), body, Element.ALIGN_RIGHT);
                }
            }
            pdf.add(table);
            if (anyFull) {
                put("* The tabulated sample reaches the lot size: inspect every unit (100 %).", small, 2, 0);
            }
        }

        private void conditions() throws DocumentException {
            section("7 Conditions to record");
            put("Record these with the readings of every unit:", body, 0, 2);
            bullets(proposal.environment(), body);
            put("Environmental limits: " + proposal.environmentalLimits().describe(), body, 2, 0);
        }

        private void history() throws DocumentException {
            section("8 Revision history");
            if (doc.history().isEmpty()) {
                put("First revision; no history yet.", body, 0, 0);
                edits();
                return;
            }
            PdfPTable table = table(new float[] {8, 16, 16, 20, 40}, "Rev", "Status", "Date", "By", "Reason");
            for (ProcedureDocument.RevisionEntry entry : doc.history()) {
                cell(table, String.valueOf(entry.revision()), body, Element.ALIGN_RIGHT);
                cell(table, entry.status(), body);
                cell(table, DATE.format(entry.at()), body);
                cell(table, entry.who(), body);
                cell(table, entry.reason(), body);
            }
            pdf.add(table);
            edits();
        }

        /** The engineer's edits to the derived proposal: what changed, why, by whom and when. */
        private void edits() throws DocumentException {
            subsection("Edits to the derived proposal in this revision");
            if (doc.edits().isEmpty()) {
                put("None: the procedure is as derived from the specification.", body, 0, 0);
                return;
            }
            PdfPTable table = table(new float[] {18, 22, 30, 30}, "Value", "Old → new", "Reason", "By, when");
            for (ProcedureDocument.EditEntry e : doc.edits()) {
                cell(table, e.field(), body);
                cell(table, e.oldValue() + " → " + e.newValue(), body);
                cell(table, e.reason(), body);
                cell(table, e.who() + ", " + DATE_TIME.format(e.at()), body);
            }
            pdf.add(table);
        }

        private void approval() throws DocumentException {
            section("9 Approval");
            PdfPTable table = keyValueTable();
            keyValue(table, "Author", doc.author());
            if (doc.approval().isPresent()) {
                keyValue(table, "Approved by", doc.approval().get().approver());
                keyValue(table, "Approved at", DATE_TIME.format(doc.approval().get().approvedAt()));
                pdf.add(table);
                put("Approved revisions are immutable; a change makes a new revision. The approval is"
                        + " recorded in the audit trail.", small, 4, 0);
            } else {
                keyValue(table, "Approved by", "—");
                pdf.add(table);
                put("Not approved: this is not a controlled copy and must not be used to accept units.",
                        warning, 6, 0);
            }
        }

        // --- building blocks ---------------------------------------------------------------------

        private void section(String title) throws DocumentException {
            keepWithNext(130);
            put(title, heading, 14, 5);
        }

        private void subsection(String title) throws DocumentException {
            keepWithNext(110);
            put(title, strong, 8, 3);
        }

        /** Starts a new page when less than {@code points} remain, so a heading never ends a page alone. */
        private void keepWithNext(float points) {
            if (writer.getVerticalPosition(true) - pdf.bottom() < points) {
                pdf.newPage();
            }
        }

        /**
         * Adds a paragraph with space before and after. The space is an empty fixed-height table, not
         * Paragraph spacing: OpenPDF draws paragraph spacing as a line holding one space glyph, which text
         * extraction then merges into the neighbouring line ("I nspection").
         */
        private void put(String text, Font font, float before, float after) throws DocumentException {
            space(before);
            Paragraph paragraph = new Paragraph(fonts.text(text), font);
            paragraph.setLeading(font.getSize() * 1.3f);
            pdf.add(paragraph);
            space(after);
        }

        private void space(float height) throws DocumentException {
            if (height <= 0) {
                return;
            }
            PdfPTable spacer = new PdfPTable(1);
            spacer.setWidthPercentage(100);
            PdfPCell cell = new PdfPCell();
            cell.setBorder(Rectangle.NO_BORDER);
            cell.setFixedHeight(height);
            cell.setPadding(0);
            spacer.addCell(cell);
            pdf.add(spacer);
        }

        private Phrase phrase(String text, Font font) {
            return new Phrase(font.getSize() * 1.25f, fonts.text(text), font);
        }

        private void bullets(List<String> items, Font font) throws DocumentException {
            for (String item : items) {
                Paragraph paragraph = new Paragraph(font.getSize() * 1.3f, "", font);
                paragraph.add(new Chunk("•  ", font));
                paragraph.add(new Chunk(fonts.text(item), font));
                paragraph.setIndentationLeft(12);
                paragraph.setFirstLineIndent(-8);
                space(2);
                pdf.add(paragraph);
            }
        }

        private PdfPTable table(float[] widths, String... headers) {
            PdfPTable table = new PdfPTable(widths);
            table.setWidthPercentage(100);
            table.setSpacingBefore(2);
            table.setHeaderRows(1);
            for (String header : headers) {
                headCell(table, header, 1, 1);
            }
            return table;
        }

        private PdfPTable keyValueTable() {
            PdfPTable table = new PdfPTable(new float[] {26, 74});
            table.setWidthPercentage(100);
            return table;
        }

        private void keyValue(PdfPTable table, String key, String value) {
            PdfPCell k = new PdfPCell(phrase(key, strong));
            k.setBackgroundColor(HEAD_FILL);
            k.setBorderColor(RULE);
            k.setPadding(4);
            table.addCell(k);
            PdfPCell v = new PdfPCell(phrase(value, body));
            v.setBorderColor(RULE);
            v.setPadding(4);
            table.addCell(v);
        }

        private void headCell(PdfPTable table, String text, int colspan, int rowspan) {
            PdfPCell cell = new PdfPCell(phrase(text, strong));
            cell.setColspan(colspan);
            cell.setRowspan(rowspan);
            cell.setBackgroundColor(HEAD_FILL);
            cell.setBorderColor(RULE);
            cell.setPadding(4);
            cell.setHorizontalAlignment(colspan > 1 ? Element.ALIGN_CENTER : Element.ALIGN_LEFT);
            table.addCell(cell);
        }

        private void cell(PdfPTable table, String text, Font font) {
            cell(table, text, font, Element.ALIGN_LEFT);
        }

        private void cell(PdfPTable table, String text, Font font, int alignment) {
            PdfPCell cell = new PdfPCell(phrase(text, font));
            cell.setBorderColor(RULE);
            cell.setPadding(3.5f);
            cell.setHorizontalAlignment(alignment);
            table.addCell(cell);
        }

        private static String directionsInWords(List<Direction> directions) {
            return directions.contains(Direction.DOWN) ? "ascending then descending" : "ascending";
        }

        private static String orNone(String reference) {
            return reference == null ? "none planned" : reference;
        }
    }

    /**
     * The running header (procedure, revision, status; lab) and footer ("Page x of y"). The total is
     * written into one template, shared by all pages, once the document closes.
     */
    private static final class HeaderAndFooter extends PdfPageEventHelper {

        private static final float SIZE = 8f;
        private final ProcedureDocument doc;
        private final Fonts fonts;
        private PdfTemplate total;
        private int lastPage;

        HeaderAndFooter(ProcedureDocument doc, Fonts fonts) {
            this.doc = doc;
            this.fonts = fonts;
        }

        @Override
        public void onOpenDocument(PdfWriter writer, Document document) {
            total = writer.getDirectContent().createTemplate(40, SIZE + 4);
        }

        @Override
        public void onEndPage(PdfWriter writer, Document document) {
            lastPage = writer.getPageNumber();
            PdfContentByte cb = writer.getDirectContent();
            Rectangle page = document.getPageSize();
            float left = document.left();
            float right = document.right();
            float top = page.getHeight() - 36;
            float bottom = 32;

            cb.saveState();
            cb.setColorStroke(RULE);
            cb.setLineWidth(0.5f);
            cb.moveTo(left, top - 5);
            cb.lineTo(right, top - 5);
            cb.moveTo(left, bottom + 11);
            cb.lineTo(right, bottom + 11);
            cb.stroke();
            cb.restoreState();

            text(cb, fonts.bold, fonts.text(doc.identification() + " · " + doc.status()), left, top, false);
            text(cb, fonts.regular, fonts.text(doc.labName()), right, top, true);
            text(cb, fonts.regular, fonts.text(doc.partNumber() + " · " + doc.specificationRevision()), left, bottom,
                    false);

            String label = "Page " + lastPage + " of ";
            float totalWidth = fonts.regular.getWidthPoint("000", SIZE);
            float labelWidth = fonts.regular.getWidthPoint(label, SIZE);
            float x = right - totalWidth - labelWidth;
            text(cb, fonts.regular, label, x, bottom, false);
            cb.addTemplate(total, x + labelWidth, bottom);
        }

        @Override
        public void onCloseDocument(PdfWriter writer, Document document) {
            total.beginText();
            total.setFontAndSize(fonts.regular, SIZE);
            total.setTextMatrix(0, 0);
            total.showText(String.valueOf(lastPage));
            total.endText();
        }

        private static void text(PdfContentByte cb, BaseFont font, String text, float x, float y, boolean alignRight) {
            cb.beginText();
            cb.setFontAndSize(font, SIZE);
            cb.showTextAligned(alignRight ? Element.ALIGN_RIGHT : Element.ALIGN_LEFT, text, x, y, 0);
            cb.endText();
        }
    }

    private static String trimNumber(double v) {
        return java.math.BigDecimal.valueOf(v).round(new java.math.MathContext(6)).stripTrailingZeros().toPlainString();
    }
}
