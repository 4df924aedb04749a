package org.dockgate.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.boot.web.servlet.FilterRegistrationBean;
import org.springframework.context.ApplicationContext;
import org.springframework.core.env.Environment;
import org.springframework.web.servlet.resource.ResourceUrlEncodingFilter;

/**
 * Springdoc's UI brings webjars-locator-lite, which would switch Spring's resource chain on: then
 * ResourceUrlEncodingFilter resolves every {@code @{…}} link of every page against the classpath, uncached.
 * The chain is switched off; swagger UI and the static files must still be served.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
class ResourceChainTest {

    @LocalServerPort int port;
    @Autowired ApplicationContext context;
    @Autowired Environment environment;

    private final HttpClient http = HttpClient.newBuilder().followRedirects(HttpClient.Redirect.NEVER).build();

    private HttpResponse<String> get(String path) throws Exception {
        return http.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path)).build(),
                HttpResponse.BodyHandlers.ofString());
    }

    @Test
    void noPageLinkGoesThroughTheResourceChain() {
        assertThat(context.getBeansOfType(ResourceUrlEncodingFilter.class)).isEmpty();
        @SuppressWarnings("rawtypes")
        Map<String, FilterRegistrationBean> registrations = context.getBeansOfType(FilterRegistrationBean.class);
        assertThat(registrations.values()).noneMatch(r -> r.getFilter() instanceof ResourceUrlEncodingFilter);
        assertThat(environment.getProperty("spring.web.resources.chain.enabled")).isEqualTo("false");
    }

    @Test
    void swaggerUiAndStaticFilesAreStillServed() throws Exception {
        HttpResponse<String> ui = get("/swagger-ui/index.html");
        assertThat(ui.statusCode()).isEqualTo(200);
        assertThat(ui.body()).contains("swagger-ui");
        HttpResponse<String> initializer = get("/swagger-ui/swagger-initializer.js");
        assertThat(initializer.statusCode()).isEqualTo(200);
        assertThat(initializer.body()).contains("/v3/api-docs");
        assertThat(get("/swagger-ui/swagger-ui-bundle.js").statusCode()).isEqualTo(200);
        assertThat(get("/swagger-ui.html").statusCode()).isIn(200, 302);
        HttpResponse<String> css = get("/css/dockgate.css");
        assertThat(css.statusCode()).isEqualTo(200);
        assertThat(css.headers().firstValue("Content-Type").orElse("")).startsWith("text/css");
        assertThat(get("/js/bench.js").statusCode()).isEqualTo(200);
        HttpResponse<String> login = get("/login");
        assertThat(login.statusCode()).isEqualTo(200);
        assertThat(login.body()).contains("/css/dockgate.css");
    }
}
