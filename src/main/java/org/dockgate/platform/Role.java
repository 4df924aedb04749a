package org.dockgate.platform;

/** What a person may do in Dockgate. A person may hold several roles. */
public enum Role {
    /** Records measurements at the receiving bench. */
    OPERATOR,
    /** Maintains sensor models and procedures, dispositions lots. */
    ENGINEER,
    /** Oversight and approvals: concessions, lifted blocks, second approvals. */
    SUPERVISOR,
    /** Reads everything, including the audit trail; changes nothing. */
    AUDITOR,
    /** Users, reference instruments, signing keys. */
    ADMIN;

    /** The Spring Security authority name, e.g. {@code ROLE_ENGINEER}. */
    public String authority() {
        return "ROLE_" + name();
    }
}
