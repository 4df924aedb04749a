package org.dockgate.demo;

import org.dockgate.certificates.SigningIdentityService;
import org.springframework.core.annotation.Order;
import org.springframework.stereotype.Component;

/**
 * Signing rights for the demo's approvers: the admin grants every ENGINEER and SUPERVISOR of
 * {@code accounts.csv} a certificate from the lab's (demo) CA, so that certificates can be signed in
 * the demo. The keys are demo keys: the key store uses the published demo password.
 */
@Component
@Order(150)
class DemoSigningIdentities implements DemoStep {

    private final SigningIdentityService identities;

    DemoSigningIdentities(SigningIdentityService identities) {
        this.identities = identities;
    }

    @Override
    public String name() {
        return "signing-identities";
    }

    @Override
    public void load(SeedFiles files) {
        for (var row : files.csv("accounts.csv")) {
            String roles = row.get("roles");
            boolean approver = roles.contains("ENGINEER") || roles.contains("SUPERVISOR");
            String username = row.get("username");
            if (approver && identities.activeIdentity(username).isEmpty()) {
                DemoLoader.as("admin", () -> identities.grant(username, "admin"));
            }
        }
    }
}
