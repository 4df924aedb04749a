package org.dockgate.audit;

/** Display names for user ids, supplied by the accounts module (so the audit module needs no account types). */
public interface ActorDirectory {

    /** The person's display name, or the id itself when unknown. */
    String displayName(String userId);
}
