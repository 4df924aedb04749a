package org.dockgate.accounts;

import org.dockgate.platform.Role;
import java.time.Clock;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Pattern;
import org.dockgate.audit.AuditEvent;
import org.dockgate.audit.AuditEvent.FieldChange;
import org.springframework.context.ApplicationEventPublisher;
import org.springframework.orm.ObjectOptimisticLockingFailureException;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/** The accounts module's face: people, their roles, enabling and disabling. Accounts are never deleted. */
@Service
public class AccountService {

    private static final Pattern USERNAME = Pattern.compile("[a-z0-9][a-z0-9._-]{1,63}");
    static final int MIN_PASSWORD_LENGTH = 8;

    private final UserAccountRepository accounts;
    private final PasswordEncoder passwordEncoder;
    private final ApplicationEventPublisher events;
    private final Clock clock;

    AccountService(UserAccountRepository accounts, PasswordEncoder passwordEncoder,
                   ApplicationEventPublisher events, Clock clock) {
        this.accounts = accounts;
        this.passwordEncoder = passwordEncoder;
        this.events = events;
        this.clock = clock;
    }

    /**
     * Creates an account. Refuses a taken or malformed user name, a short password or no role, with a
     * message fit for the page.
     */
    @Transactional
    public Person create(String username, String displayName, String rawPassword, Set<Role> roles) {
        String name = username == null ? "" : username.trim().toLowerCase();
        if (!USERNAME.matcher(name).matches()) {
            throw new AccountException("username",
                    "A user name is 2 to 64 characters: lower-case letters, digits, dot, dash or underscore.");
        }
        if (accounts.existsByUsername(name)) {
            throw new AccountException("username", "The user name '" + name + "' is already taken.");
        }
        if (displayName == null || displayName.isBlank()) {
            throw new AccountException("displayName", "Enter the person's name as it should appear on records.");
        }
        if (rawPassword == null || rawPassword.length() < MIN_PASSWORD_LENGTH) {
            throw new AccountException("password",
                    "A password needs at least " + MIN_PASSWORD_LENGTH + " characters.");
        }
        if (roles == null || roles.isEmpty()) {
            throw new AccountException("roles", "Choose at least one role.");
        }
        UserAccount account = accounts.save(new UserAccount(name, displayName.trim(),
                passwordEncoder.encode(rawPassword), roles, clock.instant()));
        events.publishEvent(AuditEvent.of("USER", account.getId(), "CREATE", "Account " + name + " created")
                .withChanges(List.of(FieldChange.of("username", null, name),
                        FieldChange.of("displayName", null, account.getDisplayName()),
                        FieldChange.of("roles", null, sorted(roles)),
                        FieldChange.of("enabled", null, true))));
        return account.toPerson();
    }

    /** Enables or disables an account; the expected version guards against a concurrent edit. */
    @Transactional
    public Person setEnabled(long id, boolean enabled, long expectedVersion, String actingUsername) {
        UserAccount account = load(id, expectedVersion);
        if (!enabled && account.getUsername().equals(actingUsername)) {
            throw new AccountException("enabled", "You cannot disable your own account.");
        }
        if (account.isEnabled() == enabled) {
            return account.toPerson();
        }
        account.setEnabled(enabled);
        accounts.flush();
        events.publishEvent(AuditEvent.of("USER", id, enabled ? "ENABLE" : "DISABLE",
                        "Account " + account.getUsername() + (enabled ? " enabled" : " disabled"))
                .withChanges(List.of(FieldChange.of("enabled", !enabled, enabled))));
        return account.toPerson();
    }

    /** Replaces an account's roles; the expected version guards against a concurrent edit. */
    @Transactional
    public Person changeRoles(long id, Set<Role> roles, long expectedVersion, String actingUsername) {
        if (roles == null || roles.isEmpty()) {
            throw new AccountException("roles", "Choose at least one role.");
        }
        UserAccount account = load(id, expectedVersion);
        Set<Role> before = account.getRoles();
        if (account.getUsername().equals(actingUsername) && before.contains(Role.ADMIN)
                && !roles.contains(Role.ADMIN)) {
            throw new AccountException("roles", "You cannot remove your own ADMIN role.");
        }
        if (before.equals(roles)) {
            return account.toPerson();
        }
        account.setRoles(roles);
        accounts.flush();
        events.publishEvent(AuditEvent.of("USER", id, "CHANGE_ROLES", "Roles of " + account.getUsername() + " changed")
                .withChanges(List.of(FieldChange.of("roles", sorted(before), sorted(roles)))));
        return account.toPerson();
    }

    @Transactional(readOnly = true)
    public List<Person> all() {
        return accounts.findAllByOrderByUsernameAsc().stream().map(UserAccount::toPerson).toList();
    }

    @Transactional(readOnly = true)
    public Optional<Person> byUsername(String username) {
        return accounts.findByUsername(username).map(UserAccount::toPerson);
    }

    @Transactional(readOnly = true)
    public Optional<Person> byId(long id) {
        return accounts.findById(id).map(UserAccount::toPerson);
    }

    @Transactional(readOnly = true)
    public boolean anyExist() {
        return accounts.count() > 0;
    }

    /** Checks a password again at a moment that needs it (signing), without changing the session. */
    @Transactional(readOnly = true)
    public boolean passwordMatches(String username, String rawPassword) {
        return rawPassword != null && accounts.findByUsername(username)
                .filter(UserAccount::isEnabled)
                .map(a -> passwordEncoder.matches(rawPassword, a.getPasswordHash()))
                .orElse(false);
    }

    private UserAccount load(long id, long expectedVersion) {
        UserAccount account = accounts.findById(id)
                .orElseThrow(() -> new AccountException(null, "There is no account with id " + id + "."));
        if (account.getVersion() != expectedVersion) {
            throw new ObjectOptimisticLockingFailureException(UserAccount.class, id);
        }
        return account;
    }

    private static String sorted(Set<Role> roles) {
        List<String> names = new ArrayList<>();
        EnumSet.copyOf(roles).forEach(r -> names.add(r.name()));
        return String.join(",", names);
    }
}
