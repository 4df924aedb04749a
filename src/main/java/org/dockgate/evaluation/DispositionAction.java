package org.dockgate.evaluation;

/** What happens to a rejected lot. */
public enum DispositionAction {
    RETURN_TO_SUPPLIER,
    SCREEN_100_PERCENT,
    /** Use as is under a concession: needs a SUPERVISOR's approval with a reason. */
    USE_AS_IS_CONCESSION,
    SCRAP
}
