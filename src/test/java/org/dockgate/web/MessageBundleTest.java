package org.dockgate.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.dockgate.platform.AccessRules;
import org.dockgate.platform.Role;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.context.MessageSource;
import org.springframework.context.NoSuchMessageException;

/** Every message key a template or a navigation entry uses exists in the bundles. */
@SpringBootTest
class MessageBundleTest {

    private static final Pattern KEY = Pattern.compile("#\\{([a-zA-Z0-9_.]+)[}(]");

    @Autowired MessageSource messages;
    @Autowired AccessRules rules;

    @Test
    void everyTemplateKeyHasAText() throws IOException {
        List<String> missing = new ArrayList<>();
        try (Stream<Path> files = Files.walk(Path.of("templates"))) {
            for (Path file : files.filter(f -> f.toString().endsWith(".html")).toList()) {
                Matcher m = KEY.matcher(Files.readString(file, StandardCharsets.UTF_8));
                while (m.find()) {
                    if (!exists(m.group(1))) {
                        missing.add(file + ": " + m.group(1));
                    }
                }
            }
        }
        assertThat(missing).isEmpty();
    }

    @Test
    void everyNavigationEntryHasALabelAndDescription() {
        for (var item : rules.navigationFor(java.util.Set.of(Role.values()))) {
            assertThat(exists(item.labelKey())).as(item.labelKey()).isTrue();
            assertThat(exists(item.descriptionKey())).as(item.descriptionKey()).isTrue();
        }
    }

    @Test
    void aMissingKeyIsDetected() {
        assertThat(exists("no.such.key.anywhere")).isFalse();
    }

    private boolean exists(String key) {
        try {
            messages.getMessage(key, null, Locale.ENGLISH);
            return true;
        } catch (NoSuchMessageException e) {
            return false;
        }
    }
}
