package org.dockgate.browser;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.dockgate.bench.BenchLot;
import org.dockgate.bench.BenchService;
import org.dockgate.bench.Reading;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.Keys;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.ExpectedConditions;
import org.springframework.beans.factory.annotation.Autowired;

/**
 * A technician records a unit of a demo lot from the keyboard alone: the serial typed into the work
 * queue's finder (as a barcode scanner does), the cursor on the first empty reading, each value saved
 * on Enter and the cursor moved on; a reload shows what was saved.
 */
class BenchBrowserTest extends BrowserTestSupport {

    @Autowired BenchService bench;

    @Test
    void aUnitIsRecordedByKeyboardOnly() throws Exception {
        BenchLot lot = bench.lotsAwaitingMeasurement().stream()
                .filter(l -> l.sampledSerials().stream().anyMatch(s -> bench.currentReadings(l.id(), s).isEmpty()))
                .findFirst().orElseThrow(() -> new IllegalStateException("The demo scenario has no lot to measure"));
        String serial = lot.sampledSerials().stream().filter(s -> bench.currentReadings(lot.id(), s).isEmpty())
                .findFirst().orElseThrow();
        signIn("operator", "operator-demo");
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("start-cards")));
        driver.get(url("/bench"));
        // The finder has focus: type the serial as a scanner would, ending with Enter.
        waitUpTo(10).until(d -> "serial".equals(d.switchTo().activeElement().getDomAttribute("id")));
        driver.switchTo().activeElement().sendKeys(serial, Keys.ENTER);
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("readings")));
        screenshot("bench-unit-empty");

        // The cursor lands on the first empty reading; Enter saves it and moves on.
        waitUpTo(10).until(d -> "r-0".equals(d.switchTo().activeElement().getDomAttribute("id")));
        String[] values = {"0.42", "501.3", "1002.5"};
        for (int i = 0; i < values.length; i++) {
            String id = "r-" + i;
            WebElement input = driver.switchTo().activeElement();
            assertThat(input.getDomAttribute("id")).isEqualTo(id);
            input.sendKeys(values[i], Keys.ENTER);
            waitUpTo(10).until(ExpectedConditions.textToBe(By.id(id + "-status"), "saved ✓"));
            String next = "r-" + (i + 1);
            waitUpTo(10).until(d -> next.equals(d.switchTo().activeElement().getDomAttribute("id")));
        }
        screenshot("bench-unit-three-saved");

        List<Reading> saved = bench.currentReadings(lot.id(), serial);
        assertThat(saved).extracting(Reading::slot).containsExactly(0, 1, 2);
        assertThat(saved).extracting(Reading::recordedBy).containsOnly("operator");
        assertThat(saved.get(1).enteredValue()).isEqualTo(501.3);

        // A closed tab loses nothing: the reloaded page shows the saved values and starts at the next empty one.
        driver.navigate().refresh();
        waitUpTo(10).until(d -> "r-3".equals(d.switchTo().activeElement().getDomAttribute("id")));
        assertThat(driver.findElement(By.id("history")).getText()).contains("501.3");
    }
}
