package org.dockgate.platform;

import java.time.Instant;
import java.time.OffsetDateTime;
import org.springframework.security.authentication.AnonymousAuthenticationToken;
import org.springframework.security.core.Authentication;
import org.springframework.security.core.context.SecurityContextHolder;

/** Small shared helpers of the services: who is acting, and timestamps as both databases return them. */
public final class CurrentActor {

    private CurrentActor() {
    }

    /** The signed-in user's name, or {@code system} for work no person started (scheduled jobs, start-up). */
    public static String username() {
        Authentication auth = SecurityContextHolder.getContext().getAuthentication();
        return auth == null || auth instanceof AnonymousAuthenticationToken ? "system" : auth.getName();
    }

    /** A {@code timestamp with time zone} column read through JdbcTemplate: H2 gives OffsetDateTime, PostgreSQL Timestamp. */
    public static Instant instant(Object value) {
        if (value == null) {
            return null;
        }
        if (value instanceof OffsetDateTime o) {
            return o.toInstant();
        }
        if (value instanceof java.sql.Timestamp t) {
            return t.toInstant();
        }
        if (value instanceof Instant i) {
            return i;
        }
        throw new IllegalStateException("Unexpected timestamp value " + value);
    }
}
