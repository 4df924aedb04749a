package org.dockgate.audit;

import org.dockgate.audit.AuditEvent.Actor;
import org.springframework.context.ApplicationEventPublisher;
import org.springframework.context.event.EventListener;
import org.springframework.security.authentication.event.AbstractAuthenticationFailureEvent;
import org.springframework.security.authentication.event.InteractiveAuthenticationSuccessEvent;
import org.springframework.security.authentication.event.LogoutSuccessEvent;
import org.springframework.stereotype.Component;

/**
 * Records sign-ins, failed sign-ins and sign-outs. A successful HTTP Basic request to the API is not a
 * sign-in (every request authenticates) and is not recorded; a failed one is.
 */
@Component
class SecurityEventRecorder {

    private final ApplicationEventPublisher events;
    private final ActorDirectory directory;

    SecurityEventRecorder(ApplicationEventPublisher events, ActorDirectory directory) {
        this.events = events;
        this.directory = directory;
    }

    @EventListener
    void onLogin(InteractiveAuthenticationSuccessEvent event) {
        String user = event.getAuthentication().getName();
        events.publishEvent(AuditEvent.of("SESSION", user, "LOGIN", "Signed in")
                .by(new Actor(user, directory.displayName(user))));
    }

    @EventListener
    void onFailure(AbstractAuthenticationFailureEvent event) {
        String attempted = String.valueOf(event.getAuthentication().getName());
        String user = attempted.length() > 64 ? attempted.substring(0, 64) : attempted;
        // The reason stays in the trail for auditors; the person at the login page is never told which field was wrong.
        events.publishEvent(AuditEvent.of("SESSION", user.isBlank() ? "(blank)" : user, "LOGIN_FAILED",
                        "Sign-in refused: " + event.getException().getClass().getSimpleName())
                .by(new Actor(user.isBlank() ? "(blank)" : user, "unauthenticated")));
    }

    @EventListener
    void onLogout(LogoutSuccessEvent event) {
        String user = event.getAuthentication().getName();
        events.publishEvent(AuditEvent.of("SESSION", user, "LOGOUT", "Signed out")
                .by(new Actor(user, directory.displayName(user))));
    }
}
