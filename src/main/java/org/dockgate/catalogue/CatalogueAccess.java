package org.dockgate.catalogue;

import java.util.List;
import java.util.Set;
import org.dockgate.platform.FeatureAccess;
import org.dockgate.platform.FeatureAccess.AccessRule;
import org.dockgate.platform.FeatureAccess.NavItem;
import org.dockgate.platform.Role;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

@Configuration
class CatalogueAccess {

    @Bean
    FeatureAccess catalogueFeature() {
        return new FeatureAccess("catalogue",
                List.of(new NavItem("nav.catalogue", "nav.catalogue.description", "/catalogue", 300, Set.of(Role.values())),
                        new NavItem("nav.suppliers", "nav.suppliers.description", "/suppliers", 310, Set.of(Role.values()))),
                List.of(AccessRule.reads("/catalogue/**", FeatureAccess.everyone()),
                        AccessRule.writes("/catalogue/**", Role.ENGINEER),
                        AccessRule.reads("/suppliers/**", FeatureAccess.everyone()),
                        AccessRule.writes("/suppliers/**", Role.ENGINEER, Role.SUPERVISOR),
                        AccessRule.reads("/api/v1/sensor-models/**", FeatureAccess.everyone()),
                        AccessRule.writes("/api/v1/sensor-models/**", Role.ENGINEER),
                        AccessRule.reads("/api/v1/suppliers/**", FeatureAccess.everyone()),
                        AccessRule.writes("/api/v1/suppliers/**", Role.ENGINEER, Role.SUPERVISOR)));
    }
}
