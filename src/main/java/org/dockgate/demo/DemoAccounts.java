package org.dockgate.demo;

import java.util.Arrays;
import java.util.EnumSet;
import java.util.Set;
import org.dockgate.accounts.AccountService;
import org.dockgate.platform.Role;
import org.springframework.core.annotation.Order;
import org.springframework.stereotype.Component;

/** The demo accounts, one per role (and a second engineer and operator for separation of duties). */
@Component
@Order(100)
class DemoAccounts implements DemoStep {

    private final AccountService accounts;

    DemoAccounts(AccountService accounts) {
        this.accounts = accounts;
    }

    @Override
    public String name() {
        return "accounts";
    }

    @Override
    public void load(SeedFiles files) {
        for (var row : files.csv("accounts.csv")) {
            if (accounts.byUsername(row.get("username")).isPresent()) {
                continue;
            }
            Set<Role> roles = EnumSet.noneOf(Role.class);
            Arrays.stream(row.get("roles").split(";")).map(String::trim).map(Role::valueOf).forEach(roles::add);
            accounts.create(row.get("username"), row.get("displayName"), row.get("password"), roles);
        }
    }
}
