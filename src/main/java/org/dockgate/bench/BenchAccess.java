package org.dockgate.bench;

import java.util.List;
import java.util.Set;
import org.dockgate.platform.FeatureAccess;
import org.dockgate.platform.FeatureAccess.AccessRule;
import org.dockgate.platform.FeatureAccess.NavItem;
import org.dockgate.platform.Role;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** OPERATOR records at the bench (ENGINEER may too); SUPERVISOR and AUDITOR read. */
@Configuration
class BenchAccess {

    static final Role[] READERS = {Role.OPERATOR, Role.ENGINEER, Role.SUPERVISOR, Role.AUDITOR};
    static final Role[] WRITERS = {Role.OPERATOR, Role.ENGINEER};

    @Bean
    FeatureAccess benchFeature() {
        return new FeatureAccess("bench",
                List.of(new NavItem("nav.bench", "nav.bench.description", "/bench", 550, Set.of(Role.OPERATOR))),
                List.of(AccessRule.reads("/bench/**", READERS),
                        AccessRule.writes("/bench/**", WRITERS),
                        AccessRule.writes("/api/v1/lots/*/readings", WRITERS),
                        AccessRule.writes("/api/v1/lots/*/readings:import", WRITERS),
                        AccessRule.writes("/api/v1/lots/*/import-jobs", WRITERS),
                        AccessRule.reads("/api/v1/lots/*/readings", READERS),
                        AccessRule.writes("/api/v1/lots/*/units/*/conditions", WRITERS),
                        AccessRule.reads("/api/v1/lots/*/units/*/conditions", READERS),
                        AccessRule.writes("/api/v1/lots/*/conditions:import", WRITERS),
                        AccessRule.writes("/api/v1/readings/**", WRITERS),
                        AccessRule.reads("/api/v1/readings/**", READERS),
                        AccessRule.reads("/api/v1/import-jobs/**", READERS)));
    }
}
