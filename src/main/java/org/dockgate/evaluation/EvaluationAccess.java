package org.dockgate.evaluation;

import java.util.List;
import java.util.Set;
import org.dockgate.platform.FeatureAccess;
import org.dockgate.platform.FeatureAccess.AccessRule;
import org.dockgate.platform.FeatureAccess.NavItem;
import org.dockgate.platform.Role;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

@Configuration
class EvaluationAccess {

    @Bean
    FeatureAccess evaluationFeature() {
        return new FeatureAccess("evaluation",
                List.of(new NavItem("nav.evaluation", "nav.evaluation.description", "/evaluation", 600,
                        Set.of(Role.ENGINEER, Role.SUPERVISOR, Role.AUDITOR, Role.OPERATOR))),
                List.of(AccessRule.reads("/evaluation/**", FeatureAccess.everyone()),
                        AccessRule.writes("/evaluation/lots/*/concession", Role.SUPERVISOR),
                        AccessRule.writes("/evaluation/**", Role.ENGINEER),
                        AccessRule.reads("/api/v1/lots/*/evaluation", FeatureAccess.everyone()),
                        AccessRule.reads("/api/v1/lots/*/evaluation/recheck", FeatureAccess.everyone()),
                        AccessRule.writes("/api/v1/lots/*/disposition", Role.ENGINEER),
                        AccessRule.writes("/api/v1/lots/*/concession", Role.SUPERVISOR)));
    }
}
