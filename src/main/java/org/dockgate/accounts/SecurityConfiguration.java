package org.dockgate.accounts;

import org.dockgate.platform.AccessRules;
import org.dockgate.platform.FeatureAccess;
import org.dockgate.platform.Role;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import org.dockgate.platform.FeatureAccess.AccessRule;
import org.dockgate.web.ProblemWriter;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.core.annotation.Order;
import org.springframework.security.config.annotation.method.configuration.EnableMethodSecurity;
import org.springframework.security.config.annotation.web.builders.HttpSecurity;
import org.springframework.security.config.annotation.web.configurers.AuthorizeHttpRequestsConfigurer;
import org.springframework.security.config.http.SessionCreationPolicy;
import org.springframework.security.crypto.factory.PasswordEncoderFactories;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.http.HttpMethod;
import org.springframework.security.web.SecurityFilterChain;
import org.springframework.security.web.authentication.AnonymousAuthenticationFilter;

/**
 * Two filter chains: HTTP Basic and no session for {@code /api/**} (integrating tools), form login with
 * CSRF protection for pages. Both take their URL rules from the modules' {@link FeatureAccess} beans.
 */
@Configuration
@EnableMethodSecurity
class SecurityConfiguration {

    /** Reachable without signing in: the login page, static assets, public certificate verification, API docs. */
    static final String[] PUBLIC = {"/login", "/css/**", "/js/**", "/images/**", "/favicon.ico", "/error",
        "/verify/**", "/v3/api-docs/**", "/v3/api-docs.yaml", "/swagger-ui.html", "/swagger-ui/**"};

    @Bean
    PasswordEncoder passwordEncoder() {
        return PasswordEncoderFactories.createDelegatingPasswordEncoder();
    }

    @Bean
    @Order(1)
    SecurityFilterChain apiChain(HttpSecurity http, AccessRules rules, ProblemWriter problems) throws Exception {
        http.securityMatcher("/api/**")
                .authorizeHttpRequests(auth -> {
                    apply(auth, rules);
                    // Deny by default: a route without a rule in some module's FeatureAccess is refused.
                    auth.anyRequest().denyAll();
                })
                .httpBasic(basic -> basic.realmName("Dockgate")
                        .authenticationEntryPoint((request, response, e) -> unauthorized(response, problems)))
                // API clients authenticate every request with HTTP Basic and carry no session cookie,
                // so there is no ambient credential for a cross-site request to abuse.
                .csrf(csrf -> csrf.disable())
                .sessionManagement(s -> s.sessionCreationPolicy(SessionCreationPolicy.STATELESS))
                .exceptionHandling(e -> e
                        .authenticationEntryPoint((request, response, ex) -> unauthorized(response, problems))
                        .accessDeniedHandler((request, response, ex) -> problems.write(response, 403, "Forbidden",
                                rules.ruleFor(path(request), request.getMethod())
                                        .map(r -> "This needs the role " + AccessRules.describe(r.roles()) + ".")
                                        .orElse("Your roles do not allow this request."))));
        return http.build();
    }

    @Bean
    @Order(2)
    SecurityFilterChain webChain(HttpSecurity http, AccessRules rules, AccountUserDetailsService userDetails) throws Exception {
        CurrentAccountFilter accountCheck = new CurrentAccountFilter(userDetails);
        http.authorizeHttpRequests(auth -> {
                    auth.requestMatchers(PUBLIC).permitAll();
                    apply(auth, rules);
                    auth.anyRequest().denyAll();
                })
                // A session keeps the roles it signed in with; this re-reads the account on every request
                // so a disabled account is signed out and changed roles apply at once.
                .addFilterBefore(accountCheck, AnonymousAuthenticationFilter.class)
                .formLogin(form -> form.loginPage("/login").failureUrl("/login?error").defaultSuccessUrl("/", true)
                        .permitAll())
                .logout(logout -> logout.logoutUrl("/logout").logoutSuccessUrl("/login?logout"))
                .exceptionHandling(e -> e.accessDeniedHandler(
                        (request, response, ex) -> response.sendError(HttpServletResponse.SC_FORBIDDEN)));
        return http.build();
    }

    private static void apply(AuthorizeHttpRequestsConfigurer<HttpSecurity>.AuthorizationManagerRequestMatcherRegistry auth,
                              AccessRules rules) {
        for (AccessRule rule : rules.rules()) {
            String[] roles = rule.roles().stream().map(Role::name).toArray(String[]::new);
            if (rule.method() == null) {
                auth.requestMatchers(rule.pattern()).hasAnyRole(roles);
            } else {
                auth.requestMatchers(rule.method(), rule.pattern()).hasAnyRole(roles);
                if (rule.method() == HttpMethod.GET) {
                    // MVC answers HEAD with the GET handler: HEAD must be exactly as allowed as GET.
                    auth.requestMatchers(HttpMethod.HEAD, rule.pattern()).hasAnyRole(roles);
                }
            }
        }
    }

    private static String path(jakarta.servlet.http.HttpServletRequest request) {
        return request.getRequestURI().substring(request.getContextPath().length());
    }

    private static void unauthorized(HttpServletResponse response, ProblemWriter problems) throws IOException {
        response.setHeader("WWW-Authenticate", "Basic realm=\"Dockgate\"");
        problems.write(response, 401, "Unauthorized",
                "Sign in with HTTP Basic authentication (user name and password of a Dockgate account).");
    }
}
