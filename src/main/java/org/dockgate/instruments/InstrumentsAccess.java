package org.dockgate.instruments;

import java.util.List;
import java.util.Set;
import org.dockgate.platform.FeatureAccess;
import org.dockgate.platform.FeatureAccess.AccessRule;
import org.dockgate.platform.FeatureAccess.NavItem;
import org.dockgate.platform.Role;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** Everyone reads the register (AUDITOR included); ADMIN adds instruments and records calibrations. */
@Configuration
class InstrumentsAccess {

    @Bean
    FeatureAccess instrumentsFeature() {
        return new FeatureAccess("instruments",
                List.of(new NavItem("nav.instruments", "nav.instruments.description", "/reference-instruments", 400,
                        Set.of(Role.values()))),
                List.of(AccessRule.any("/reference-instruments/new", Role.ADMIN),
                        // Same literal prefix as the read rule below: rules of equal specificity keep
                        // their declared order, so this ADMIN-only form page must come first.
                        AccessRule.reads("/reference-instruments/*/calibrations/new", Role.ADMIN),
                        AccessRule.writes("/reference-instruments/**", Role.ADMIN),
                        AccessRule.reads("/reference-instruments/**", FeatureAccess.everyone()),
                        AccessRule.writes("/api/v1/reference-instruments/**", Role.ADMIN),
                        AccessRule.reads("/api/v1/reference-instruments/**", FeatureAccess.everyone())));
    }
}
