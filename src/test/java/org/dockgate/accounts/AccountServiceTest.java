package org.dockgate.accounts;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.Set;
import org.dockgate.audit.AuditReader;
import org.dockgate.platform.Role;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.dao.OptimisticLockingFailureException;
import org.springframework.security.crypto.password.PasswordEncoder;

@SpringBootTest
class AccountServiceTest {

    @Autowired AccountService accounts;
    @Autowired AuditReader audit;
    @Autowired PasswordEncoder encoder;

    @Test
    void createdAccountsAreAuditedAndPasswordsAreHashedWithTheirScheme() {
        Person p = accounts.create("acct.create", "Ana Create", "correct-horse", Set.of(Role.OPERATOR));
        assertThat(audit.history("USER", String.valueOf(p.id())))
                .singleElement().satisfies(e -> {
                    assertThat(e.action()).isEqualTo("CREATE");
                    assertThat(e.changes()).contains("acct.create").contains("OPERATOR");
                    assertThat(e.changes()).doesNotContain("correct-horse");
                });
        assertThat(accounts.passwordMatches("acct.create", "correct-horse")).isTrue();
        assertThat(accounts.passwordMatches("acct.create", "wrong")).isFalse();
        // Spring Security's delegating encoder prefixes the scheme, e.g. {bcrypt}
        assertThat(encoder.encode("x")).startsWith("{");
    }

    @Test
    void refusesTakenNamesShortPasswordsAndNoRole() {
        accounts.create("acct.taken", "Taken", "long-enough", Set.of(Role.OPERATOR));
        assertThatThrownBy(() -> accounts.create("acct.taken", "Again", "long-enough", Set.of(Role.OPERATOR)))
                .isInstanceOf(AccountException.class).hasMessageContaining("already taken");
        assertThatThrownBy(() -> accounts.create("acct.short", "Short", "short", Set.of(Role.OPERATOR)))
                .hasMessageContaining("at least 8");
        assertThatThrownBy(() -> accounts.create("acct.norole", "None", "long-enough", Set.of()))
                .hasMessageContaining("at least one role");
        assertThatThrownBy(() -> accounts.create("Bad Name!", "Bad", "long-enough", Set.of(Role.OPERATOR)))
                .hasMessageContaining("user name");
    }

    @Test
    void disablingIsRecordedAndStopsPasswordChecks() {
        Person p = accounts.create("acct.disable", "Dis Able", "long-enough", Set.of(Role.OPERATOR));
        Person disabled = accounts.setEnabled(p.id(), false, p.version(), "admin");
        assertThat(disabled.enabled()).isFalse();
        assertThat(accounts.passwordMatches("acct.disable", "long-enough")).isFalse();
        assertThat(audit.history("USER", String.valueOf(p.id()))).extracting(e -> e.action())
                .containsExactly("CREATE", "DISABLE");
    }

    @Test
    void roleChangesAreRecordedWithOldAndNewValues() {
        Person p = accounts.create("acct.roles", "Role Change", "long-enough", Set.of(Role.OPERATOR));
        accounts.changeRoles(p.id(), Set.of(Role.OPERATOR, Role.ENGINEER), p.version(), "admin");
        var last = audit.history("USER", String.valueOf(p.id())).get(1);
        assertThat(last.action()).isEqualTo("CHANGE_ROLES");
        assertThat(last.changes()).contains("\"oldValue\":\"OPERATOR\"").contains("\"newValue\":\"OPERATOR,ENGINEER\"");
    }

    @Test
    void aStaleVersionIsAConflictNotASilentOverwrite() {
        Person p = accounts.create("acct.stale", "Stale", "long-enough", Set.of(Role.OPERATOR));
        accounts.changeRoles(p.id(), Set.of(Role.AUDITOR), p.version(), "admin");
        assertThatThrownBy(() -> accounts.setEnabled(p.id(), false, p.version(), "admin"))
                .isInstanceOf(OptimisticLockingFailureException.class);
    }

    @Test
    void anAdminCannotLockThemselvesOut() {
        Person p = accounts.create("acct.self", "Self", "long-enough", Set.of(Role.ADMIN));
        assertThatThrownBy(() -> accounts.setEnabled(p.id(), false, p.version(), "acct.self"))
                .hasMessageContaining("your own account");
        assertThatThrownBy(() -> accounts.changeRoles(p.id(), Set.of(Role.AUDITOR), p.version(), "acct.self"))
                .hasMessageContaining("your own ADMIN role");
    }
}
