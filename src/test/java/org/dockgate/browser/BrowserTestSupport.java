package org.dockgate.browser;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.openqa.selenium.By;
import org.openqa.selenium.OutputType;
import org.openqa.selenium.TakesScreenshot;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.chrome.ChromeDriver;
import org.openqa.selenium.chrome.ChromeDriverService;
import org.openqa.selenium.chrome.ChromeOptions;
import org.openqa.selenium.support.ui.WebDriverWait;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;

/**
 * Real-browser tests: Debian's headless Chromium driven by Selenium through Debian's chromedriver,
 * against the application on a random port. Never a downloaded browser: the driver path is explicit,
 * so Selenium Manager never goes to the network. Without Chromium the tests are skipped with a hint;
 * with {@code CI=true} a missing browser fails the build.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
abstract class BrowserTestSupport {

    static final Path CHROMIUM = Path.of("/usr/bin/chromium");
    static final Path CHROMEDRIVER = Path.of("/usr/bin/chromedriver");
    static final Path SCREENSHOTS = Path.of("target", "screenshots");

    static WebDriver driver;

    @LocalServerPort
    int port;

    @BeforeAll
    static void startBrowser() throws IOException {
        boolean present = Files.isExecutable(CHROMIUM) && Files.isExecutable(CHROMEDRIVER);
        if (!present) {
            if ("true".equalsIgnoreCase(System.getenv("CI"))) {
                throw new IllegalStateException("CI=true but Chromium is missing: " + CHROMIUM + " and "
                        + CHROMEDRIVER + " must exist (apt-get install chromium chromium-driver).");
            }
            Assumptions.abort("Browser tests skipped: install Debian's chromium and chromium-driver"
                    + " (sudo apt-get install chromium chromium-driver) to run them.");
        }
        System.setProperty("webdriver.chrome.driver", CHROMEDRIVER.toString());
        ChromeOptions options = new ChromeOptions();
        options.setBinary(CHROMIUM.toFile());
        options.addArguments("--headless=new", "--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage",
                "--window-size=1366,900", "--no-first-run", "--disable-background-networking",
                "--disable-component-update", "--disable-sync", "--disable-quic",
                "--user-data-dir=" + Files.createTempDirectory("dockgate-chromium"));
        ChromeDriverService service = new ChromeDriverService.Builder()
                .usingDriverExecutable(CHROMEDRIVER.toFile()).usingAnyFreePort().build();
        driver = new ChromeDriver(service, options);
        driver.manage().timeouts().implicitlyWait(Duration.ofSeconds(2));
        Files.createDirectories(SCREENSHOTS);
    }

    @AfterAll
    static void stopBrowser() {
        if (driver != null) {
            driver.quit();
            driver = null;
        }
    }

    String url(String path) {
        return "http://localhost:" + port + path;
    }

    WebDriverWait waitUpTo(int seconds) {
        return new WebDriverWait(driver, Duration.ofSeconds(seconds));
    }

    void signIn(String username, String password) {
        driver.manage().deleteAllCookies();
        driver.get(url("/login"));
        driver.findElement(By.id("username")).sendKeys(username);
        driver.findElement(By.id("password")).sendKeys(password);
        driver.findElement(By.id("sign-in")).click();
    }

    void screenshot(String name) throws IOException {
        byte[] png = ((TakesScreenshot) driver).getScreenshotAs(OutputType.BYTES);
        Files.write(SCREENSHOTS.resolve(name + ".png"), png);
    }
}
