package org.dockgate.browser;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import org.dockgate.bench.BenchService;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.certificates.CertificateRegister;
import org.dockgate.certificates.IssuedCertificate;
import org.dockgate.certificates.LotCertificateService;
import org.dockgate.certificates.LotFixtures;
import org.dockgate.evaluation.EvaluationService;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.ReceivingService;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.Cookie;
import org.openqa.selenium.Keys;
import org.openqa.selenium.support.ui.ExpectedConditions;
import org.springframework.beans.factory.annotation.Autowired;

/**
 * An engineer approves and signs a freshly dispositioned lot from the browser (password re-entered, Enter
 * submits), lands on the register entry, downloads the signed PDF with the page's own session, and has it
 * checked by the public verification page through a real file upload.
 */
class CertificateBrowserTest extends BrowserTestSupport {

    @Autowired ReceivingService receiving;
    @Autowired CatalogueService catalogue;
    @Autowired BenchService bench;
    @Autowired EvaluationService evaluation;
    @Autowired LotCertificateService certificates;
    @Autowired CertificateRegister register;

    @Test
    void anEngineerSignsALotDownloadsThePdfAndTheVerifyPageCallsItValid() throws Exception {
        // Readings by operator, disposition by engineer: engineer2 is free to approve (separation of duties).
        LotView lot = LotFixtures.acceptedLot(receiving, catalogue, bench, evaluation, "operator");

        signIn("engineer2", "engineer2-demo"); // seed-data/accounts.csv
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("start-cards")));
        driver.get(url("/certificates/lots/" + lot.id()));
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("sign-form")));
        assertThat(driver.findElement(By.id("signature-meaning")).getText()).contains("Approved for release");
        // autofocus is on the password: type into the focused field and submit with Enter.
        waitUpTo(10).until(d -> "password".equals(d.switchTo().activeElement().getDomAttribute("id")));
        driver.switchTo().activeElement().sendKeys("engineer2-demo");
        screenshot("certificate-before-signing");
        driver.switchTo().activeElement().sendKeys(Keys.ENTER);

        waitUpTo(30).until(ExpectedConditions.urlMatches(".*/certificates/DG-\\d{4}-\\d{6}$"));
        String number = driver.getCurrentUrl().substring(driver.getCurrentUrl().lastIndexOf('/') + 1);
        IssuedCertificate issued = register.find(number).orElseThrow();
        assertThat(issued.lotId()).isEqualTo(lot.id());
        assertThat(issued.signerUsername()).isEqualTo("engineer2");
        assertThat(driver.findElement(By.tagName("body")).getText()).contains(number).contains(issued.pdfSha256());
        screenshot("certificate-register-entry");

        // Download the PDF through the entry's link, with the browser's own session cookie.
        String href = driver.findElement(By.id("download-pdf")).getDomProperty("href");
        Cookie session = driver.manage().getCookieNamed("JSESSIONID");
        assertThat(session).as("the browser's session cookie").isNotNull();
        HttpResponse<byte[]> response = HttpClient.newHttpClient().send(HttpRequest.newBuilder(URI.create(href))
                .header("Cookie", "JSESSIONID=" + session.getValue()).GET().build(), HttpResponse.BodyHandlers.ofByteArray());
        assertThat(response.statusCode()).isEqualTo(200);
        assertThat(response.headers().firstValue("Content-Type")).hasValueSatisfying(t -> assertThat(t).startsWith("application/pdf"));
        byte[] pdf = response.body();
        assertThat(pdf).isEqualTo(register.pdf(number).orElseThrow());
        Path folder = Files.createTempDirectory("dockgate-download");
        Path file = folder.resolve(number + ".pdf");
        Files.write(file, pdf);

        try {
            driver.get(url("/verify"));
            driver.findElement(By.id("file")).sendKeys(file.toAbsolutePath().toString());
            driver.findElement(By.cssSelector("#verify-form button[type=submit]")).click();
            waitUpTo(30).until(ExpectedConditions.presenceOfElementLocated(By.id("verification")));
            String verdict = driver.findElement(By.id("verification")).getText();
            screenshot("certificate-verified");
            assertThat(verdict).contains("Valid").doesNotContain("Not valid").contains(number)
                    .contains("File: " + number + ".pdf");
            assertThat(driver.findElements(By.cssSelector("#verification-checks li.fail"))).isEmpty();
        } finally {
            Files.deleteIfExists(file);
            Files.deleteIfExists(folder);
        }
    }
}
