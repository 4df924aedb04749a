package org.dockgate.core.sampling;

/**
 * Which published version of the single-sampling scheme applies. The normal tables are identical;
 * the schemes differ in the reduced table, in one cell of the tightened table and in the
 * normal-to-reduced switching rule.
 */
public enum Scheme {
    /**
     * ISO 2859-1:1999, Dockgate's default: gap-free reduced Table 2-C (every plan has Re = Ac + 1, per
     * the Foreword of the 1999 edition) and the switching score of clause 9.3.3.2.
     */
    ISO_2859_1_1999,
    /**
     * ANSI/ASQ Z1.4-2008 (the reaffirmed Z1.4-2003; same tables as MIL-STD-105E), chosen explicitly when
     * a customer contract asks for it: reduced Table II-C with gap plans (e.g. Ac 1, Re 4) and the
     * "accepted, but normal inspection is reinstated" outcome of clause 10.1.4 when Ac &lt; d &lt; Re;
     * normal-to-reduced after 10 accepted lots (clause 8.3.3).
     */
    ANSI_ASQ_Z1_4_2008
}
