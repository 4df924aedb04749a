package org.dockgate.browser;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.UUID;
import org.dockgate.bench.BenchPlan;
import org.dockgate.bench.BenchService;
import org.dockgate.bench.ExpectedReading;
import org.dockgate.bench.NewReading;
import org.dockgate.bench.Reading;
import org.dockgate.bench.ReadingTest;
import org.dockgate.core.series.Direction;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.ReceivingService;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.Keys;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.ExpectedConditions;
import org.openqa.selenium.support.ui.Select;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.security.authentication.UsernamePasswordAuthenticationToken;
import org.springframework.security.core.authority.AuthorityUtils;
import org.springframework.security.core.context.SecurityContextHolder;

/**
 * The daily flow through the pages: an operator receives a QP-250 lot of 8 from QSL with the keyboard alone
 * (serials typed one per line, as a barcode scanner does), records one unit on the bench page by keyboard
 * (each value saved on Enter), the rest of the sample is recorded through the service, and an engineer sees
 * every unit pass and accepts the lot.
 */
class LotFlowBrowserTest extends BrowserTestSupport {

    @Autowired BenchService bench;
    @Autowired ReceivingService receiving;

    /** Nominal QP-250 output, 10 mV/bar × p, plus a small per-cycle step so repeatability is not exactly zero. */
    static double output(double pointBar, int cycle) {
        return Math.round((10.0 * pointBar + 0.0002 * cycle) * 10000) / 10000.0; // datasheet nominal 10 mV/bar
    }

    /** Presses Tab (or Shift+Tab) until the element with this id has focus; fails after 40 presses. */
    void tabTo(String id, boolean backwards) {
        for (int i = 0; i < 40; i++) {
            if (id.equals(driver.switchTo().activeElement().getDomAttribute("id"))) {
                return;
            }
            driver.switchTo().activeElement().sendKeys(backwards ? Keys.chord(Keys.SHIFT, Keys.TAB) : Keys.TAB);
        }
        throw new AssertionError("Tab never reached #" + id + "; focus is on #"
                + driver.switchTo().activeElement().getDomAttribute("id"));
    }

    String focusedId() {
        return driver.switchTo().activeElement().getDomAttribute("id");
    }

