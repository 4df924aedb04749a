package org.dockgate.certificates;

import java.util.List;
import org.dockgate.platform.FeatureAccess;
import org.dockgate.platform.FeatureAccess.AccessRule;
import org.dockgate.platform.Role;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** Who may approve and sign lot certificates (the register's own rules are in {@link CertificatesAccess}). */
@Configuration
class LotCertificateAccess {

    @Bean
    FeatureAccess lotCertificatesFeature() {
        return new FeatureAccess("lot certificates", List.of(),
                List.of(AccessRule.writes("/certificates/lots/**", Role.ENGINEER, Role.SUPERVISOR),
                        AccessRule.writes("/api/v1/lots/*/certificates", Role.ENGINEER, Role.SUPERVISOR)));
    }
}
