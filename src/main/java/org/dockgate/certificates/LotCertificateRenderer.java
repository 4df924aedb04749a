package org.dockgate.certificates;

import com.lowagie.text.Element;
import com.lowagie.text.Image;
import com.lowagie.text.Phrase;
import com.lowagie.text.pdf.PdfPCell;
import com.lowagie.text.pdf.PdfPTable;
import com.lowagie.text.pdf.PdfTemplate;
import java.awt.Graphics2D;
import java.awt.geom.Rectangle2D;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.Set;
import java.util.stream.Collectors;
import org.dockgate.accounts.AccountService;
import org.dockgate.accounts.Person;
import org.dockgate.bench.BenchService;
import org.dockgate.bench.Reading;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.core.evaluation.MetricResult;
import org.dockgate.evaluation.Charts;
import org.dockgate.evaluation.LotEvaluationView;
import org.dockgate.evaluation.UnitEvaluationView;
import org.dockgate.instruments.InstrumentService;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.ReceivingService;
import org.jfree.chart.JFreeChart;
import org.springframework.stereotype.Component;

/**
 * The certificate of conformance for a lot with an inspection report per sampled unit (the items
 * ISO/IEC 17025:2017 7.8.2 and 7.8.6 ask of a report, as far as they fit incoming inspection). Every
 * number comes from the stored readings through the evaluation, the procedure revision and the
 * instrument register; charts are drawn as vector graphics.
 */
@Component
class LotCertificateRenderer {

    private static final DateTimeFormatter WHEN = DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm zzz", Locale.ENGLISH);

    private final CertificatePdfWriter writer;
    private final ReceivingService receiving;
    private final CatalogueService catalogue;
    private final InstrumentService instruments;
    private final BenchService bench;
    private final AccountService accounts;
    private final java.time.Clock clock;

    LotCertificateRenderer(CertificatePdfWriter writer, ReceivingService receiving, CatalogueService catalogue,
                           InstrumentService instruments, BenchService bench, AccountService accounts,
                           java.time.Clock clock) {
        this.clock = clock;
        this.writer = writer;
        this.receiving = receiving;
        this.catalogue = catalogue;
        this.instruments = instruments;
        this.bench = bench;
        this.accounts = accounts;
    }

