package org.dockgate.accounts;

import org.dockgate.platform.Role;
import java.time.Instant;
import java.util.Set;

/** A read-only view of an account, for other modules and pages. */
public record Person(long id, String username, String displayName, Set<Role> roles, boolean enabled,
                     Instant createdAt, long version) {

    public Person {
        roles = Set.copyOf(roles);
    }

    public boolean has(Role role) {
        return roles.contains(role);
    }
}
