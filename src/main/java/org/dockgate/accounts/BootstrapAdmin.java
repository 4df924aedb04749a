package org.dockgate.accounts;

import org.dockgate.platform.Role;
import java.util.Set;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.boot.ApplicationArguments;
import org.springframework.boot.ApplicationRunner;
import org.springframework.core.annotation.Order;
import org.springframework.stereotype.Component;

/**
 * On a database with no accounts at all, creates the first ADMIN from {@code dockgate.bootstrap-admin.*}
 * (in the postgres profile: {@code DOCKGATE_ADMIN_USER} / {@code DOCKGATE_ADMIN_PASSWORD}). Does nothing
 * once any account exists.
 */
@Component
@Order(10)
class BootstrapAdmin implements ApplicationRunner {

    private static final Logger log = LoggerFactory.getLogger(BootstrapAdmin.class);

    private final AccountService accounts;
    private final String username;
    private final String password;

    BootstrapAdmin(AccountService accounts,
                   @Value("${dockgate.bootstrap-admin.username:}") String username,
                   @Value("${dockgate.bootstrap-admin.password:}") String password) {
        this.accounts = accounts;
        this.username = username;
        this.password = password;
    }

    @Override
    public void run(ApplicationArguments args) {
        if (username.isBlank() || accounts.anyExist()) {
            return;
        }
        accounts.create(username, "Administrator", password, Set.of(Role.ADMIN));
        log.info("Created the first administrator account '{}'.", username);
    }
}
