package org.dockgate.browser;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.Keys;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.ExpectedConditions;

/**
 * The register in a real browser: the admin adds an instrument from the keyboard alone and finds it in
 * the list; the demo's expired instrument is flagged; a value that is not a number is shown beside its
 * field with what was typed. The instrument made here is already expired, so on a shared database no
 * other test finds it qualifying.
 */
class InstrumentsBrowserTest extends BrowserTestSupport {

    @Test
    void adminAddsAnInstrumentByKeyboardAndSeesItListedBesideTheExpiredOne() throws Exception {
        String id = "RI-TBR-" + UUID.randomUUID().toString().substring(0, 6).toUpperCase();
        LocalDate today = LocalDate.now(ZoneOffset.UTC);
        signIn("admin", "admin-demo");
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("start-cards")));
        driver.findElement(By.linkText("Reference instruments")).click();
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("instruments")));
        driver.findElement(By.id("new-instrument")).sendKeys(Keys.ENTER);
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("new-instrument-form")));

        // The identifier field has focus on load; Tab walks the fields in order, Enter submits.
        assertThat(driver.switchTo().activeElement().getAttribute("id")).isEqualTo("identifier");
        type(id, Keys.TAB);
        type("Browser test pressure controller", Keys.TAB);
        type("pressure", Keys.TAB);               // type-ahead in the quantity list
        type("0", Keys.TAB);
        type("10", Keys.TAB);
        type("bar", Keys.TAB);
        type("CERT-" + id, Keys.TAB);
        type(today.minusDays(400).toString(), Keys.TAB);
        type(today.minusDays(3).toString(), Keys.TAB);
        type("0.02", Keys.TAB);                   // U; "% of reading" is preselected
        assertThat(driver.switchTo().activeElement().getAttribute("id")).isEqualTo("uncertaintyMode");
        type("", Keys.TAB);
        assertThat(driver.switchTo().activeElement().getAttribute("id")).isEqualTo("coverageFactor");
        type("", Keys.ENTER);                     // k = 2 is preset

        waitUpTo(10).until(ExpectedConditions.urlContains("/reference-instruments/" + id));
        assertThat(driver.findElement(By.cssSelector(".notice")).getText()).contains(id + " added to the register");
        assertThat(driver.findElement(By.id("expired-warning")).getText())
                .contains("Out of calibration since " + today.minusDays(3));
        screenshot("instrument-detail");

        driver.findElement(By.linkText("All reference instruments")).click();
        WebElement row = waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("instrument-" + id)));
        assertThat(row.getText()).contains("Browser test pressure controller").contains("0 … 10 bar")
                .contains("Expired since " + today.minusDays(3));
        WebElement expired = driver.findElement(By.id("instrument-RI-PRS-02"));
        assertThat(expired.findElement(By.cssSelector(".badge")).getText())
                .isEqualTo("Expired since " + today.minusDays(15));
        assertThat(expired.getAttribute("class")).contains("expired");
        assertThat(driver.findElement(By.id("instrument-RI-ACC-01")).findElement(By.cssSelector(".badge")).getText())
                .isEqualTo("Due in 20 days");
        screenshot("instrument-list");
    }

    @Test
    void aValueThatIsNotANumberIsShownBesideItsFieldWithWhatWasTyped() throws Exception {
        signIn("admin", "admin-demo");
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("start-cards")));
        driver.get(url("/reference-instruments/new"));
        driver.findElement(By.id("identifier")).sendKeys("RI-TBR-BAD");
        driver.findElement(By.id("rangeMax")).sendKeys("ten");
        driver.findElement(By.id("description")).sendKeys("Never saved", Keys.ENTER);
        WebElement error = waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("rangeMax-error")));
        assertThat(error.getText()).contains("'ten' is not a number");
        assertThat(driver.switchTo().activeElement().getAttribute("id")).as("focus on the first field to correct")
                .isEqualTo("rangeMin");
        assertThat(driver.findElement(By.id("rangeMax")).getAttribute("value")).isEqualTo("ten");
        assertThat(driver.findElement(By.id("rangeMax")).getAttribute("aria-invalid")).isEqualTo("true");
        assertThat(driver.findElement(By.id("description")).getAttribute("value")).isEqualTo("Never saved");
        screenshot("instrument-form-errors");
    }

    private void type(String text, Keys then) {
        driver.switchTo().activeElement().sendKeys(text, then);
    }
}
