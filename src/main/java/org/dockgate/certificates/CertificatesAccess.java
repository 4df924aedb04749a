package org.dockgate.certificates;

import java.util.List;
import java.util.Set;
import org.dockgate.platform.FeatureAccess;
import org.dockgate.platform.FeatureAccess.AccessRule;
import org.dockgate.platform.FeatureAccess.NavItem;
import org.dockgate.platform.Role;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/**
 * The register is readable by everyone signed in; signing identities are ADMIN's. Verification is
 * public as a page ({@code /verify/**}, permitted by the security configuration, so anyone holding a
 * certificate can check it), and open to every signed-in role through the API.
 */
@Configuration
class CertificatesAccess {

    @Bean
    FeatureAccess certificatesFeature() {
        return new FeatureAccess("certificates",
                List.of(new NavItem("nav.certificates", "nav.certificates.description", "/certificates", 700,
                                Set.of(Role.values())),
                        new NavItem("nav.signing", "nav.signing.description", "/admin/signing", 910,
                                Set.of(Role.ADMIN))),
                List.of(AccessRule.reads("/certificates/**", FeatureAccess.everyone()),
                        AccessRule.any("/admin/signing/**", Role.ADMIN),
                        AccessRule.reads("/api/v1/certificates/**", FeatureAccess.everyone()),
                        AccessRule.writes("/api/v1/certificates/verify", FeatureAccess.everyone())));
    }
}