    byte[] render(CertificateHeading heading, LotEvaluationView ev, String approver) {
        var lot = ev.lot();
        var receipt = receiving.receipt(lot.receiptId()).orElseThrow();
        var spec = catalogue.revision(lot.specificationRevisionId()).orElseThrow();
        var model = catalogue.model(lot.modelId()).orElseThrow();
        var supplier = catalogue.supplier(lot.supplierId()).orElseThrow();
        ZoneId zone = writer.labZone();
        CertificateDocument doc = writer.open(heading, "Certificate of conformance");

        doc.section("1 Identification");
        Map<String, String> id = new LinkedHashMap<>();
        id.put("Supplier", supplier.name() + " (" + supplier.code() + ")");
        id.put("Purchase order", receipt.purchaseOrder());
        id.put("Delivery note", receipt.deliveryNote());
        id.put("Received", receipt.receivedOn() + " by " + name(receipt.receivedBy()));
        id.put("Sensor model", model.partNumber() + " — " + model.name());
        id.put("Specification revision", spec.label());
        id.put("Procedure revision", ev.procedure().label());
        id.put("Lot", "Lot " + lot.id() + ", " + lot.quantity() + " units");
        var plan = lot.plan();
        id.put("Sampling plan", "ISO 2859-1, AQL " + plan.aql().label() + ", level " + plan.level() + ", "
                + plan.severity().name().toLowerCase(Locale.ROOT) + " inspection: code letter " + plan.codeLetter()
                + (plan.planCodeLetter() != plan.codeLetter() ? " (plan of " + plan.planCodeLetter() + ")" : "")
                + ", n = " + plan.sampleSize() + ", Ac = " + plan.acceptNumber() + ", Re = " + plan.rejectNumber()
                + (plan.fullInspection() ? ", 100 % inspection" : ""));
        id.put("Units tested", String.join(", ", lot.sampledSerials()));
        doc.facts(id);

        doc.section("2 Decision rule");
        doc.paragraph(ev.procedure().settings().ruleInWords() + " Limits are inclusive. The expanded uncertainty U is"
                + " stated with its coverage factor k for a coverage probability of about 95 % (JCGM 100:2008).");

        doc.section("3 Lot decision");
        boolean accepted = lot.state() == LotState.DISPOSITIONED_ACCEPTED;
        Map<String, String> decision = new LinkedHashMap<>();
        decision.put("Nonconforming units", ev.nonconforming() + " of " + plan.sampleSize());
        decision.put("Conditional results", ev.procedure().settings().conditionalCounting().inWords());
        decision.put("Decision", accepted ? "ACCEPTED (d ≤ Ac)" : "REJECTED (d ≥ Re)");
        ev.nonconformance().ifPresent(n -> {
            decision.put("Nonconformance report", n.number());
            decision.put("Disposition", n.action().name().replace('_', ' ').toLowerCase(Locale.ROOT)
                    + n.concessionApprovedBy().map(s -> ", concession approved by " + name(s) + ": " + n.concessionReason().orElse(""))
                    .orElse(""));
            if (n.correctiveActionRequested()) {
                decision.put("Corrective action", "requested from the supplier, due " + n.correctiveActionDue().map(Object::toString).orElse("—"));
            }
        });
        doc.facts(decision);

        doc.section("4 Reference instruments");
        // The calibration records the frozen results were computed with (in force when the readings were taken),
        // never the instruments' current ones.
        Set<String> used = new LinkedHashSet<>();
        ev.units().forEach(u -> used.addAll(u.instruments()));
        Map<String, UnitEvaluationView.CalibrationUsed> records = new LinkedHashMap<>();
        ev.units().forEach(u -> u.calibrations().forEach(c -> records.putIfAbsent(c.instrument() + " " + c.certificateNumber(), c)));
        PdfPTable refs = table(doc, new float[] {1.2f, 3.2f, 1.6f, 1.2f, 1.2f}, "Identifier", "Description", "Certificate",
                "Calibrated", "Due");
        for (String identifier : used) {
            String description = instruments.find(identifier).map(v -> v.description()).orElse("");
            List<UnitEvaluationView.CalibrationUsed> ofInstrument = records.values().stream()
                    .filter(c -> c.instrument().equals(identifier)).toList();
            if (ofInstrument.isEmpty()) {
                cell(doc, refs, identifier);
                cell(doc, refs, description);
                cell(doc, refs, "not recorded with the results");
                cell(doc, refs, "—");
                cell(doc, refs, "—");
            }
            for (UnitEvaluationView.CalibrationUsed c : ofInstrument) {
                cell(doc, refs, identifier);
                cell(doc, refs, description);
                cell(doc, refs, c.certificateNumber());
                cell(doc, refs, c.calibratedOn().toString());
                cell(doc, refs, c.dueOn().toString());
            }
        }
        doc.add(refs);

        doc.section("5 Results per unit");
        for (UnitEvaluationView unit : ev.units()) {
            List<Reading> readings = bench.currentReadings(lot.id(), unit.serial());
            String tested = unit.operators().stream().map(this::name).collect(Collectors.joining(", "));
            String dates = readings.stream().map(r -> r.recordedAt().atZone(zone).toLocalDate().toString()).distinct()
                    .sorted().collect(Collectors.joining(", "));
            doc.paragraph("Unit " + unit.serial() + ": " + unit.result().unitVerdict().map(Enum::name).orElse("not evaluated")
                    + ". Tested by " + tested + " on " + dates + "; conditions "
                    + unit.ambientC().map(t -> String.format(Locale.ROOT, "%.1f °C", t)).orElse("not recorded")
                    + unit.humidityPercent().map(h -> String.format(Locale.ROOT, ", %.0f %% RH", h)).orElse("") + ".");
            PdfPTable results = table(doc, new float[] {1.5f, 1.4f, 1.4f, 1.8f, 1.8f, 1.3f}, "Metric", "Measured", "U (k)",
                    "Tolerance", "Acceptance limits", "Verdict");
            for (MetricResult m : unit.result().metrics()) {
                cell(doc, results, m.metric().name().toLowerCase(Locale.ROOT).replace('_', ' '));
                cell(doc, results, measured(m.measured(), m.uncertainty().value()) + " " + m.unit());
                cell(doc, results, uncertainty(m.uncertainty().value()) + " (" + String.format(Locale.ROOT, "%.2f", m.uncertainty().coverageFactor()) + ")");
                cell(doc, results, range(m.tolerance().lower(), m.tolerance().upper()));
                cell(doc, results, range(m.acceptanceLower(), m.acceptanceUpper()));
                cell(doc, results, m.verdict().name());
            }
            doc.add(results);
            if (!unit.staticPoints().isEmpty()) {
                chart(doc, Charts.calibration(spec.specification(), ev.procedure().content(), unit.staticPoints()), 480, 220);
            }
            if (!unit.sweepPoints().isEmpty()) {
                chart(doc, Charts.frequencyResponse(spec.specification(), unit.sweepPoints()), 480, 190);
            }
        }

        doc.section("6 Approval");
        Map<String, String> approval = new LinkedHashMap<>();
        approval.put("Approved by", name(approver) + " (digitally signed below)");
        approval.put("Issued", clock.instant().atZone(zone).format(WHEN));
        doc.facts(approval);
        return doc.finish();
    }

