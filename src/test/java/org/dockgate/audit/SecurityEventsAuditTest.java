package org.dockgate.audit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestBuilders.formLogin;

import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.test.web.servlet.MockMvc;

/** Sign-ins, refused sign-ins and sign-outs each leave an entry with who and through what. */
@SpringBootTest
@AutoConfigureMockMvc
class SecurityEventsAuditTest {

    @Autowired MockMvc mvc;
    @Autowired AuditReader reader;

    @Test
    void loginsFailuresAndLogoutsAreRecorded() throws Exception {
        var session = (org.springframework.mock.web.MockHttpSession) mvc
                .perform(formLogin("/login").user("supervisor").password("supervisor-demo"))
                .andReturn().getRequest().getSession();
        mvc.perform(formLogin("/login").user("supervisor").password("not-the-password"));
        mvc.perform(org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post("/logout")
                .session(session).with(org.springframework.security.test.web.servlet.request
                        .SecurityMockMvcRequestPostProcessors.csrf()));

        var entries = reader.history("SESSION", "supervisor");
        assertThat(entries).extracting(AuditEntry::action).containsSubsequence("LOGIN", "LOGIN_FAILED", "LOGOUT");
        AuditEntry login = entries.stream().filter(e -> e.action().equals("LOGIN")).reduce((a, b) -> b).orElseThrow();
        assertThat(login.actorName()).isEqualTo("Hanna Lindqvist");
        assertThat(login.channel()).isEqualTo("PAGE");
        AuditEntry failed = entries.stream().filter(e -> e.action().equals("LOGIN_FAILED")).reduce((a, b) -> b)
                .orElseThrow();
        assertThat(failed.summary()).contains("BadCredentials");
    }
}
