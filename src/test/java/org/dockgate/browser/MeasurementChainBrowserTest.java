package org.dockgate.browser;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.dockgate.bench.BenchLot;
import org.dockgate.bench.BenchPlan;
import org.dockgate.bench.BenchService;
import org.dockgate.bench.Reading;
import org.dockgate.bench.ReadingTest;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.Keys;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.ExpectedConditions;
import org.springframework.beans.factory.annotation.Autowired;

/**
 * The applied value and the readout entered from the keyboard on the bench page (issue 11, items 3 and 4): the
 * readout chosen by typing its identifier into its list, Shift+Tab from the first reading back to its applied
 * value, the applied value typed with Enter (which moves on to the reading), the reading typed with Enter.
 */
class MeasurementChainBrowserTest extends BrowserTestSupport {

    @Autowired BenchService bench;

    @Test
    void anAppliedValueAndTheReadoutAreEnteredFromTheKeyboard() throws Exception {
        BenchLot lot = bench.lotsAwaitingMeasurement().stream()
                .filter(l -> bench.planFor(l).expected(0).test() == ReadingTest.STATIC)
                .filter(l -> l.sampledSerials().stream().anyMatch(s -> bench.currentReadings(l.id(), s).isEmpty()))
                .findFirst().orElseThrow(() -> new IllegalStateException("The demo scenario has no lot to measure"));
        String serial = lot.sampledSerials().stream().filter(s -> bench.currentReadings(lot.id(), s).isEmpty())
                .reduce((a, b) -> b).orElseThrow();
        BenchPlan plan = bench.planFor(lot);
        double setPoint = plan.expected(0).point();
        double applied = Math.round((setPoint + plan.appliedWindow() / 4) * 1e4) / 1e4;

        signIn("operator", "operator-demo");
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("start-cards")));
        driver.get(url("/bench"));
        waitUpTo(10).until(d -> "serial".equals(d.switchTo().activeElement().getDomAttribute("id")));
        driver.switchTo().activeElement().sendKeys(serial, Keys.ENTER);
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("readings")));
        waitUpTo(10).until(d -> "r-0".equals(d.switchTo().activeElement().getDomAttribute("id")));

        // Typing into the focused list picks the readout, as a keyboard user does.
        WebElement readout = driver.findElement(By.id("readout"));
        readout.sendKeys("RI-DMM-02");
        waitUpTo(10).until(d -> "RI-DMM-02".equals(d.findElement(By.id("readout")).getDomProperty("value")));

        driver.findElement(By.id("r-0")).sendKeys(Keys.chord(Keys.SHIFT, Keys.TAB));
        WebElement appliedField = driver.switchTo().activeElement();
        assertThat(appliedField.getDomAttribute("id")).isEqualTo("a-0");
        appliedField.sendKeys(Double.toString(applied), Keys.ENTER);
        waitUpTo(10).until(d -> "r-0".equals(d.switchTo().activeElement().getDomAttribute("id")));
        driver.switchTo().activeElement().sendKeys("1.5", Keys.ENTER);
        waitUpTo(10).until(ExpectedConditions.textToBe(By.id("r-0-status"), "saved ✓"));
        screenshot("bench-unit-applied-readout");

        List<Reading> saved = bench.currentReadings(lot.id(), serial);
        assertThat(saved).hasSize(1);
        assertThat(saved.get(0).point()).isEqualTo(setPoint);
        assertThat(saved.get(0).applied()).isEqualTo(applied);
        assertThat(saved.get(0).readout()).contains("RI-DMM-02");
    }
}
