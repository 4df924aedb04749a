package org.dockgate.analysis;

import java.util.List;
import org.dockgate.platform.FeatureAccess;
import org.dockgate.platform.FeatureAccess.AccessRule;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** The calculators change nothing: every signed-in role may use them (GET and POST alike). */
@Configuration
class AnalysisAccess {

    @Bean
    FeatureAccess analysisFeature() {
        return new FeatureAccess("analysis", List.of(),
                List.of(AccessRule.any("/api/v1/analysis/**", FeatureAccess.everyone()),
                        AccessRule.reads("/api/v1/sampling-plan", FeatureAccess.everyone())));
    }
}
