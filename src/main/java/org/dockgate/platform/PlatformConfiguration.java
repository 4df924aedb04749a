package org.dockgate.platform;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.time.Clock;
import java.util.Arrays;
import java.util.TreeSet;
import org.springframework.context.MessageSource;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.context.support.ReloadableResourceBundleMessageSource;
import org.springframework.core.io.Resource;
import org.springframework.core.io.support.PathMatchingResourcePatternResolver;

@Configuration
@org.springframework.scheduling.annotation.EnableScheduling
class PlatformConfiguration {

    /** The one clock of the application: UTC, replaceable in tests. */
    @Bean
    Clock clock() {
        return Clock.systemUTC();
    }

    /**
     * Every {@code messages/*.properties} bundle on the classpath (one per module, e.g.
     * {@code messages/catalogue.properties}), so modules add their texts without editing a shared file.
     */
    @Bean
    MessageSource messageSource() {
        try {
            Resource[] found = new PathMatchingResourcePatternResolver().getResources("classpath*:messages/*.properties");
            TreeSet<String> basenames = new TreeSet<>();
            Arrays.stream(found).map(Resource::getFilename)
                    .filter(name -> name != null && !name.contains("_"))
                    .forEach(name -> basenames.add("classpath:messages/" + name.substring(0, name.length() - ".properties".length())));
            ReloadableResourceBundleMessageSource source = new ReloadableResourceBundleMessageSource();
            source.setBasenames(basenames.toArray(String[]::new));
            source.setDefaultEncoding(StandardCharsets.UTF_8.name());
            source.setFallbackToSystemLocale(false);
            source.setUseCodeAsDefaultMessage(false);
            return source;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
