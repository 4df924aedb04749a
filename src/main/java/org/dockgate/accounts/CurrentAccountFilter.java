package org.dockgate.accounts;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import jakarta.servlet.http.HttpSession;
import java.io.IOException;
import java.util.HashSet;
import org.springframework.security.authentication.AnonymousAuthenticationToken;
import org.springframework.security.authentication.UsernamePasswordAuthenticationToken;
import org.springframework.security.core.Authentication;
import org.springframework.security.core.context.SecurityContext;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.security.core.userdetails.UserDetails;
import org.springframework.security.core.userdetails.UsernameNotFoundException;
import org.springframework.security.web.context.HttpSessionSecurityContextRepository;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * Re-reads the signed-in person's account on every page request. A session stores the authorities
 * granted at sign-in; without this, a person whose roles were removed or whose account was disabled
 * kept them until the session ended. A disabled or vanished account: the session is invalidated and
 * the request continues anonymous (so it is sent to sign in). Changed roles: the session's
 * authentication is replaced by one with the current roles. (HTTP Basic on the API loads the account
 * on each request anyway and refuses a disabled one.)
 */
class CurrentAccountFilter extends OncePerRequestFilter {

    private final AccountUserDetailsService accounts;
    private final HttpSessionSecurityContextRepository sessionContexts = new HttpSessionSecurityContextRepository();

    CurrentAccountFilter(AccountUserDetailsService accounts) {
        this.accounts = accounts;
    }

    @Override
    protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response, FilterChain chain)
            throws ServletException, IOException {
        Authentication auth = SecurityContextHolder.getContext().getAuthentication();
        if (auth != null && auth.isAuthenticated() && !(auth instanceof AnonymousAuthenticationToken)) {
            UserDetails current = load(auth.getName());
            if (current == null || !current.isEnabled() || !current.isAccountNonLocked()
                    || !current.isAccountNonExpired()) {
                SecurityContextHolder.clearContext();
                HttpSession session = request.getSession(false);
                if (session != null) {
                    session.invalidate();
                }
            } else if (!new HashSet<>(current.getAuthorities()).equals(new HashSet<>(auth.getAuthorities()))) {
                UsernamePasswordAuthenticationToken updated = UsernamePasswordAuthenticationToken.authenticated(
                        auth.getPrincipal(), null, current.getAuthorities());
                updated.setDetails(auth.getDetails());
                SecurityContext context = SecurityContextHolder.createEmptyContext();
                context.setAuthentication(updated);
                SecurityContextHolder.setContext(context);
                if (request.getSession(false) != null) {
                    sessionContexts.saveContext(context, request, response);
                }
            }
        }
        chain.doFilter(request, response);
    }

    private UserDetails load(String username) {
        try {
            return accounts.loadUserByUsername(username);
        } catch (UsernameNotFoundException e) {
            return null;
        }
    }
}
