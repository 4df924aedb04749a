package org.dockgate.web;

import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.not;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestBuilders.formLogin;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.csrf;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.httpBasic;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.redirectedUrl;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.http.MediaType;
import org.springframework.test.web.servlet.MockMvc;

/** Sign-in, roles, CSRF, and the error pages and problem documents, through the real filter chains. */
@SpringBootTest
@AutoConfigureMockMvc
class SecurityAndErrorsTest {

    @Autowired MockMvc mvc;

    @ParameterizedTest
    @CsvSource({"operator,operator-demo", "engineer,engineer-demo", "supervisor,supervisor-demo",
        "auditor,auditor-demo", "admin,admin-demo"})
    void eachDemoAccountSignsIn(String username, String password) throws Exception {
        mvc.perform(formLogin("/login").user(username).password(password)).andExpect(redirectedUrl("/"));
    }

    @Test
    void aWrongPasswordAndAnUnknownUserGetTheSameAnswer() throws Exception {
        mvc.perform(formLogin("/login").user("engineer").password("wrong")).andExpect(redirectedUrl("/login?error"));
        mvc.perform(formLogin("/login").user("nobody").password("wrong")).andExpect(redirectedUrl("/login?error"));
        mvc.perform(get("/login").param("error", ""))
                .andExpect(content().string(containsString("The user name or password is incorrect")));
    }

    @Test
    void pagesNeedSigningIn() throws Exception {
        mvc.perform(get("/")).andExpect(status().is3xxRedirection())
                .andExpect(redirectedUrl("/login"));
    }

    @Test
    void navigationShowsEachRoleOnlyWhatItMayUse() throws Exception {
        mvc.perform(get("/").with(user("admin").roles("ADMIN")))
                .andExpect(content().string(containsString("href=\"/admin/users\"")));
        mvc.perform(get("/").with(user("operator").roles("OPERATOR")))
                .andExpect(content().string(not(containsString("href=\"/admin/users\""))))
                .andExpect(content().string(not(containsString("href=\"/audit\""))));
        mvc.perform(get("/").with(user("auditor").roles("AUDITOR")))
                .andExpect(content().string(containsString("href=\"/audit\"")));
    }

    @Test
    void formsNeedTheirCsrfToken() throws Exception {
        mvc.perform(post("/admin/users").with(user("admin").roles("ADMIN"))
                        .param("username", "nocsrf").param("displayName", "No Token").param("password", "long-enough")
                        .param("roles", "OPERATOR"))
                .andExpect(status().isForbidden());
        mvc.perform(post("/admin/users").with(user("admin").roles("ADMIN")).with(csrf())
                        .param("username", "withcsrf").param("displayName", "With Token")
                        .param("password", "long-enough").param("roles", "OPERATOR"))
                .andExpect(redirectedUrl("/admin/users"));
    }

    @Test
    void theApiDocumentationIsServed() throws Exception {
        mvc.perform(get("/v3/api-docs")).andExpect(status().isOk())
                .andExpect(content().string(containsString("/api/v1/audit/verify")));
    }
}
