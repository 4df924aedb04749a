package org.dockgate.core.sampling;

/**
 * Sample-size code letter of ISO 2859-1:1999 Table 1 and Tables 2-A/2-B/2-C. The letters I and O
 * are not used by the standard. {@code S} exists only in Table 2-B (tightened inspection), where it
 * carries a single plan (n = 3150, Ac 1, Re 2) at AQL 0.025 and is reached only by arrows.
 *
 * <p>The sample size belonging to a letter depends on the severity (Table 2-C uses smaller samples);
 * it is therefore held by the plan tables ({@link SingleSamplingPlans#sampleSize}), not here.
 */
public enum CodeLetter {
    /** Code letter A. */ A,
    /** Code letter B. */ B,
    /** Code letter C. */ C,
    /** Code letter D. */ D,
    /** Code letter E. */ E,
    /** Code letter F. */ F,
    /** Code letter G. */ G,
    /** Code letter H. */ H,
    /** Code letter J. */ J,
    /** Code letter K. */ K,
    /** Code letter L. */ L,
    /** Code letter M. */ M,
    /** Code letter N. */ N,
    /** Code letter P. */ P,
    /** Code letter Q. */ Q,
    /** Code letter R. */ R,
    /** Code letter S, tightened inspection only (Table 2-B). */ S
}
