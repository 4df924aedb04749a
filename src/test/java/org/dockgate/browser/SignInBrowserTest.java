package org.dockgate.browser;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.openqa.selenium.By;
import org.openqa.selenium.Keys;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.ExpectedConditions;

/** Each role signs in through the real login page and sees its own navigation; a wrong password is refused. */
class SignInBrowserTest extends BrowserTestSupport {

    @ParameterizedTest(name = "{0} sees its navigation")
    @CsvSource(delimiter = '|', value = {
        "operator   | operator-demo   | Start,API                    | Users,Audit trail",
        "engineer   | engineer-demo   | Start,API                    | Users,Audit trail",
        "supervisor | supervisor-demo | Start,API                    | Users,Audit trail",
        "auditor    | auditor-demo    | Start,Audit trail,API        | Users",
        "admin      | admin-demo      | Start,Users,Audit trail,API  | ''"})
    void eachRoleSeesItsNavigation(String user, String password, String expected, String hidden) throws Exception {
        signIn(user, password);
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("start-cards")));
        List<String> links = driver.findElements(By.cssSelector("nav .nav a")).stream().map(WebElement::getText).toList();
        assertThat(links).contains(expected.split(","));
        if (!hidden.isBlank()) {
            assertThat(links).doesNotContain(hidden.split(","));
        }
        assertThat(driver.findElement(By.cssSelector(".who")).getText()).contains(user);
        screenshot("start-" + user);
        assertThat(Files.size(SCREENSHOTS.resolve("start-" + user + ".png"))).isPositive();
    }

    @Test
    void aWrongPasswordIsRefusedWithoutSayingWhichFieldWasWrong() throws Exception {
        signIn("engineer", "not-the-password");
        WebElement problem = waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.cssSelector(".problem")));
        assertThat(problem.getText()).contains("user name or password is incorrect");
        assertThat(driver.getCurrentUrl()).contains("/login?error");
        screenshot("login-refused");
    }

    @Test
    void signingInWorksFromTheKeyboardAlone() {
        driver.manage().deleteAllCookies();
        driver.get(url("/login"));
        // The user name field has focus on load; Tab moves to the password, Enter submits.
        waitUpTo(10).until(d -> "username".equals(d.switchTo().activeElement().getDomAttribute("id")));
        driver.switchTo().activeElement().sendKeys("auditor");
        driver.switchTo().activeElement().sendKeys(Keys.TAB);
        driver.switchTo().activeElement().sendKeys("auditor-demo", Keys.ENTER);
        waitUpTo(10).until(ExpectedConditions.presenceOfElementLocated(By.id("start-cards")));
        assertThat(driver.findElement(By.cssSelector(".who")).getText()).contains("auditor");
    }
}
