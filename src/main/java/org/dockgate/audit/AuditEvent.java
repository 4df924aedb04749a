package org.dockgate.audit;

import java.util.List;
import java.util.Objects;
import java.util.Set;

/**
 * A state change or security event that the audit trail must record. Feature modules publish it with
 * Spring's {@code ApplicationEventPublisher} inside the transaction that makes the change; the audit
 * module appends it in that same transaction, so a committed change never lacks its entry and a rolled
 * back change never has one.
 *
 * @param entityType what kind of record changed, e.g. {@code USER}, {@code PROCEDURE_REVISION}
 * @param entityId   its identifier as text
 * @param action     what happened, e.g. {@code CREATE}, {@code APPROVE}, {@code CORRECT}
 * @param changes    the changed fields with old and new values (empty for a summary-only entry)
 * @param summary    one line for people, or the summary of a large record
 * @param reason     why; required for the actions in {@link #REASON_REQUIRED}
 * @param actor      who, when the event is not done by the signed-in user (logins, system jobs); else null
 */
public record AuditEvent(String entityType, String entityId, String action, List<FieldChange> changes,
                         String summary, String reason, Actor actor) {

    /** Actions that are refused without a reason: corrections, overrides, concessions, reissues, lifted blocks. */
    public static final Set<String> REASON_REQUIRED =
            Set.of("CORRECT", "OVERRIDE", "CONCESSION", "REISSUE", "LIFT_BLOCK", "JUSTIFY", "EDIT_WITH_REASON");

    public AuditEvent {
        requireText(entityType, "entity type");
        requireText(entityId, "entity id");
        requireText(action, "action");
        changes = changes == null ? List.of() : List.copyOf(changes);
        summary = summary == null ? "" : summary;
        if (REASON_REQUIRED.contains(action) && (reason == null || reason.isBlank())) {
            throw new IllegalArgumentException("A reason is required for the action " + action + ".");
        }
    }

    public static AuditEvent of(String entityType, Object entityId, String action, String summary) {
        return new AuditEvent(entityType, String.valueOf(entityId), action, List.of(), summary, null, null);
    }

    /** An event whose action needs a reason (a correction, an override, a concession, a reissue, a lifted block). */
    public static AuditEvent withReason(String entityType, Object entityId, String action, String summary,
                                        String reason) {
        return new AuditEvent(entityType, String.valueOf(entityId), action, List.of(), summary, reason, null);
    }

    public AuditEvent withChanges(List<FieldChange> fieldChanges) {
        return new AuditEvent(entityType, entityId, action, fieldChanges, summary, reason, actor);
    }

    public AuditEvent because(String why) {
        return new AuditEvent(entityType, entityId, action, changes, summary, why, actor);
    }

    public AuditEvent by(Actor who) {
        return new AuditEvent(entityType, entityId, action, changes, summary, reason, who);
    }

    private static void requireText(String value, String what) {
        if (value == null || value.isBlank()) {
            throw new IllegalArgumentException("An audit event needs its " + what + ".");
        }
    }

    /** One changed field. Values are text as shown to people; null means "none". */
    public record FieldChange(String field, String oldValue, String newValue) {
        public FieldChange {
            Objects.requireNonNull(field, "field");
        }

        public static FieldChange of(String field, Object oldValue, Object newValue) {
            return new FieldChange(field, oldValue == null ? null : String.valueOf(oldValue),
                    newValue == null ? null : String.valueOf(newValue));
        }
    }

    /** Who acted, when it is not (yet) the signed-in user. */
    public record Actor(String userId, String displayName) {
        public static final Actor SYSTEM = new Actor("system", "Dockgate");
    }
}
