package org.dockgate.core.sampling;

/**
 * Outcome of a single sampling plan for one lot (ISO 2859-1:1999 wording: "accepted" /
 * "not accepted"; ANSI/ASQ Z1.4-2008 clause 10.1.4 for the third outcome).
 */
public enum Disposition {
    /** d ≤ Ac: the lot is accepted. */
    ACCEPT,
    /** d ≥ Re: the lot is not accepted. */
    REJECT,
    /**
     * Ac &lt; d &lt; Re, possible only for the gap plans of the ANSI/ASQ Z1.4 reduced table: the lot is
     * considered acceptable, but normal inspection is reinstated from the next lot (Z1.4 clauses
     * 10.1.4 and 8.3.4 b).
     */
    ACCEPT_AND_RETURN_TO_NORMAL;

    /**
     * Whether the lot is accepted (the lot may be used), including the special reduced outcome.
     *
     * @return true for {@link #ACCEPT} and {@link #ACCEPT_AND_RETURN_TO_NORMAL}
     */
    public boolean accepted() {
        return this != REJECT;
    }
}
