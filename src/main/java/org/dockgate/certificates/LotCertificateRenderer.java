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
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.stream.Collectors;
import org.dockgate.accounts.AccountService;
import org.dockgate.accounts.Person;
import org.dockgate.bench.BenchService;
import org.dockgate.bench.Reading;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.bench.ReadingTest;
import org.dockgate.core.decision.Verdict;
import org.dockgate.core.evaluation.MetricResult;
import org.dockgate.core.report.MetricWording;
import org.dockgate.core.report.ResultFormat;
import org.dockgate.evaluation.DispositionAction;
import org.dockgate.evaluation.EvaluationService;
import org.dockgate.evaluation.Charts;
import org.dockgate.evaluation.LotEvaluationView;
import org.dockgate.evaluation.UnitEvaluationView;
import org.dockgate.instruments.InstrumentService;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.ReceivingService;
import org.jfree.chart.JFreeChart;
import org.springframework.stereotype.Component;

/**
 * The lot's document by outcome — a certificate of conformance (accepted), a certificate of release under
 * concession (rejected, released as is under an approved concession) or an inspection report stating the
 * nonconformity (rejected) — with the results per sampled unit (the items
 * ISO/IEC 17025:2017 7.8.2 and 7.8.6 ask of a report, as far as they fit incoming inspection). Every
 * number comes from the stored readings through the evaluation, the procedure revision and the
 * instrument register; charts are drawn as vector graphics.
 */
@Component
class LotCertificateRenderer {

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

    /** What the document is, from the lot's outcome (issue 12: a rejected lot never gets a "certificate of conformance"). */
    enum Outcome {
        ACCEPTED("Certificate of conformance"),
        CONCESSION("Certificate of release under concession"),
        REJECTED("Inspection report");

        final String title;

        Outcome(String title) {
            this.title = title;
        }

        static Outcome of(LotEvaluationView ev) {
            if (ev.lot().state() == LotState.DISPOSITIONED_ACCEPTED) {
                return ACCEPTED;
            }
            boolean concession = ev.nonconformance().map(n -> n.action() == DispositionAction.USE_AS_IS_CONCESSION
                    && n.concessionApprovedBy().isPresent()).orElse(false);
            return concession ? CONCESSION : REJECTED;
        }
    }

    /** The document's title for the lot's outcome, also used by the lot pages. */
    static String title(LotEvaluationView ev) {
        return Outcome.of(ev).title;
    }

