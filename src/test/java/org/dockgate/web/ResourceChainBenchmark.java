package org.dockgate.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.dockgate.DockgateApplication;
import org.junit.jupiter.api.Test;
import org.springframework.boot.builder.SpringApplicationBuilder;
import org.springframework.boot.web.server.context.WebServerApplicationContext;
import org.springframework.context.ConfigurableApplicationContext;

/**
 * Page against static-file latency, with Spring's resource chain on (what springdoc's webjars-locator-lite
 * switched on: every {@code @{…}} link of a page resolved against the classpath by ResourceUrlEncodingFilter)
 * and off (Dockgate's setting). Two applications in one JVM, each on its own in-memory H2, measured in
 * interleaved rounds (on, off, off, on, …) so a drift of the machine hits both alike. Prints ratios; asserts
 * only that the work happened (status 200, the page's own content). Not named {@code *Test}: run it alone,
 *
 * <pre>mvn -o test -Dtest=ResourceChainBenchmark -Dsurefire.failIfNoSpecifiedTests=false</pre>
 *
 * Sizes: {@code -Dbenchmark.ops=300} requests per kind per round, {@code -Dbenchmark.rounds=4}.
 */
class ResourceChainBenchmark {

    static final int OPS = Integer.getInteger("benchmark.ops", 300);
    static final int ROUNDS = Integer.getInteger("benchmark.rounds", 4);
    static final String PAGE = System.getProperty("benchmark.page", "/catalogue");
    static final String STATIC = "/css/dockgate.css";

    private final HttpClient http = HttpClient.newBuilder().followRedirects(HttpClient.Redirect.NEVER).build();
    private final ThreadMXBean threads = ManagementFactory.getThreadMXBean();

    record App(String name, ConfigurableApplicationContext context, int port, String cookie) {
    }

    /** Median wall µs and median request-thread CPU µs per request, per round. */
    record Figures(List<Double> wallMicros, List<Double> cpuMicros) {
        double wall() {
            return median(wallMicros);
        }

        double cpu() {
            return median(cpuMicros);
        }
    }

    @Test
    void pageAgainstStaticFile() throws Exception {
        App on = start("chain on (before)", true);
        App off = start("chain off (now)", false);
        try {
            assertThat(on.context().getBeanNamesForType(
                    org.springframework.web.servlet.resource.ResourceUrlEncodingFilter.class).length
                    + on.context().getBeansOfType(org.springframework.boot.web.servlet.FilterRegistrationBean.class)
                    .values().stream().filter(r -> r.getFilter()
                            instanceof org.springframework.web.servlet.resource.ResourceUrlEncodingFilter).count())
                    .as("the 'before' application has the encoding filter").isPositive();
            // Warm-up: JIT and caches, not measured.
            for (App app : List.of(on, off)) {
                run(app, PAGE, OPS);
                run(app, STATIC, OPS);
            }
            List<double[]> onPage = new ArrayList<>(), onStatic = new ArrayList<>();
            List<double[]> offPage = new ArrayList<>(), offStatic = new ArrayList<>();
            for (int round = 0; round < ROUNDS; round++) {
                List<App> order = round % 2 == 0 ? List.of(on, off) : List.of(off, on);
                for (App app : order) {
                    boolean isOn = app == on;
                    (isOn ? onPage : offPage).add(run(app, PAGE, OPS));
                    (isOn ? onStatic : offStatic).add(run(app, STATIC, OPS));
                }
            }
            Figures fOnPage = figures(onPage), fOnStatic = figures(onStatic);
            Figures fOffPage = figures(offPage), fOffStatic = figures(offStatic);
            StringBuilder out = new StringBuilder();
            out.append(String.format(Locale.ROOT, "%nResource chain benchmark: %d requests per kind per round, %d rounds,"
                    + " page %s, static file %s%n%n", OPS, ROUNDS, PAGE, STATIC));
            out.append("| application | request | median wall µs (rounds) | median request-thread CPU µs (rounds) |\n");
            out.append("|---|---|---|---|\n");
            row(out, on.name(), "page", fOnPage);
            row(out, on.name(), "static file", fOnStatic);
            row(out, off.name(), "page", fOffPage);
            row(out, off.name(), "static file", fOffStatic);
            out.append(String.format(Locale.ROOT, "%nPage / static file, chain on: wall %.1f, CPU %.1f%n",
                    fOnPage.wall() / fOnStatic.wall(), fOnPage.cpu() / fOnStatic.cpu()));
            out.append(String.format(Locale.ROOT, "Page / static file, chain off: wall %.1f, CPU %.1f%n",
                    fOffPage.wall() / fOffStatic.wall(), fOffPage.cpu() / fOffStatic.cpu()));
            out.append(String.format(Locale.ROOT, "Page, chain off / chain on: wall %.2f, CPU %.2f%n",
                    fOffPage.wall() / fOnPage.wall(), fOffPage.cpu() / fOnPage.cpu()));
            System.out.println(out);
            Path file = Path.of("target", "benchmarks", "resource-chain.md");
            Files.createDirectories(file.getParent());
            Files.writeString(file, out.toString());
        } finally {
            on.context().close();
            off.context().close();
        }
    }