    private void chart(CertificateDocument doc, JFreeChart chart, float width, float height) {
        PdfTemplate template = doc.writer().getDirectContent().createTemplate(width, height);
        Graphics2D g = template.createGraphicsShapes(width, height);
        chart.draw(g, new Rectangle2D.Double(0, 0, width, height));
        g.dispose();
        try {
            Image image = Image.getInstance(template);
            image.setAlignment(Element.ALIGN_CENTER);
            doc.add(image);
        } catch (com.lowagie.text.BadElementException e) {
            throw new IllegalStateException("Cannot place a chart on the certificate", e);
        }
    }

    private static PdfPTable table(CertificateDocument doc, float[] widths, String... headers) {
        PdfPTable t = new PdfPTable(widths);
        t.setWidthPercentage(100);
        t.setSpacingBefore(4);
        t.setSpacingAfter(6);
        t.setHeaderRows(1);
        for (String h : headers) {
            PdfPCell c = new PdfPCell(new Phrase(h, doc.boldFont(8)));
            c.setBackgroundColor(new java.awt.Color(0xe9, 0xed, 0xf2));
            t.addCell(c);
        }
        return t;
    }

    private static void cell(CertificateDocument doc, PdfPTable t, String text) {
        t.addCell(new PdfPCell(new Phrase(text == null ? "" : text, doc.font(8))));
    }

    private String name(String username) {
        return accounts.byUsername(username).map(Person::displayName).orElse(username);
    }

    static String number(double v) {
        if (!Double.isFinite(v)) {
            return "—";
        }
        return new java.math.BigDecimal(v).round(new java.math.MathContext(5)).stripTrailingZeros().toPlainString();
    }

    /**
     * U with two significant digits, and the measured value rounded to the same decimal place
     * (JCGM 100:2008 7.2.6), so floating-point noise far below U prints as 0.
     */
    static String uncertainty(double u) {
        if (!(u > 0) || !Double.isFinite(u)) {
            return number(u);
        }
        return new java.math.BigDecimal(u).round(new java.math.MathContext(2)).stripTrailingZeros().toPlainString();
    }

    static String measured(double value, double u) {
        if (!(u > 0) || !Double.isFinite(u) || !Double.isFinite(value)) {
            return number(value);
        }
        int decimals = 1 - (int) Math.floor(Math.log10(u));
        return new java.math.BigDecimal(value).setScale(decimals, java.math.RoundingMode.HALF_EVEN).stripTrailingZeros()
                .toPlainString().replaceFirst("^-0$", "0");
    }

    private static String range(OptionalDouble lower, OptionalDouble upper) {
        return (lower.isPresent() ? number(lower.getAsDouble()) : "−∞") + " … " + (upper.isPresent() ? number(upper.getAsDouble()) : "+∞");
    }
}
