package org.dockgate.audit;

import java.util.List;
import java.util.Set;
import org.dockgate.platform.FeatureAccess;
import org.dockgate.platform.FeatureAccess.AccessRule;
import org.dockgate.platform.FeatureAccess.NavItem;
import org.dockgate.platform.Role;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

@Configuration
class AuditAccess {

    @Bean
    FeatureAccess auditFeature() {
        return new FeatureAccess("audit",
                List.of(new NavItem("nav.audit", "nav.audit.description", "/audit", 950,
                        Set.of(Role.AUDITOR, Role.ADMIN))),
                List.of(
                        // Sealing appends to the trail: ADMIN only; AUDITOR reads and checks seals.
                        AccessRule.writes("/audit/seals", Role.ADMIN),
                        AccessRule.any("/audit/**", Role.AUDITOR, Role.ADMIN),
                        AccessRule.any("/api/v1/audit/**", Role.AUDITOR, Role.ADMIN)));
    }
}
