package org.dockgate.accounts;

import org.dockgate.audit.ActorDirectory;
import org.springframework.stereotype.Component;

@Component
class AccountActorDirectory implements ActorDirectory {

    private final UserAccountRepository accounts;

    AccountActorDirectory(UserAccountRepository accounts) {
        this.accounts = accounts;
    }

    @Override
    public String displayName(String userId) {
        return accounts.findByUsername(userId).map(UserAccount::getDisplayName).orElse(userId);
    }
}
