package org.dockgate.receiving;

import java.util.List;
import java.util.Set;
import org.dockgate.platform.FeatureAccess;
import org.dockgate.platform.FeatureAccess.AccessRule;
import org.dockgate.platform.FeatureAccess.NavItem;
import org.dockgate.platform.Role;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

@Configuration
class ReceivingAccess {

    @Bean
    FeatureAccess receivingFeature() {
        return new FeatureAccess("receiving",
                List.of(new NavItem("nav.receiving", "nav.receiving.description", "/receiving", 500,
                        Set.of(Role.OPERATOR, Role.ENGINEER, Role.SUPERVISOR, Role.AUDITOR))),
                List.of(AccessRule.reads("/receiving/**", Role.OPERATOR, Role.ENGINEER, Role.SUPERVISOR, Role.AUDITOR),
                        AccessRule.writes("/receiving/switching/**", Role.SUPERVISOR),
                        AccessRule.writes("/receiving/**", Role.OPERATOR, Role.ENGINEER),
                        AccessRule.reads("/api/v1/receipts/**", Role.OPERATOR, Role.ENGINEER, Role.SUPERVISOR, Role.AUDITOR),
                        AccessRule.writes("/api/v1/receipts/**", Role.OPERATOR, Role.ENGINEER),
                        AccessRule.reads("/api/v1/lots/**", Role.OPERATOR, Role.ENGINEER, Role.SUPERVISOR, Role.AUDITOR)));
    }
}
