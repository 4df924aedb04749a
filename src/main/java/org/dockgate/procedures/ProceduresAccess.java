package org.dockgate.procedures;

import java.util.List;
import java.util.Set;
import org.dockgate.platform.FeatureAccess;
import org.dockgate.platform.FeatureAccess.AccessRule;
import org.dockgate.platform.FeatureAccess.NavItem;
import org.dockgate.platform.Role;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

@Configuration
class ProceduresAccess {

    @Bean
    FeatureAccess proceduresFeature() {
        return new FeatureAccess("procedures",
                List.of(new NavItem("nav.procedures", "nav.procedures.description", "/procedures", 350, Set.of(Role.values()))),
                List.of(AccessRule.reads("/procedures/**", FeatureAccess.everyone()),
                        AccessRule.writes("/procedures/drafts/*/approve", Role.ENGINEER, Role.SUPERVISOR),
                        AccessRule.writes("/procedures/**", Role.ENGINEER),
                        AccessRule.reads("/api/v1/procedures/**", FeatureAccess.everyone()),
                        AccessRule.writes("/api/v1/procedures/derive", FeatureAccess.everyone()),
                        AccessRule.writes("/api/v1/procedures/**", Role.ENGINEER)));
    }
}
