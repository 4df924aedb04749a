package org.dockgate.browser;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.ExpectedConditions;
import org.openqa.selenium.support.ui.Select;

/**
 * An engineer enters a sensor model from its datasheet, derives a procedure, changes a value with a
 * reason; the author cannot approve alone, the second engineer approves; the approved revision prints.
 */
class ProcedureBrowserTest extends BrowserTestSupport {

    private void field(String id, String value) {
        WebElement input = driver.findElement(By.id(id));
        input.clear();
        input.sendKeys(value);
    }

    @Test
    void createDeriveEditAndApprove() throws Exception {
        String part = "BT-" + UUID.randomUUID().toString().substring(0, 6).toUpperCase();
        signIn("engineer", "engineer-demo");
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("start-cards")));
        driver.get(url("/catalogue/new"));
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("model-form")));
        field("partNumber", part);
        field("name", "Browser-test pressure transducer 0 to 10 bar");
        new Select(driver.findElement(By.id("kind"))).selectByValue("PRESSURE_TRANSDUCER");
        driver.findElement(By.cssSelector("input[name=suppliers][value=QSL]")).click();
        field("inputUnit", "bar");
        field("rangeMin", "0");
        field("rangeMax", "10");
        field("outputUnit", "mV");
        field("sensitivityNominal", "10");
        field("sensitivityUnit", "mV/g");          // a unit mismatch first: refused, nothing lost
        field("sensitivityTolerance", "1");
        field("accuracyPctFso", "0.5");
        field("hysteresisPctFso", "0.1");
        driver.findElement(By.id("save-model")).click();
        WebElement problems = waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("form-problems")));
        assertThat(problems.getText()).contains("mV/g").contains("does not fit a pressure transducer");
        assertThat(driver.findElement(By.id("partNumber")).getDomProperty("value")).isEqualTo(part);
        screenshot("catalogue-unit-mismatch");

        field("sensitivityUnit", "mV/bar");
        driver.findElement(By.id("save-model")).click();
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("revisions")));
        assertThat(driver.findElement(By.cssSelector(".notice")).getText()).contains(part + " created");

        driver.findElement(By.id("model-procedures")).click();
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("derive-form")));
        driver.findElement(By.id("derive")).click();
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("acceptance")));
        assertThat(driver.findElement(By.id("static-points")).getText()).contains("10.0 bar");
        assertThat(driver.findElement(By.id("metric-SENSITIVITY")).getText()).contains("RI-PRS-01").contains(":1");
        String draftUrl = driver.getCurrentUrl();

        field("field", "static.settleSeconds");
        field("value", "45");
        field("reason", "Creep seen on the last lot of this family");
        driver.findElement(By.id("apply-edit")).click();
        // The draft page comes back after the redirect: wait for its notice before reading the new page.
        waitUpTo(10).until(ExpectedConditions.textToBePresentInElementLocated(By.tagName("main"),
                "Changed static.settleSeconds"));
        WebElement edits = waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("edits")));
        assertThat(edits.getText()).contains("static.settleSeconds").contains("45").contains("Creep seen");
        screenshot("procedure-draft");

        driver.findElement(By.id("approve")).click();
        waitUpTo(10).until(ExpectedConditions.textToBePresentInElementLocated(By.tagName("main"),
                "You wrote this draft"));
        WebElement refused = waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.cssSelector(".problem")));
        assertThat(refused.getText()).contains("another engineer");

        signIn("engineer2", "engineer2-demo");
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("start-cards")));
        driver.get(draftUrl);
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("approve"))).click();
        WebElement status = waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("revision-status")));
        assertThat(status.getText()).isEqualTo("APPROVED");
        assertThat(driver.findElement(By.id("procedure-pdf")).getDomAttribute("href")).endsWith("/pdf");
        screenshot("procedure-approved");
    }
}
