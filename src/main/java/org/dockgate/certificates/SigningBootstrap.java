package org.dockgate.certificates;

import org.springframework.boot.ApplicationArguments;
import org.springframework.boot.ApplicationRunner;
import org.springframework.core.annotation.Order;
import org.springframework.dao.DuplicateKeyException;
import org.springframework.stereotype.Component;

/** On every start, before the demo loads: the lab's signing root exists (created on the first start). */
@Component
@Order(15)
class SigningBootstrap implements ApplicationRunner {

    private final SigningIdentityService identities;

    SigningBootstrap(SigningIdentityService identities) {
        this.identities = identities;
    }

    @Override
    public void run(ApplicationArguments args) {
        try {
            identities.ensureLabRoot();
        } catch (DuplicateKeyException e) {
            // Another instance on the same database recorded the same root at the same moment.
            identities.ensureLabRoot();
        }
    }
}
