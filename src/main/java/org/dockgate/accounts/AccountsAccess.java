package org.dockgate.accounts;

import org.dockgate.platform.FeatureAccess;
import org.dockgate.platform.Role;
import java.util.List;
import java.util.Set;
import org.dockgate.platform.FeatureAccess.AccessRule;
import org.dockgate.platform.FeatureAccess.NavItem;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

@Configuration
class AccountsAccess {

    @Bean
    FeatureAccess accountsFeature() {
        return new FeatureAccess("accounts",
                List.of(new NavItem("nav.home", "nav.home.description", "/", 0, Set.of(Role.values())),
                        new NavItem("nav.users", "nav.users.description", "/admin/users", 900, Set.of(Role.ADMIN)),
                        new NavItem("nav.api", "nav.api.description", "/swagger-ui.html", 990, Set.of(Role.values()))),
                List.of(AccessRule.any("/admin/users/**", Role.ADMIN)));
    }
}