    @Test
    void aLotIsReceivedMeasuredAndAcceptedThroughThePages() throws Exception {
        String tag = UUID.randomUUID().toString().substring(0, 6).toUpperCase(Locale.ROOT);
        List<String> serials = new ArrayList<>();
        for (int i = 1; i <= 8; i++) {
            serials.add("F" + tag + "-" + i);
        }

        // 1. Receiving, keyboard only: Tab between fields, type-ahead in the selects, Enter between serials.
        signIn("operator", "operator-demo");
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("start-cards")));
        driver.get(url("/receiving/new"));
        waitUpTo(10).until(d -> "purchaseOrder".equals(focusedId()));
        driver.switchTo().activeElement().sendKeys("PO-F-" + tag);
        tabTo("deliveryNote", false);
        driver.switchTo().activeElement().sendKeys("DN-F-" + tag);
        tabTo("supplierId", false); // the date keeps today's default
        driver.switchTo().activeElement().sendKeys("QSL");
        assertThat(new Select(driver.findElement(By.id("supplierId"))).getFirstSelectedOption().getText()).startsWith("QSL ");
        tabTo("modelId", false);
        driver.switchTo().activeElement().sendKeys("QP-250");
        assertThat(new Select(driver.findElement(By.id("modelId"))).getFirstSelectedOption().getText()).startsWith("QP-250 ");
        tabTo("quantity", false);
        driver.switchTo().activeElement().sendKeys("8");
        tabTo("serials", false);
        WebElement serialsBox = driver.switchTo().activeElement();
        for (String serial : serials) {
            serialsBox.sendKeys(serial, Keys.ENTER); // what a barcode scanner types
        }
        screenshot("flow-1-receipt-filled");
        serialsBox.sendKeys(Keys.TAB);
        assertThat(driver.switchTo().activeElement().getTagName()).isEqualTo("button");
        driver.switchTo().activeElement().sendKeys(Keys.ENTER);

        waitUpTo(10).until(ExpectedConditions.urlMatches(".*/receiving/lots/\\d+$"));
        long lotId = Long.parseLong(driver.getCurrentUrl().replaceAll(".*/receiving/lots/(\\d+)$", "$1"));
        screenshot("flow-2-lot-received");
        // ISO 2859-1:1999 Table 1: lot 2 to 8, level II → A; Table 2-A at the procedure's AQL: arrow to a plan
        // with n ≥ 8 (E, n 13 at AQL 1.0), so every unit of the lot is inspected.
        LotView lot = receiving.lot(lotId).orElseThrow();
        assertThat(lot.state()).isEqualTo(LotState.AWAITING_MEASUREMENT);
        assertThat(lot.serials()).containsExactlyElementsOf(serials);
        assertThat(lot.plan().codeLetter().name()).isEqualTo("A"); // ISO 2859-1:1999 Table 1, lot 2 to 8, level II
        assertThat(lot.plan().planCodeLetter().name()).isEqualTo("E"); // ISO 2859-1:1999 Table 2-A, AQL 1.0: arrow from A to E (n 13)
        assertThat(lot.plan().acceptNumber()).isZero(); // ISO 2859-1:1999 Table 2-A, code letter E, AQL 1.0: Ac 0, Re 1
        assertThat(lot.plan().fullInspection()).isTrue();
        assertThat(lot.plan().sampleSize()).isEqualTo(8);
        assertThat(lot.sampledSerials()).containsExactlyInAnyOrderElementsOf(serials);
        assertThat(driver.findElement(By.id("plan")).getText()).contains("E", "8");
        assertThat(driver.findElements(By.cssSelector("#serials mark"))).hasSize(8);

        // 2. The bench: the first unit found by its serial, conditions and every reading typed, Enter after each.
        String first = serials.get(0);
        driver.get(url("/bench"));
        waitUpTo(10).until(d -> "serial".equals(focusedId()));
        driver.switchTo().activeElement().sendKeys(first, Keys.ENTER);
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("readings")));
        waitUpTo(10).until(d -> "r-0".equals(focusedId()));
        tabTo("ambientC", true);
        driver.switchTo().activeElement().sendKeys("23.1");
        tabTo("relativeHumidityPercent", false);
        driver.switchTo().activeElement().sendKeys("45", Keys.ENTER);
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("conditions-recorded")));
        waitUpTo(10).until(d -> "r-0".equals(focusedId()));

        BenchPlan plan = bench.planFor(bench.lot(lotId).orElseThrow());
        int typed = 0;
        while (true) {
            WebElement input = driver.switchTo().activeElement();
            String id = input.getDomAttribute("id");
            if (!id.startsWith("r-")) {
                break;
            }
            double point = Double.parseDouble(input.getDomAttribute("data-point"));
            String cycleText = input.getDomAttribute("data-cycle");
            int cycle = cycleText == null || cycleText.isEmpty() ? 1 : Integer.parseInt(cycleText);
            input.sendKeys(String.format(Locale.ROOT, "%.4f", output(point, cycle)), Keys.ENTER);
            waitUpTo(10).until(ExpectedConditions.textToBe(By.id(id + "-status"), "saved ✓"));
            waitUpTo(10).until(d -> !id.equals(focusedId()));
            typed++;
        }
        assertThat(focusedId()).isEqualTo("save-readings");
        assertThat(typed).isEqualTo(plan.keyed().size());
        screenshot("flow-3-bench-unit-recorded");
        List<Reading> saved = bench.currentReadings(lotId, first);
        assertThat(saved).hasSize(plan.keyed().size());
        assertThat(saved).extracting(Reading::recordedBy).containsOnly("operator");

        // 3. The rest of the sample through the service, as the operator.
        for (String serial : serials.subList(1, serials.size())) {
            List<NewReading> readings = new ArrayList<>();
            for (ExpectedReading slot : plan.keyed()) {
                readings.add(new NewReading(serial, ReadingTest.STATIC, slot.point(), slot.direction().orElse(Direction.UP),
                        slot.cycle().orElse(1), output(slot.point(), slot.cycle().orElse(1)), "mV",
                        plan.suggestedInstrument(), null));
            }
            asOperator(() -> {
                bench.recordConditions(lotId, serial, 23.1, 45.0);
                bench.recordMany(lotId, readings);
            });
        }

        // 4. The engineer sees every unit pass and the lot to be accepted, and dispositions it.
        signIn("engineer", "engineer-demo");
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("start-cards")));
        driver.get(url("/evaluation/lots/" + lotId));
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("units")));
        List<WebElement> verdicts = driver.findElements(By.cssSelector("#units tbody .verdict"));
        assertThat(verdicts).hasSize(8);
        assertThat(verdicts).extracting(WebElement::getText).containsOnly("PASS");
        assertThat(driver.findElement(By.id("lot-result")).getText()).contains("accepted");
        assertThat(driver.findElement(By.id("lot-state")).getText()).isEqualTo("AWAITING_MEASUREMENT");
        screenshot("flow-4-evaluation-complete");
        WebElement disposition = driver.findElement(By.id("disposition"));
        assertThat(disposition.getText()).isEqualTo("Accept the lot");
        disposition.sendKeys(Keys.ENTER);
        waitUpTo(10).until(ExpectedConditions.textToBe(By.id("lot-state"), "DISPOSITIONED_ACCEPTED"));
        screenshot("flow-5-lot-accepted");
        assertThat(receiving.lot(lotId).orElseThrow().state()).isEqualTo(LotState.DISPOSITIONED_ACCEPTED);
        assertThat(driver.findElements(By.id("certificate-link"))).hasSize(1);
    }

    static void asOperator(Runnable work) {
        SecurityContextHolder.getContext().setAuthentication(UsernamePasswordAuthenticationToken.authenticated("operator",
                null, AuthorityUtils.NO_AUTHORITIES));
        try {
            work.run();
        } finally {
            SecurityContextHolder.clearContext();
        }
    }
}