    private static void row(StringBuilder out, String app, String kind, Figures f) {
        out.append(String.format(Locale.ROOT, "| %s | %s | %.0f (%s) | %.0f (%s) |%n", app, kind, f.wall(),
                list(f.wallMicros()), f.cpu(), list(f.cpuMicros())));
    }

    private static String list(List<Double> values) {
        return String.join(", ", values.stream().map(v -> String.format(Locale.ROOT, "%.0f", v)).toList());
    }

    private static Figures figures(List<double[]> rounds) {
        return new Figures(rounds.stream().map(r -> r[0]).toList(), rounds.stream().map(r -> r[1]).toList());
    }

    static double median(List<Double> values) {
        double[] v = values.stream().mapToDouble(Double::doubleValue).sorted().toArray();
        return v.length % 2 == 1 ? v[v.length / 2] : (v[v.length / 2 - 1] + v[v.length / 2]) / 2;
    }

    /** {wall µs per request, request-thread CPU µs per request} over {@code n} sequential requests. */
    private double[] run(App app, String path, int n) throws Exception {
        HttpRequest request = HttpRequest.newBuilder(URI.create("http://localhost:" + app.port() + path))
                .header("Accept", "text/html").header("Cookie", app.cookie()).build();
        long cpu0 = requestThreadCpu(app.port());
        long t0 = System.nanoTime();
        for (int i = 0; i < n; i++) {
            HttpResponse<String> response = http.send(request, HttpResponse.BodyHandlers.ofString());
            if (response.statusCode() != 200) {
                throw new AssertionError(path + " answered " + response.statusCode());
            }
            if (path.equals(PAGE) && !response.body().contains("/css/dockgate.css")) {
                throw new AssertionError(path + " did not render the layout");
            }
        }
        long wall = System.nanoTime() - t0;
        long cpu = requestThreadCpu(app.port()) - cpu0;
        if (cpu <= 0) {
            throw new AssertionError("no request-thread CPU measured: are Tomcat's threads named http-nio-PORT-exec-N?");
        }
        return new double[] {wall / 1e3 / n, cpu / 1e3 / n};
    }

    /** CPU time of the Tomcat request threads of the application on this port (named http-nio-PORT-exec-N). */
    private long requestThreadCpu(int port) {
        String prefix = "http-nio-" + port + "-exec-";
        long total = 0;
        for (Thread t : Thread.getAllStackTraces().keySet()) {
            if (t.getName().startsWith(prefix)) {
                long c = threads.getThreadCpuTime(t.getId());
                if (c > 0) {
                    total += c;
                }
            }
        }
        return total;
    }

    private App start(String name, boolean chain) throws Exception {
        String profiles = System.getProperty("spring.profiles.active", "test,h2mem");
        assertThat(profiles).as("runs only on the in-memory H2").contains("h2mem");
        ConfigurableApplicationContext context = new SpringApplicationBuilder(DockgateApplication.class)
                .profiles(profiles.split(","))
                // Command-line arguments: above application.properties (builder properties are only defaults).
                .run("--server.port=" + freePort(), "--spring.web.resources.chain.enabled=" + chain, "--spring.jmx.enabled=false");
        int port = ((WebServerApplicationContext) context).getWebServer().getPort();
        return new App(name, context, port, signIn(port));
    }

    /** A fixed free port, so the request threads are named after it (port 0 names them "auto-N"). */
    private static int freePort() throws java.io.IOException {
        try (java.net.ServerSocket socket = new java.net.ServerSocket(0)) {
            return socket.getLocalPort();
        }
    }

    private String signIn(int port) throws Exception {
        HttpResponse<String> page = http.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/login"))
                .header("Accept", "text/html").build(), HttpResponse.BodyHandlers.ofString());
        String cookie = page.headers().firstValue("Set-Cookie").orElseThrow().split(";")[0];
        String token = page.body().replaceAll("(?s).*name=\"_csrf\" value=\"([^\"]+)\".*", "$1");
        HttpResponse<String> login = http.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/login"))
                .header("Content-Type", "application/x-www-form-urlencoded").header("Cookie", cookie)
                .POST(HttpRequest.BodyPublishers.ofString("username=engineer&password=engineer-demo&_csrf=" + token))
                .build(), HttpResponse.BodyHandlers.ofString());
        assertThat(login.statusCode()).isEqualTo(302);
        assertThat(login.headers().firstValue("Location").orElse("")).doesNotContain("error");
        return login.headers().firstValue("Set-Cookie").map(c -> c.split(";")[0]).orElse(cookie);
    }

    @SuppressWarnings("unused")
    private static String joined(double[] v) {
        return Arrays.toString(v);
    }
}