    byte[] render(CertificateHeading heading, LotEvaluationView ev, String approver) {
        var lot = ev.lot();
        var receipt = receiving.receipt(lot.receiptId()).orElseThrow();
        var spec = catalogue.revision(lot.specificationRevisionId()).orElseThrow();
        var model = catalogue.model(lot.modelId()).orElseThrow();
        var supplier = catalogue.supplier(lot.supplierId()).orElseThrow();
        ZoneId zone = writer.labZone();
        Outcome outcome = Outcome.of(ev);
        CertificateDocument doc = writer.open(heading, outcome.title);
        Map<String, List<Reading>> readings = new LinkedHashMap<>();
        ev.units().forEach(u -> readings.put(u.serial(), bench.currentReadings(lot.id(), u.serial())));

        doc.section("1 Identification");
        Map<String, String> id = new LinkedHashMap<>();
        // ISO/IEC 17025:2017 7.8.2.1 c) where the tests were performed, e) who the work was done for.
        id.put("Tests performed at", writer.labName() + (writer.labAddress().isBlank() ? "" : ", " + writer.labAddress()));
        id.put("Performed for", writer.receivingOrganisation());
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
        id.put("Sample drawn", plan.fullInspection() ? "every unit of the lot (seed " + lot.sampleSeed() + ")"
                : plan.sampleSize() + " of " + lot.quantity() + " units by a seeded random draw, seed " + lot.sampleSeed()
                + " (Fisher–Yates shuffle of the serials in entry order with java.util.Random; the seed re-draws the same sample)");
        id.put("Units tested", String.join(", ", lot.sampledSerials()));
        id.put("Serials in the lot", serialList(lot));
        doc.facts(id);
        doc.paragraph(scopeStatement(lot));

        doc.section("2 Decision rule");
        doc.paragraph(ev.procedure().settings().ruleInWords() + " Limits are inclusive. The expanded uncertainty U is"
                + " stated with its coverage factor k for a coverage probability of about 95 % (JCGM 100:2008) and"
                + " rounded up to two significant digits, the result to the same decimal place (JCGM 100:2008 7.2.6);"
                + " verdicts are decided on the unrounded values.");

        doc.section("3 Lot decision");
        doc.facts(decision(ev, outcome, spec.specification().inputUnit(), zone));

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
            List<Reading> unitReadings = readings.get(unit.serial());
            String tested = unit.operators().stream().map(this::name).collect(Collectors.joining(", "));
            String dates = unitReadings.stream().map(r -> r.recordedAt().atZone(zone).toLocalDate().toString()).distinct()
                    .sorted().collect(Collectors.joining(", "));
            doc.paragraph("Unit " + unit.serial() + ": " + unit.result().unitVerdict().map(Enum::name).orElse("not evaluated")
                    + ". Tested by " + tested + " on " + dates + "; conditions "
                    + unit.ambientC().map(t -> String.format(Locale.ROOT, "%.1f °C", t)).orElse("not recorded")
                    + unit.humidityPercent().map(h -> String.format(Locale.ROOT, ", %.0f %% RH", h)).orElse("") + ".");
            PdfPTable results = table(doc, new float[] {1.7f, 1.3f, 1.5f, 1.6f, 1.9f, 1.2f}, "Metric", "Measured", "U (k)",
                    "Tolerance", "Acceptance limits", "Verdict");
            for (MetricResult m : unit.result().metrics()) {
                cell(doc, results, MetricWording.name(m, spec.specification()));
                cell(doc, results, MetricWording.measured(m));
                cell(doc, results, MetricWording.uncertainty(m));
                cell(doc, results, MetricWording.tolerance(m));
                cell(doc, results, MetricWording.acceptance(m));
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

        doc.section("6 Deviations from the procedure");
        List<String> deviations = deviations(ev, readings);
        if (deviations.isEmpty()) {
            doc.paragraph("None recorded.");
        } else {
            deviations.forEach(d -> doc.paragraph("• " + d));
        }

        doc.section("7 Approval");
        Map<String, String> approval = new LinkedHashMap<>();
        approval.put("Approved by", name(approver) + " (digitally signed below)");
        approval.put("Issued", ResultFormat.dateTime(clock.instant(), zone));
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

    // ---------------------------------------------------------------- wording

    /** Every serial of the lot in entry order, the sampled ones marked, so the register finds any of them. */
    static String serialList(LotView lot) {
        return lot.serials().stream().map(serial -> lot.sampled(serial) ? serial + " (sampled)" : serial)
                .collect(Collectors.joining(", "));
    }

    /**
     * ISO/IEC 17025:2017 7.8.2.1 l) the results relate only to the items tested; and how a sampling
     * decision applies to the rest of the lot (ISO 2859-1: acceptance sampling judges the lot, not each unit).
     */
    static String scopeStatement(LotView lot) {
        String first = "The results in section 5 relate only to the units tested.";
        if (lot.plan().fullInspection() || lot.sampledSerials().size() == lot.quantity()) {
            return first + " Every unit of the lot was tested.";
        }
        return first + " The lot decision is an acceptance-sampling decision under ISO 2859-1 on the sample of "
                + lot.sampledSerials().size() + " units: it states whether the lot as a whole is accepted at the stated"
                + " AQL and does not certify each of the " + (lot.quantity() - lot.sampledSerials().size())
                + " unsampled units.";
    }

    private Map<String, String> decision(LotEvaluationView ev, Outcome outcome, String inputUnit, ZoneId zone) {
        var plan = ev.lot().plan();
        Map<String, String> decision = new LinkedHashMap<>();
        decision.put("Nonconforming units", ev.nonconforming() + " of " + plan.sampleSize());
        decision.put("Conditional results", ev.procedure().settings().conditionalCounting().inWords());
        switch (outcome) {
            case ACCEPTED -> {
                decision.put("Decision", "ACCEPTED (d ≤ Ac)");
                decision.put("Statement", "The lot conforms to the specification revision under the sampling plan"
                        + " and decision rule stated.");
            }
            case CONCESSION -> {
                decision.put("Decision", "REJECTED (d ≥ Re), released for use as is under concession");
                decision.put("Statement", "The lot does not meet the specification under the sampling plan; it is"
                        + " released for use as is only under the concession cited below.");
            }
            case REJECTED -> {
                decision.put("Decision", "REJECTED (d ≥ Re)");
                decision.put("Statement", "Nonconformity: the lot does not meet the specification revision under the"
                        + " sampling plan and decision rule stated; it is not released.");
            }
        }
        ev.nonconformance().ifPresent(n -> {
            decision.put("Nonconformance report", n.number());
            String failing = failing(ev, inputUnit);
            decision.put("Failing units and metrics", failing.isEmpty() ? "—" : failing);
            decision.put("Disposition", n.action().name().replace('_', ' ').toLowerCase(Locale.ROOT));
            n.concessionApprovedBy().ifPresent(by -> decision.put("Concession", "approved by " + name(by)
                    + n.concessionApprovedAt().map(at -> " on " + ResultFormat.dateTime(at, zone)).orElse("")
                    + " under nonconformance report " + n.number() + "; reason: " + n.concessionReason().orElse("")));
            if (n.correctiveActionRequested()) {
                decision.put("Corrective action", "requested from the supplier, due " + n.correctiveActionDue().map(Object::toString).orElse("—"));
            }
        });
        return decision;
    }

    /** "SN-3: nonlinearity (best-fit straight line) 0.31 %FSO FAIL; …" from the frozen results. */
    private static String failing(LotEvaluationView ev, String inputUnit) {
        return ev.units().stream()
                .filter(u -> u.result().unitVerdict().map(v -> !v.isConforming() || v == Verdict.CONDITIONAL_FAIL).orElse(false))
                .map(u -> u.serial() + ": " + EvaluationService.notPassing(u.result()).stream()
                        .map(m -> m.metric().name().toLowerCase(Locale.ROOT).replace('_', ' ') + MetricWording.decidingPoint(m, inputUnit)
                                + " " + measured(m) + " " + m.verdict().name())
                        .collect(Collectors.joining(", ")))
                .collect(Collectors.joining("; "));
    }

    /**
     * Deviations from the procedure as recorded (ISO/IEC 17025:2017 7.8.2.1 n): static and sweep readings
     * taken with another reference than the procedure names. Other recorded deviations are added here, so
     * that the section lists them all.
     */
    List<String> deviations(LotEvaluationView ev, Map<String, List<Reading>> readings) {
        List<String> out = new ArrayList<>();
        var content = ev.procedure().content();
        String staticReference = content.staticCalibration() == null ? null : content.staticCalibration().referenceInstrument();
        String sweepReference = content.frequencySweep() == null ? null : content.frequencySweep().referenceInstrument();
        readings.forEach((serial, list) -> {
            otherInstruments(list, ReadingTest.STATIC, staticReference).forEach(i -> out.add("Unit " + serial
                    + ": static readings taken with " + i + " instead of the procedure's " + staticReference + "."));
            otherInstruments(list, ReadingTest.SWEEP, sweepReference).forEach(i -> out.add("Unit " + serial
                    + ": sweep readings taken with " + i + " instead of the procedure's " + sweepReference + "."));
        });
        // Conditions outside the procedure's limits, kept by the bench as deviations with their reasons.
        ev.units().stream().filter(u -> u.conditionsDeviation().isPresent())
                .forEach(u -> out.add("Unit " + u.serial() + ": " + u.conditionsDeviation().get()));
        return out;
    }

    private static Set<String> otherInstruments(List<Reading> readings, ReadingTest test, String named) {
        if (named == null || named.isBlank()) {
            return Set.of();
        }
        return readings.stream().filter(r -> r.test() == test && r.instrument() != null && !r.instrument().isBlank()
                && !r.instrument().equals(named)).map(Reading::instrument).collect(Collectors.toCollection(java.util.TreeSet::new));
    }

    static String measured(MetricResult m) {
        return MetricWording.measured(m);
    }

}
