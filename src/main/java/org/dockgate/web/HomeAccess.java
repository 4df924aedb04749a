package org.dockgate.web;

import java.util.List;
import org.dockgate.platform.FeatureAccess;
import org.dockgate.platform.FeatureAccess.AccessRule;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** The start page: every signed-in role (its list shows only what the roles allow). */
@Configuration
class HomeAccess {

    @Bean
    FeatureAccess homeFeature() {
        return new FeatureAccess("home", List.of(), List.of(AccessRule.reads("/", FeatureAccess.everyone())));
    }
}
